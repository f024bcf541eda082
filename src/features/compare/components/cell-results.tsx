import { Link } from 'react-router-dom';
import { paths, type CompareFilters } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { ErrorState, Loading } from '@/components/ui/states';
import { TableFrame, tdClass, thClass } from '@/components/ui/table-frame';
import { formatDate, formatGrams, formatNumber, formatGritBand } from '@/lib/format';
import { useCompareCell } from '../api/get-compare-cell';
import { ThinMarks } from './compare-table';

/**
 * A cell's results under the view's filters, newest first: who measured it (linked to their
 * profile), with which method version (linked to the method page), and the figures.
 */
export function CellResults({ filters, cell, page, onPage, onClose }: { filters: CompareFilters; cell: string; page: number; onPage: (page: number) => void; onClose: () => void }) {
  const query = useCompareCell({ ...filters, cell, page: String(page) }, true);
  const heading = query.data?.cell ? `${query.data.cell.steelName} · ${query.data.cell.materialLabel} · ${formatGritBand(query.data.cell.band)}` : 'Results of the cell';
  return (
    <section aria-labelledby="cell-results-title" className="flex flex-col gap-3 rounded-md border border-accent/40 bg-panel p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="cell-results-title" tabIndex={-1} className="font-serif text-xl">
          {heading}
        </h2>
        <Button variant="quiet" size="sm" onClick={onClose}>
          Close the cell
        </Button>
      </div>
      {query.isPending ? (
        <Loading label="Loading the cell’s results…" />
      ) : query.isError ? (
        <ErrorState error={query.error} onRetry={() => query.refetch()} />
      ) : (
        <>
          {query.data.cell ? (
            <p className="flex flex-wrap items-center gap-2">
              <span>
                {query.data.cell.n} result{query.data.cell.n === 1 ? '' : 's'} by {query.data.cell.testers} tester{query.data.cell.testers === 1 ? '' : 's'}, median {formatGrams(query.data.cell.sharpnessG.median)} (quartiles {formatNumber(query.data.cell.sharpnessG.q1, 0)}–{formatNumber(query.data.cell.sharpnessG.q3, 0)} g), measured with{' '}
                <Link to={paths.method.getHref(query.data.method.slug)}>{query.data.method.name}</Link>.
              </span>
              <ThinMarks row={query.data.cell} />
            </p>
          ) : (
            <p>No published result is left in this cell under the current filters.</p>
          )}
          <TableFrame label="Results of the cell">
            <table className="w-full min-w-[44rem] border-collapse text-sm">
              <thead>
                <tr>
                  <th scope="col" className={thClass}>Result</th>
                  <th scope="col" className={thClass}>Tester</th>
                  <th scope="col" className={thClass}>Abrasive</th>
                  <th scope="col" className={`${thClass} text-right`}>Grit, µm</th>
                  <th scope="col" className={`${thClass} text-right`}>HRC</th>
                  <th scope="col" className={`${thClass} text-right`}>° per side</th>
                  <th scope="col" className={`${thClass} text-right`}>Median g</th>
                  <th scope="col" className={`${thClass} text-right`}>Cuts</th>
                  <th scope="col" className={thClass}>Method</th>
                  <th scope="col" className={thClass}>Posted</th>
                </tr>
              </thead>
              <tbody>
                {query.data.items.map((r) => (
                  <tr key={r.id}>
                    <td className={tdClass}>
                      <Link to={paths.result.getHref(r.id)}>#{r.id}</Link>
                    </td>
                    <td className={tdClass}>{r.author ? <Link to={paths.profile.getHref(r.author.handle)}>{r.author.displayName ?? r.author.handle}</Link> : '—'}</td>
                    <td className={tdClass}>
                      <Link to={paths.abrasive.getHref(r.abrasive)}>{r.abrasiveName}</Link>
                    </td>
                    <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(r.derived.gritUm)}</td>
                    <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(r.derived.hrc)}</td>
                    <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(r.derived.perSideDeg)}</td>
                    <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(r.derived.sharpnessMedianG, 0)}</td>
                    <td className={`${tdClass} text-right tabular-nums`}>{r.retention?.cuts ?? '—'}</td>
                    <td className={tdClass}>
                      <Link to={paths.method.getHref(r.sharpness.method)}>{r.sharpnessMethodName}</Link>
                    </td>
                    <td className={tdClass}>{formatDate(r.createdAt)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableFrame>
          {query.data.total > query.data.pageSize ? (
            <nav aria-label="Pages of the cell’s results" className="flex items-center gap-3 text-sm">
              <Button size="sm" variant="secondary" disabled={page <= 1} onClick={() => onPage(page - 1)}>
                ← Newer
              </Button>
              <span className="text-muted">
                Page {page} of {Math.ceil(query.data.total / query.data.pageSize)}
              </span>
              <Button size="sm" variant="secondary" disabled={page * query.data.pageSize >= query.data.total} onClick={() => onPage(page + 1)}>
                Older →
              </Button>
            </nav>
          ) : null}
        </>
      )}
    </section>
  );
}
