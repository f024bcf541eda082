import { Link } from 'react-router-dom';
import { paths, type CompareFilters } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { ErrorState, Loading } from '@/components/ui/states';
import { TableFrame, tdClass, thClass } from '@/components/ui/table-frame';
import { formatNumber, formatGritBand } from '@/lib/format';
import { useComparePaired } from '../api/get-compare-paired';

const g = (x: number) => `${formatNumber(Math.abs(x), 0)} g`;
const direction = (x: number) => (x < 0 ? 'lower' : x > 0 ? 'higher' : 'the same');

/**
 * The tester-adjusted comparison of two chosen cells: per tester, their own median in A minus
 * their own median in B; the median of those differences with a distribution-free 95 % interval.
 */
export function PairedPanel({ filters, a, b, onClear }: { filters: CompareFilters; a: string; b: string; onClear: () => void }) {
  const query = useComparePaired({ ...filters, a, b }, true);
  return (
    <section aria-labelledby="paired-title" className="flex flex-col gap-3 rounded-md border border-rule bg-panel p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="paired-title" tabIndex={-1} className="font-serif text-xl">
          Tester-paired comparison
        </h2>
        <Button variant="quiet" size="sm" onClick={onClear}>
          Clear the pair
        </Button>
      </div>
      <p className="max-w-3xl">
        For every tester who measured both cells we subtract their own median in B from their own median in A, so an instrument that reads high for one tester shifts both sides alike and cancels out; the figure is the median of those differences, with a 95 % interval that assumes nothing about their spread (the sign-test interval for a median).
      </p>
      {query.isPending ? (
        <Loading label="Pairing the testers…" />
      ) : query.isError ? (
        <ErrorState error={query.error} onRetry={() => query.refetch()} />
      ) : (
        (() => {
          const { paired, a: ra, b: rb } = query.data;
          const nameA = ra ? `${ra.steelName} · ${ra.materialLabel} · ${formatGritBand(ra.band)}` : a;
          const nameB = rb ? `${rb.steelName} · ${rb.materialLabel} · ${formatGritBand(rb.band)}` : b;
          return (
            <>
              <dl className="grid gap-1 sm:grid-cols-[8rem_1fr]">
                <dt className="font-semibold">Cell A</dt>
                <dd>
                  {nameA} {ra ? <span className="text-muted">(n {ra.n}, median {formatNumber(ra.sharpnessG.median, 0)} g)</span> : null}
                </dd>
                <dt className="font-semibold">Cell B</dt>
                <dd>
                  {nameB} {rb ? <span className="text-muted">(n {rb.n}, median {formatNumber(rb.sharpnessG.median, 0)} g)</span> : null}
                </dd>
              </dl>
              {paired.n === 0 ? (
                <>
                  <p role="status">No tester has measured both cells, so no paired difference can be given. The plain difference of the medians is {query.data.unpairedMedianDiffG === null ? 'not available' : `${g(query.data.unpairedMedianDiffG)} (A ${direction(query.data.unpairedMedianDiffG)})`}, but it mixes testers.</p>
                  {ra && rb && ra.steel === rb.steel ? (
                    <p>
                      <Link to={paths.decide.getHref(ra.steel, { method: query.data.method.slug, a, b })}>The difference between every result of the two, and how sure it is</Link> (not paired by tester), on the choice of an abrasive for {ra.steelName}.
                    </p>
                  ) : null}
                </>
              ) : (
                <p role="status" className="text-lg">
                  Across <strong>{paired.n}</strong> tester{paired.n === 1 ? '' : 's'} who measured both, A read a median <strong>{g(paired.medianDiffG!)} {direction(paired.medianDiffG!)}</strong> than B
                  {paired.ci95 ? (
                    <>
                      {' '}
                      (95 % interval {formatNumber(paired.ci95.lo, 0)} to {formatNumber(paired.ci95.hi, 0)} g; exact coverage {formatNumber(paired.ci95.coverage * 100, 1)} %)
                    </>
                  ) : (
                    <> — too few testers for a 95 % interval (it needs at least 6){paired.widest && paired.n > 1 ? `; their differences run from ${formatNumber(paired.widest.lo, 0)} to ${formatNumber(paired.widest.hi, 0)} g, a range that covers the true median with ${formatNumber(paired.widest.coverage * 100, 1)} % confidence` : ''}</>
                  )}
                  . {paired.signs.aLower} found A keener, {paired.signs.bLower} found B keener{paired.signs.ties ? `, ${paired.signs.ties} saw no difference` : ''}.
                  {query.data.unpairedMedianDiffG !== null ? <span className="block text-base text-muted">Without pairing, the cells’ medians differ by {g(query.data.unpairedMedianDiffG)} (A {direction(query.data.unpairedMedianDiffG)}).</span> : null}
                </p>
              )}
              {paired.pairs.length ? (
                <TableFrame label="Per-tester differences">
                  <table className="w-full border-collapse text-sm">
                    <thead>
                      <tr>
                        <th scope="col" className={thClass}>Tester</th>
                        <th scope="col" className={`${thClass} text-right`}>Results in A</th>
                        <th scope="col" className={`${thClass} text-right`}>Median in A, g</th>
                        <th scope="col" className={`${thClass} text-right`}>Results in B</th>
                        <th scope="col" className={`${thClass} text-right`}>Median in B, g</th>
                        <th scope="col" className={`${thClass} text-right`}>A − B, g</th>
                      </tr>
                    </thead>
                    <tbody>
                      {paired.pairs.map((p) => (
                        <tr key={p.tester}>
                          <td className={tdClass}>{p.tester}</td>
                          <td className={`${tdClass} text-right tabular-nums`}>{p.nA}</td>
                          <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(p.medianAG, 0)}</td>
                          <td className={`${tdClass} text-right tabular-nums`}>{p.nB}</td>
                          <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(p.medianBG, 0)}</td>
                          <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(p.diffG, 1)}</td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </TableFrame>
              ) : null}
              {paired.unpairedTesters.a || paired.unpairedTesters.b ? (
                <p className="text-sm text-muted">
                  Left out: {paired.unpairedTesters.a} tester{paired.unpairedTesters.a === 1 ? '' : 's'} only in A, {paired.unpairedTesters.b} only in B.
                </p>
              ) : null}
            </>
          );
        })()
      )}
    </section>
  );
}
