import { useLocation, useParams } from 'react-router-dom';
import { PageTitle } from '@/components/ui/page-title';
import { ErrorState, Loading } from '@/components/ui/states';
import { formatDegrees, formatGrams, formatNumber } from '@/lib/format';
import { useResult } from '@/features/results/api/get-result';
import { useMethods } from '@/features/methods/api/get-methods';
import { ResultDetail } from '@/features/results/components/result-detail';
import { ReviewDecisionForm } from '@/features/results/components/review-decision-form';
import { ResultPhotos } from '@/features/photos/components/result-photos';
import { RetractForm } from '@/features/me/components/retract-form';
import { FlagForm } from '@/features/curation/components/flag-form';
import { EditResultAction } from '@/features/results/components/edit-result-action';
import { ResultRevisions } from '@/features/results/components/result-revisions';

/** One result: everything entered and derived, its notes, state, review note and trail. */
export default function ResultRoute() {
  const { id } = useParams();
  const resultId = Number(id);
  const result = useResult(resultId);
  const methods = useMethods();
  const edited = (useLocation().state as { edited?: 'updated' | 'proposed'; revision?: number } | null) ?? null;
  const methodNames = Object.fromEntries((methods.data?.items ?? []).map((m) => [m.slug, m.name]));

  if (!Number.isInteger(resultId) || resultId <= 0) {
    return <ErrorState title="No such result" error={new Error(`“${id}” is not a result number.`)} />;
  }
  if (result.isPending) return <Loading label="Loading the result…" />;
  if (result.isError) return <ErrorState error={result.error} onRetry={() => result.refetch()} />;
  const r = result.data;
  return (
    <article className="flex flex-col gap-6">
      <PageTitle
        title={`Result ${r.id}: ${r.steelName}`}
        lead={`Result ${r.id} · ${formatNumber(r.derived.hrc, 1)} HRC · ${formatDegrees(r.derived.perSideDeg)} per side · median ${formatGrams(r.derived.sharpnessMedianG)}`}
      >
        {r.steelName} on {r.abrasiveName}
      </PageTitle>
      <p role="status" aria-live="polite" className="empty:hidden rounded-md border-l-4 border-accent bg-accent-soft px-4 py-3">
        {edited?.edited === 'proposed'
          ? `Correction sent as version ${edited.revision}. The published version below stays until a moderator approves it.`
          : edited?.edited === 'updated'
            ? `Saved as version ${edited.revision}. The result is back on the review desk.`
            : ''}
      </p>
      <EditResultAction result={r} />
      <ResultDetail result={r} methodNames={methodNames} />
      <ResultRevisions result={r} />
      <ResultPhotos resultId={r.id} />
      <RetractForm result={r} />
      {r.status === 'approved' ? <FlagForm subjectType="result" subject={r.id} what="this result" /> : null}
      {r.can.review && r.status === 'pending' ? (
        <section aria-labelledby="decide">
          <h2 id="decide" className="mb-2 text-xl font-semibold">
            Your decision
          </h2>
          <ReviewDecisionForm result={r} />
        </section>
      ) : null}
    </article>
  );
}
