import { useEffect, useRef, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useCan } from '@/lib/auth';
import { SignInRequired } from '@/lib/authorization';
import { DeskRevisions } from '@/features/wiki/components/desk-revisions';
import { DeskFilters, DeskImportsAndFlags, deskFiltersOf, withOpen } from '@/features/curation/components/desk-panel';
import { formatDate, formatGrams } from '@/lib/format';
import { PageTitle } from '@/components/ui/page-title';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useReviewDesk } from '@/features/results/api/get-review-desk';
import { useMethods } from '@/features/methods/api/get-methods';
import { ResultDetail } from '@/features/results/components/result-detail';
import { ReviewDecisionForm } from '@/features/results/components/review-decision-form';
import { DeskCorrections } from '@/features/results/components/desk-corrections';
import { DeskContextPanel } from '@/features/results/components/desk-context';
import type { Result } from '@/types/api';

const DECIDED: Record<string, string> = { approve: 'approved', return: 'returned to its author', reject: 'rejected' };

function Queue() {
  const [deskParams] = useSearchParams();
  const desk = useReviewDesk({ filters: deskFiltersOf(deskParams) });
  const methods = useMethods();
  const methodNames = Object.fromEntries((methods.data?.items ?? []).map((m) => [m.slug, m.name]));
  const [params, setParams] = useSearchParams();
  const openId = Number(params.get('open') ?? '');
  const headingRef = useRef<HTMLHeadingElement>(null);
  const [confirmation, setConfirmation] = useState<{ text: string; next: number | null } | null>(null);
  const open = desk.data?.items.find((r) => r.id === openId) ?? null;

  useEffect(() => {
    if (open) headingRef.current?.focus();
  }, [open?.id]);

  if (desk.isPending) return <Loading label="Loading the queue…" />;
  if (desk.isError) return <ErrorState error={desk.error} onRetry={() => desk.refetch()} />;

  const items = desk.data.items;
  const close = () => setParams(withOpen(params, null), { replace: true });
  // After a decision: say so in the live region, and offer the next item rather than jumping to it.
  const decided = (r: Result, decision: string, what = `Result ${r.id}`) => {
    const next = items.find((i) => i.id !== r.id) ?? null;
    setConfirmation({ text: `${what} ${DECIDED[decision] ?? decision}. Saved.`, next: next?.id ?? null });
    setParams(withOpen(params, null), { replace: true });
  };

  return (
    <div className="flex flex-col gap-6">
    <div role="status" aria-live="polite" className="empty:hidden">
      {confirmation ? (
        <p className="flex flex-wrap items-center gap-x-3 gap-y-1 rounded-md border-l-4 border-accent bg-accent-soft px-4 py-3">
          <span>{confirmation.text}</span>
          {confirmation.next !== null ? (
            <Link to={`${paths.reviewDesk.getHref()}?${withOpen(params, confirmation.next)}`} onClick={() => setConfirmation(null)}>
              Open the next result (#{confirmation.next})
            </Link>
          ) : (
            <span className="text-muted">Nothing else is waiting.</span>
          )}
        </p>
      ) : null}
    </div>
    <DeskCorrections items={desk.data.resultRevisions ?? []} onDecided={decided} />
    <div className="grid gap-6 lg:grid-cols-[20rem_1fr]">
      <section aria-labelledby="queue">
        <h2 id="queue" className="mb-2 text-xl font-semibold">
          Awaiting review <span className="font-sans text-base font-normal text-muted">({items.length})</span>
        </h2>
        {items.length === 0 ? (
          <Empty title="The queue is empty">Nothing is waiting for review.</Empty>
        ) : (
          <ol className="divide-y divide-rule rounded-md border border-rule bg-panel">
            {items.map((r) => (
              <li key={r.id}>
                <Link
                  to={`${paths.reviewDesk.getHref()}?${withOpen(params, r.id)}`}
                  aria-current={r.id === openId ? 'true' : undefined}
                  className={`block px-4 py-3 no-underline ${r.id === openId ? 'bg-accent-soft' : 'hover:bg-paper'}`}
                >
                  <span className="block font-semibold text-ink">
                    {r.steelName} on {r.abrasiveName}
                  </span>
                  <span className="block text-sm text-muted">
                    #{r.id} · {r.author.displayName} · {formatDate(r.createdAt)} · median {formatGrams(r.derived.sharpnessMedianG)}
                  </span>
                </Link>
              </li>
            ))}
          </ol>
        )}
      </section>

      <section aria-labelledby="open-item" className={`min-w-0 ${open ? 'order-first lg:order-none' : ''}`}>
        {open ? (
          <div className="flex flex-col gap-6">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h2 id="open-item" ref={headingRef} tabIndex={-1} className="text-2xl font-semibold">
                Result {open.id}: {open.steelName} on {open.abrasiveName}
              </h2>
              <button type="button" className="text-accent-strong underline" onClick={close}>
                Close
              </button>
            </div>
            <DeskContextPanel resultId={open.id} authorHandle={open.author?.handle ?? null} />
            <ResultDetail result={open} headingLevel={3} methodNames={methodNames} />
            <section aria-labelledby="decision">
              <h3 id="decision" className="mb-2 text-xl font-semibold">
                Decision
              </h3>
              {open.can.review ? (
                <ReviewDecisionForm key={open.id} result={open} onDecided={decided} />
              ) : (
                <p className="text-muted">You cannot review your own result; another moderator will.</p>
              )}
            </section>
          </div>
        ) : (
          <div className="rounded-md border border-dashed border-rule px-5 py-8 text-muted">
            <h2 id="open-item" className="sr-only">
              No result open
            </h2>
            {items.length ? 'Open a result from the queue to read it in full and decide.' : 'When members post results, they appear here, oldest first.'}
          </div>
        )}
      </section>
    </div>
    </div>
  );
}

/** The desk's keyboard shortcuts, listed where they are used. */
function Shortcuts() {
  return (
    <section aria-labelledby="shortcuts" className="text-sm text-muted">
      <h2 id="shortcuts" className="mb-1 font-sans text-base font-semibold text-ink">
        Keyboard shortcuts
      </h2>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
        <dt><kbd>Alt</kbd>+<kbd>A</kbd></dt>
        <dd>Approve (inside a decision form)</dd>
        <dt><kbd>Alt</kbd>+<kbd>R</kbd></dt>
        <dd>Return with the note</dd>
        <dt><kbd>Alt</kbd>+<kbd>J</kbd></dt>
        <dd>Reject with the note</dd>
        <dt><kbd>Tab</kbd></dt>
        <dd>After a decision, the confirmation offers the next result</dd>
      </dl>
    </section>
  );
}

/** Review desk (moderators): pending results oldest first; open one, read it, approve, return or reject. */
export default function ReviewDeskRoute() {
  const mayReview = useCan('read:review-desk');
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Review desk" lead="Approve what is sound; return with a note what needs changes; reject with a reason what cannot be used.">
        Review desk
      </PageTitle>
      <SignInRequired what="open the review desk" action="read:review-desk">
        {mayReview ? <DeskFilters /> : null}
        {mayReview ? <DeskImportsAndFlags /> : null}
        {/* Page edits first: an opened edit's diff shows at the top, not below a long queue. */}
        {mayReview ? <DeskRevisions /> : null}
        {mayReview ? <Queue /> : null}
        {mayReview ? <Shortcuts /> : null}
      </SignInRequired>
    </div>
  );
}
