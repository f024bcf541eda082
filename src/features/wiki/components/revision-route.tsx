import { Link, useParams } from 'react-router-dom';
import { fieldLines } from '@shared/page-diff';
import { EDITABLE_FIELDS, FIELD_LABELS, normalizeFields } from '@shared/schemas/pages';
import { paths } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import { Badge } from '@/components/ui/badge';
import { Facts } from '@/components/ui/facts';
import { PageTitle } from '@/components/ui/page-title';
import { ErrorState, Loading } from '@/components/ui/states';
import { useRevision } from '../api/get-revision';
import { SECTION_TYPES, type WikiSection } from '../types';
import { ReviewRevisionForm } from './review-revision-form';
import { revisionOrigin, REVISION_STATUS } from './status-words';
import { ServerHtml } from '@/components/ui/server-html';
import { wikiHtmlClasses } from './wiki-html';
import { NotAWikiPage, useWikiParams, WikiCrumbs } from './wiki-route-frame';

function RevisionLoaded({ section, slug, id }: { section: WikiSection; slug: string; id: number }) {
  const revision = useRevision(section, slug, id);
  if (revision.isPending) return <Loading />;
  if (revision.isError) return <ErrorState error={revision.error} onRetry={() => revision.refetch()} />;
  const r = revision.data;
  const type = SECTION_TYPES[section];
  const fields = normalizeFields(type, r.fields);
  const origin = revisionOrigin(r);
  return (
    <>
      <WikiCrumbs section={section} slug={slug} name={r.page.name} here={`Revision ${r.number}`} />
      <PageTitle title={`${r.page.name}, revision ${r.number}`} lead={`Revision ${r.number} of this page: “${r.summary}”, saved ${formatDateTime(r.createdAt)} by ${r.author?.handle ?? 'unknown'}.`}>
        {r.page.name}, revision {r.number}
      </PageTitle>
      <div className="flex flex-wrap items-center gap-3">
        <Badge tone={REVISION_STATUS[r.status].tone}>{REVISION_STATUS[r.status].text}</Badge>
        {r.current ? <Badge tone="accent">current</Badge> : null}
        {origin ? <span className="text-sm text-muted">This revision {origin}.</span> : null}
        <Link to={paths.wiki.history.getHref(section, slug)}>History</Link>
        {r.baseRevisionId ? <Link to={paths.wiki.compare.getHref(section, slug, r.baseRevisionId, r.id)}>Changes against revision {r.baseRevisionNumber}</Link> : null}
      </div>
      {r.review ? (
        <p className="text-sm">
          Reviewed by {r.review.by?.handle ?? 'a moderator'} on {formatDateTime(r.review.at)}
          {r.review.note ? `: “${r.review.note}”` : '.'}
        </p>
      ) : null}
      {r.status === 'proposed' && r.can.review ? (
        <section aria-labelledby="decide">
          <h2 id="decide" className="mb-2 text-xl font-semibold">
            Decision
          </h2>
          <ReviewRevisionForm id={r.id} number={r.number} />
        </section>
      ) : null}
      <Facts items={EDITABLE_FIELDS[type].map((f) => ({ term: FIELD_LABELS[f] ?? f, value: <span className="whitespace-pre-line">{fieldLines(f, fields[f]).join('\n') || '—'}</span> }))} />
      <section aria-labelledby="revision-text">
        <h2 id="revision-text" className="mb-2 text-xl font-semibold">
          Text
        </h2>
        <ServerHtml html={r.bodyHtml} className={`${wikiHtmlClasses} max-w-3xl`} />
      </section>
    </>
  );
}

/** /:section/:slug/revisions/:id: one revision as it was saved, and the decision on a proposal. */
export default function RevisionRoute() {
  const params = useWikiParams();
  if (!params) return <NotAWikiPage />;
  return (
    <div className="flex flex-col gap-6">
      <RevisionWithId {...params} />
    </div>
  );
}

function RevisionWithId({ section, slug }: { section: WikiSection; slug: string }) {
  const id = Number(useParams().id ?? '');
  return <RevisionLoaded section={section} slug={slug} id={id} />;
}
