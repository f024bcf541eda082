import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { formatDate, formatDegrees, formatGrams } from '@/lib/format';
import { Badge } from '@/components/ui/badge';
import { Facts } from '@/components/ui/facts';
import { ErrorState, Loading } from '@/components/ui/states';
import { useDeskContext } from '../api/get-desk-context';

const STATUS_WORDS: Record<string, string> = { pending: 'pending', approved: 'published' };

/**
 * What helps judge a pending result: the cell it would join and its place there, the outlier
 * hint (rule and source named), the method's readings, near-duplicates (rule stated), the
 * author's record.
 */
export function DeskContextPanel({ resultId, authorHandle }: { resultId: number; authorHandle: string | null }) {
  const context = useDeskContext(resultId);
  if (context.isPending) return <Loading label="Reading the result's cell and record…" />;
  if (context.isError) return <ErrorState error={context.error} onRetry={() => context.refetch()} title="The context could not be read" />;
  const { cell, readings, nearDuplicates, nearDuplicateRule, authorRecord: record } = context.data;
  const f = cell.figures;

  return (
    <section aria-labelledby="context" className="flex min-w-0 flex-col gap-3">
      <h3 id="context" className="text-xl font-semibold">
        Context
      </h3>
      <Facts
        items={[
          {
            term: 'Cell it would join',
            value: f ? (
              <>
                {f.n} approved result{f.n === 1 ? '' : 's'} ({cell.materialLabel}, grit band φ {cell.gritPhi}): median {formatGrams(f.median, 1)}, quartiles {formatGrams(f.q1, 1)} – {formatGrams(f.q3, 1)}.
              </>
            ) : (
              `No approved results yet (${cell.materialLabel}, grit band φ ${cell.gritPhi}): this would be the cell's first.`
            ),
          },
          { term: 'Where it falls', value: cell.position?.words ?? 'Nothing to compare it with yet.' },
          {
            term: 'Outlier hint',
            value: (
              <span className="flex flex-col gap-1">
                <span>
                  {cell.outlier.outside ? <Badge tone="caution">Check</Badge> : null} {cell.outlier.words}
                </span>
                <span className="text-sm text-muted">
                  Rule: {cell.outlier.rule} ({cell.outlier.source}). A hint, not a verdict.
                </span>
              </span>
            ),
          },
          {
            term: 'Readings',
            value: (
              <>
                {readings.short ? <Badge tone="caution">{readings.short} short</Badge> : null} {readings.words}
              </>
            ),
          },
          {
            term: 'Near-duplicates',
            value: (
              <span className="flex flex-col gap-1">
                {nearDuplicates.length ? (
                  <ul className="flex flex-col gap-0.5">
                    {nearDuplicates.map((d) => (
                      <li key={d.id}>
                        <Link to={paths.result.getHref(d.id)}>#{d.id}</Link> ({STATUS_WORDS[d.status] ?? d.status}) by {d.sameAuthor ? 'the same author' : `@${d.author?.handle ?? 'unknown'}`}:{' '}
                        median {formatGrams(d.sharpnessMedianG, 1)}, {formatDegrees(d.perSideDeg)} per side, {formatDate(d.createdAt)}
                      </li>
                    ))}
                  </ul>
                ) : (
                  <span>None.</span>
                )}
                <span className="text-sm text-muted">{nearDuplicateRule}</span>
              </span>
            ),
          },
          {
            term: "Author's record",
            value: (
              <>
                {authorHandle ? <Link to={paths.profile.getHref(authorHandle)}>@{authorHandle}</Link> : 'The author'}: {record.published} published, {record.pending} pending,{' '}
                {record.everReturned} ever returned ({record.returnedNow} still with the author), {record.rejected} rejected.
              </>
            ),
          },
        ]}
      />
    </section>
  );
}
