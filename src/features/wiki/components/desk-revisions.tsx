import { useEffect, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { FIELD_LABELS } from '@shared/schemas/pages';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';
import { Badge } from '@/components/ui/badge';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useDeskRevisions } from '../api/review-revision';
import { useRevision } from '../api/get-revision';
import { SECTION_TYPES, type DeskRevision } from '../types';
import { contentOfRevision } from './page-editor';
import { ReviewRevisionForm } from './review-revision-form';
import { RevisionDiff } from './revision-diff';

function OpenEdit({ item, onDecided }: { item: DeskRevision; onDecided: () => void }) {
  const page = item.page!;
  const proposal = useRevision(page.section, page.slug, item.id);
  const base = useRevision(page.section, page.slug, item.baseRevisionId ?? 0);
  const type = SECTION_TYPES[page.section];
  // Opened, the edit's heading takes the focus, which brings its diff into view above the rest of the queue.
  const headingRef = useRef<HTMLHeadingElement>(null);
  useEffect(() => headingRef.current?.focus(), []);
  return (
    <div className="flex flex-col gap-4">
      <h3 ref={headingRef} tabIndex={-1} className="text-xl font-semibold">
        Edit of <Link to={paths.wiki.page(page.section, page.slug)}>{page.name}</Link>: “{item.summary}”
      </h3>
      <p className="text-muted">
        Revision {item.number} of this page, by {item.author?.handle ?? 'unknown'}, {formatDate(item.createdAt)}, from revision {item.baseRevisionNumber}.
      </p>
      {item.stale ? (
        <p className="rounded-md border border-caution/40 bg-caution-soft px-4 py-2">
          The page has changed since (revision {page.currentRevisionNumber} is current). Approving merges this edit with the later ones; if both changed the same field,
          approval is refused and nothing is saved.
        </p>
      ) : null}
      {proposal.isPending || base.isPending ? <Loading label="Loading the changes…" /> : null}
      {proposal.isError ? <ErrorState error={proposal.error} /> : null}
      {proposal.data && base.data ? (
        <RevisionDiff
          type={type}
          before={contentOfRevision(type, base.data)}
          after={contentOfRevision(type, proposal.data)}
          beforeLabel={`Revision ${base.data.number} (before)`}
          afterLabel={`Revision ${proposal.data.number} (proposed)`}
        />
      ) : null}
      {item.can.review ? <ReviewRevisionForm key={item.id} id={item.id} number={item.number} onDecided={onDecided} /> : <p className="text-muted">You cannot review your own edit.</p>}
    </div>
  );
}

/**
 * The review desk's page edits: proposed revisions of steel, abrasive and method pages, oldest
 * first, each opened with its side-by-side diff and the decision form.
 */
export function DeskRevisions() {
  const desk = useDeskRevisions();
  const [openId, setOpenId] = useState<number | null>(null);
  if (desk.isPending) return <Loading label="Loading page edits…" />;
  if (desk.isError) return <ErrorState error={desk.error} onRetry={() => desk.refetch()} />;
  const items = desk.data;
  const open = items.find((i) => i.id === openId) ?? null;
  return (
    <section aria-labelledby="desk-edits" className="grid gap-6 lg:grid-cols-[20rem_1fr]">
      <div>
        <h2 id="desk-edits" className="mb-2 text-xl font-semibold">
          Page edits awaiting review <span className="font-sans text-base font-normal text-muted">({items.length})</span>
        </h2>
        {items.length === 0 ? (
          <Empty title="No page edits waiting">Members’ edits of steel, abrasive and method pages appear here.</Empty>
        ) : (
          <ol className="divide-y divide-rule rounded-md border border-rule bg-panel">
            {items.map((i) => (
              <li key={i.id}>
                <button
                  type="button"
                  aria-current={i.id === openId ? 'true' : undefined}
                  onClick={() => setOpenId(i.id)}
                  className={`block w-full px-4 py-3 text-left ${i.id === openId ? 'bg-accent-soft' : 'hover:bg-paper'}`}
                >
                  <span className="block font-semibold text-ink">
                    {i.page?.name ?? 'A page'}: {i.summary}
                  </span>
                  <span className="block text-sm text-muted">
                    revision {i.number} · {i.author?.handle ?? 'unknown'} · {formatDate(i.createdAt)} · {i.changed.map((c) => FIELD_LABELS[c] ?? c).join(', ') || 'no changes'}
                  </span>
                  {i.stale ? <Badge tone="caution">page changed since</Badge> : null}
                </button>
              </li>
            ))}
          </ol>
        )}
      </div>
      {/* On a phone the open edit comes first, so its diff opens at the top rather than below the list. */}
      <div className={`min-w-0 ${open ? 'order-first lg:order-none' : ''}`}>
        {open && open.page ? (
          <OpenEdit key={open.id} item={open} onDecided={() => setOpenId(null)} />
        ) : items.length ? (
          <p className="rounded-md border border-dashed border-rule px-5 py-8 text-muted">Open a page edit to see its changes side by side and decide.</p>
        ) : null}
      </div>
    </section>
  );
}
