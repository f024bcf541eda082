import { useId, useState } from 'react';
import { Link, useLocation, useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useUser } from '@/lib/auth';
import { Badge } from '@/components/ui/badge';
import { Button, buttonClasses } from '@/components/ui/button';
import { Field, Select, Textarea } from '@/components/ui/field';
import { describeError } from '@/components/ui/states';
import { useMergePages, useProtectPage } from '../api/page-actions';
import { usePageList } from '../api/get-page-list';
import { SECTION_LABELS, type PageActions, type WikiSection } from '../types';

interface ToolbarPage {
  slug: string;
  name: string;
  revisionNumber: number;
  isProtected: boolean;
  proposals: number;
  can: PageActions;
}

function MergeForm({ section, page, onDone }: { section: WikiSection; page: ToolbarPage; onDone: () => void }) {
  const id = useId();
  const list = usePageList(section);
  const merge = useMergePages(section, page.slug);
  const navigate = useNavigate();
  const [into, setInto] = useState('');
  const [note, setNote] = useState('');
  const others = (list.data?.items ?? []).filter((p) => p.slug !== page.slug);
  return (
    <form
      aria-label={`Merge ${page.name} into another page`}
      className="flex flex-col gap-3 rounded-md border border-caution/40 bg-caution-soft/50 p-4"
      onSubmit={(e) => {
        e.preventDefault();
        if (!into) return;
        merge.mutate({ into, ...(note.trim() ? { note: note.trim() } : {}) }, { onSuccess: (out) => navigate(paths.wiki.page(section, out.page.slug)) });
      }}
    >
      <p>
        Merging treats this page as a duplicate: its results move to the page you choose, and its address then leads there. Its history stays readable. This
        cannot be undone here.
      </p>
      <Field id={`${id}-into`} label={`The ${SECTION_LABELS[section].one} page that stays`}>
        <Select id={`${id}-into`} value={into} onChange={(e) => setInto(e.target.value)} required>
          <option value="">Choose…</option>
          {others.map((p) => (
            <option key={p.slug} value={p.slug}>
              {p.name}
            </option>
          ))}
        </Select>
      </Field>
      <Field id={`${id}-note`} label="Why (kept in the history)" aside="optional">
        <Textarea id={`${id}-note`} value={note} onChange={(e) => setNote(e.target.value)} maxLength={2000} />
      </Field>
      {merge.error ? (
        <p role="alert" className="text-danger">
          {describeError(merge.error)}
        </p>
      ) : null}
      <div className="flex gap-2">
        <Button type="submit" variant="danger" busy={merge.isPending} disabled={!into}>
          Merge into the chosen page
        </Button>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/**
 * The wiki's controls above a page: edit (or propose an edit), history, the protected state and
 * the edits awaiting review; for moderators, protect or release, and merge a duplicate.
 */
export function WikiToolbar({ section, page }: { section: WikiSection; page: ToolbarPage }) {
  const user = useUser();
  const location = useLocation();
  const protect = useProtectPage(section, page.slug);
  const [merging, setMerging] = useState(false);
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        {page.can.edit ? (
          <Link to={paths.wiki.edit.getHref(section, page.slug)} className={buttonClasses('primary', 'sm')}>
            {page.can.publish ? 'Edit this page' : 'Propose an edit'}
          </Link>
        ) : !user ? (
          <Link to={paths.signIn.getHref(`${location.pathname}`)} className={buttonClasses('secondary', 'sm')}>
            Sign in to edit
          </Link>
        ) : null}
        <Link to={paths.wiki.history.getHref(section, page.slug)} className={buttonClasses('secondary', 'sm')}>
          History
        </Link>
        {page.isProtected ? <Badge tone="caution">Protected: moderators edit</Badge> : null}
        {page.proposals > 0 ? (
          <Badge tone="neutral">
            {page.proposals} edit{page.proposals === 1 ? '' : 's'} awaiting review
          </Badge>
        ) : null}
        <span className="text-sm text-muted">Revision {page.revisionNumber}</span>
        {page.can.protect ? (
          <Button variant="quiet" size="sm" busy={protect.isPending} onClick={() => protect.mutate({ protected: !page.isProtected })}>
            {page.isProtected ? 'Release protection' : 'Protect this page'}
          </Button>
        ) : null}
        {page.can.merge && !merging ? (
          <Button variant="quiet" size="sm" onClick={() => setMerging(true)}>
            Merge as duplicate…
          </Button>
        ) : null}
      </div>
      {protect.error ? (
        <p role="alert" className="text-danger">
          {describeError(protect.error)}
        </p>
      ) : null}
      {merging ? <MergeForm section={section} page={page} onDone={() => setMerging(false)} /> : null}
    </div>
  );
}
