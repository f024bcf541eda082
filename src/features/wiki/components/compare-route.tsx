import { Link, useSearchParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import { PageTitle } from '@/components/ui/page-title';
import { ErrorState, Loading } from '@/components/ui/states';
import { useRevision } from '../api/get-revision';
import { SECTION_TYPES, type Revision, type WikiSection } from '../types';
import { contentOfRevision } from './page-editor';
import { RevisionDiff } from './revision-diff';
import { NotAWikiPage, useWikiParams, WikiCrumbs } from './wiki-route-frame';

const labelOf = (r: Revision) => `Revision ${r.number}, ${formatDateTime(r.createdAt)}, ${r.author?.handle ?? 'unknown'}`;

function CompareLoaded({ section, slug, from, to }: { section: WikiSection; slug: string; from: number; to: number }) {
  const a = useRevision(section, slug, from);
  const b = useRevision(section, slug, to);
  if (a.isPending || b.isPending) return <Loading label="Loading both revisions…" />;
  if (a.isError || b.isError) return <ErrorState error={a.error ?? b.error} onRetry={() => (a.refetch(), b.refetch())} />;
  const type = SECTION_TYPES[section];
  return (
    <>
      <WikiCrumbs section={section} slug={slug} name={b.data.page.name} here={`Revisions ${a.data.number} and ${b.data.number}`} />
      <PageTitle title={`${b.data.page.name}: revisions ${a.data.number} and ${b.data.number}`} lead={<>“{a.data.summary}” against “{b.data.summary}”.</>}>
        {b.data.page.name}: revision {a.data.number} against {b.data.number}
      </PageTitle>
      <p>
        <Link to={paths.wiki.history.getHref(section, slug)}>Back to the history</Link>
      </p>
      <RevisionDiff type={type} before={contentOfRevision(type, a.data)} after={contentOfRevision(type, b.data)} beforeLabel={labelOf(a.data)} afterLabel={labelOf(b.data)} />
    </>
  );
}

/** /:section/:slug/history/compare?from=&to=: two revisions side by side, fields and text. */
export default function CompareRoute() {
  const params = useWikiParams();
  const [search] = useSearchParams();
  const from = Number(search.get('from'));
  const to = Number(search.get('to'));
  if (!params) return <NotAWikiPage />;
  if (!Number.isInteger(from) || !Number.isInteger(to) || from <= 0 || to <= 0) {
    return <ErrorState title="Choose two revisions" error={new Error('The address needs two revision numbers, from and to; pick them in the history.')} />;
  }
  return (
    <div className="flex flex-col gap-6">
      <CompareLoaded {...params} from={from} to={to} />
    </div>
  );
}
