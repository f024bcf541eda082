import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { cardBodyClass, cardCellClass, cardRowClass, cardTableClass } from '@/components/ui/table-frame';
import { PageTitle } from '@/components/ui/page-title';
import { describeError, ErrorState, Loading } from '@/components/ui/states';
import { useHistory } from '../api/get-history';
import { useRevertPage } from '../api/page-actions';
import { useWikiPage } from '../api/get-wiki-page';
import type { RevisionSummary, WikiSection } from '../types';
import { describeEvent, revisionOrigin, REVISION_STATUS } from './status-words';
import { NotAWikiPage, useWikiParams, WikiCrumbs } from './wiki-route-frame';

function RevertButton({ section, slug, revision }: { section: WikiSection; slug: string; revision: RevisionSummary }) {
  const revert = useRevertPage(section, slug);
  const [asked, setAsked] = useState(false);
  if (!asked) {
    return (
      <Button variant="secondary" size="sm" onClick={() => setAsked(true)}>
        Revert to this
      </Button>
    );
  }
  return (
    <span className="flex flex-wrap items-center gap-2">
      <span className="text-sm">Make revision {revision.number} current again, as a new revision?</span>
      <Button size="sm" busy={revert.isPending} onClick={() => revert.mutate({ toRevision: revision.id }, { onSuccess: () => setAsked(false) })}>
        Yes, revert
      </Button>
      <Button variant="quiet" size="sm" onClick={() => setAsked(false)}>
        Cancel
      </Button>
      {revert.error ? (
        <span role="alert" className="text-sm text-danger">
          {describeError(revert.error)}
        </span>
      ) : null}
    </span>
  );
}

// Below the md breakpoint each revision is drawn as a card, every cell labelled from data-label.
const CARD = cardRowClass;
const CELL = `border-b border-rule/60 px-3 py-2 ${cardCellClass}`;

function HistoryLoaded({ section, slug }: { section: WikiSection; slug: string }) {
  const history = useHistory(section, slug);
  const page = useWikiPage(section, slug);
  const navigate = useNavigate();
  const [from, setFrom] = useState<number | null>(null);
  const [to, setTo] = useState<number | null>(null);
  if (history.isPending) return <Loading label="Loading the history…" />;
  if (history.isError) return <ErrorState error={history.error} onRetry={() => history.refetch()} />;
  const { items, events } = history.data;
  const name = history.data.page.name;
  const mayRevert = page.data?.can?.revert ?? false;
  // Defaults: the current revision against the one before it.
  const chosenTo = to ?? items[0]?.id ?? null;
  const chosenFrom = from ?? items.find((r) => r.id !== chosenTo && r.status === 'live')?.id ?? null;

  return (
    <>
      <WikiCrumbs section={section} slug={slug} name={name} here="History" />
      <PageTitle title={`History of ${name}`} lead="Every saved revision of this page, numbered from 1 and listed newest first. Nothing is overwritten or deleted: pick any two to compare them side by side.">
        History of {name}
      </PageTitle>
      {history.data.page.mergedInto ? (
        <p className="rounded-md border border-caution/40 bg-caution-soft px-4 py-2">
          This page was merged into <Link to={paths.wiki.page(section, history.data.page.mergedInto)}>{history.data.page.mergedInto}</Link>; its history stays here.
        </p>
      ) : null}
      <form
        aria-label="Compare two revisions"
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (chosenFrom && chosenTo) navigate(paths.wiki.compare.getHref(section, slug, Math.min(chosenFrom, chosenTo), Math.max(chosenFrom, chosenTo)));
        }}
      >
        <div className="rounded-md border border-rule bg-panel md:overflow-x-auto">
          <table className={`${cardTableClass} text-[0.95rem] md:min-w-[44rem]`}>
            <caption className="sr-only">Revisions of {name}</caption>
            <thead className="max-md:sr-only">
              <tr className="text-left text-sm text-muted">
                <th scope="col" className="border-b border-rule px-3 py-2">From</th>
                <th scope="col" className="border-b border-rule px-3 py-2">To</th>
                <th scope="col" className="border-b border-rule px-3 py-2">Revision</th>
                <th scope="col" className="border-b border-rule px-3 py-2">Saved</th>
                <th scope="col" className="border-b border-rule px-3 py-2">By</th>
                <th scope="col" className="border-b border-rule px-3 py-2">Summary</th>
                <th scope="col" className="border-b border-rule px-3 py-2">State</th>
                {mayRevert ? <th scope="col" className="border-b border-rule px-3 py-2"><span className="sr-only">Revert</span></th> : null}
              </tr>
            </thead>
            <tbody className={cardBodyClass}>
              {items.map((r) => {
                const origin = revisionOrigin(r);
                return (
                  <tr key={r.id} className={`${r.current ? 'bg-accent-soft/40' : ''} ${CARD}`}>
                    <td data-label="From" className={CELL}>
                      <input type="radio" name="from" aria-label={`Compare from revision ${r.number}`} checked={chosenFrom === r.id} onChange={() => setFrom(r.id)} />
                    </td>
                    <td data-label="To" className={CELL}>
                      <input type="radio" name="to" aria-label={`Compare to revision ${r.number}`} checked={chosenTo === r.id} onChange={() => setTo(r.id)} />
                    </td>
                    <td className={`${CELL} whitespace-nowrap max-md:col-span-2 max-md:-order-1 max-md:before:hidden`}>
                      <Link to={paths.wiki.revision.getHref(section, slug, r.id)}>Revision {r.number}</Link>
                      {r.current ? <span className="ml-2"><Badge tone="accent">current</Badge></span> : null}
                    </td>
                    <td data-label="Saved" className={`${CELL} whitespace-nowrap`}>{formatDateTime(r.createdAt)}</td>
                    <td data-label="By" className={`${CELL} md:whitespace-nowrap`}>{r.author?.handle ?? '—'}</td>
                    <td data-label="Summary" className={`${CELL} max-md:col-span-2`}>
                      {r.summary}
                      {origin ? <span className="block text-sm text-muted">{origin}</span> : null}
                      {r.review?.note ? <span className="block text-sm text-muted">Review note: {r.review.note}</span> : null}
                    </td>
                    <td data-label="State" className={CELL}>
                      <Badge tone={REVISION_STATUS[r.status].tone}>{REVISION_STATUS[r.status].text}</Badge>
                    </td>
                    {mayRevert ? (
                      <td className={`${CELL} max-md:col-span-2 max-md:before:hidden`}>
                        {r.status === 'live' && !r.current ? <RevertButton section={section} slug={slug} revision={r} /> : null}
                      </td>
                    ) : null}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
        <div>
          <Button type="submit" disabled={!chosenFrom || !chosenTo || chosenFrom === chosenTo}>
            Compare the selected revisions
          </Button>
        </div>
      </form>
      {events.length ? (
        <section aria-labelledby="page-events">
          <h2 id="page-events" className="mb-2 text-xl font-semibold">
            Moderation
          </h2>
          <ul className="flex flex-col gap-1">
            {events.map((e) => (
              <li key={e.id}>
                {formatDateTime(e.at)}: {e.by?.handle ?? 'a moderator'} {describeEvent(e)}
                {e.note ? <span className="text-muted"> — “{e.note}”</span> : null}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </>
  );
}

/** /:section/:slug/history: every revision of a page, a way to compare two, and revert (moderators). */
export default function HistoryRoute() {
  const params = useWikiParams();
  if (!params) return <NotAWikiPage />;
  return (
    <div className="flex flex-col gap-6">
      <HistoryLoaded {...params} />
    </div>
  );
}
