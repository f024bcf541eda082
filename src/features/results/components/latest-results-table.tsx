import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { TableFrame, tdClass, thClass } from '@/components/ui/table-frame';
import { formatDate, formatDegrees, formatGrams, formatMicrometres, formatNumber } from '@/lib/format';
import type { ResultSummary } from '@/types/api';

/**
 * The newest results as a plain table, newest first. The home page uses it instead of the
 * sortable ResultsTable: a short list in date order needs no sorting, and leaving TanStack
 * Table out keeps the first page's JavaScript under its 120 kB budget. On a phone the rows
 * stack as short entries instead of scrolling sideways.
 */
export function LatestResultsTable({ results, label }: { results: ResultSummary[]; label: string }) {
  const num = `${tdClass} whitespace-nowrap text-right tabular-nums`;
  return (
    <>
      <ol aria-label={label} className="divide-y divide-rule rounded-md border border-rule bg-panel sm:hidden">
        {results.map((r) => (
          <li key={r.id} className="px-4 py-3">
            <Link to={paths.result.getHref(r.id)} className="font-semibold">
              {r.steelName} on {r.abrasiveName}
            </Link>
            <p className="mt-0.5 text-sm text-muted">
              {formatNumber(r.derived.hrc, 1)} HRC · {formatMicrometres(r.derived.gritUm)} µm ·{' '}
              {formatDegrees(r.derived.perSideDeg)} per side
            </p>
            <p className="text-sm">
              median <strong className="font-semibold">{formatGrams(r.derived.sharpnessMedianG)}</strong> ·{' '}
              {r.author.displayName} · {formatDate(r.createdAt)}
            </p>
          </li>
        ))}
      </ol>
      <div className="hidden sm:block">
        <TableFrame label={label}>
          <table className="w-full min-w-[44rem] border-collapse text-[0.95rem]">
            <thead>
              <tr>
                <th scope="col" className={thClass}>Posted</th>
                <th scope="col" className={thClass}>Steel</th>
                <th scope="col" className={`${thClass} text-right`}>HRC</th>
                <th scope="col" className={thClass}>Final abrasive</th>
                <th scope="col" className={`${thClass} text-right`}>Grit (µm)</th>
                <th scope="col" className={`${thClass} text-right`}>Per side</th>
                <th scope="col" className={`${thClass} text-right`}>Median</th>
                <th scope="col" className={thClass}>Method</th>
                <th scope="col" className={thClass}>Tester</th>
              </tr>
            </thead>
            <tbody>
              {results.map((r) => (
                <tr key={r.id} className="hover:bg-accent-soft/40">
                  <td className={`${tdClass} whitespace-nowrap`}>
                    <Link to={paths.result.getHref(r.id)} aria-label={`Result ${r.id}, posted ${formatDate(r.createdAt)}`}>
                      {formatDate(r.createdAt)}
                    </Link>
                  </td>
                  <td className={tdClass}>{r.steelName}</td>
                  <td className={num}>{formatNumber(r.derived.hrc, 1)}</td>
                  <td className={tdClass}>
                    <div className="min-w-48">{r.abrasiveName}</div>
                  </td>
                  <td className={num}>{formatMicrometres(r.derived.gritUm)}</td>
                  <td className={num}>{formatDegrees(r.derived.perSideDeg)}</td>
                  <td className={num}>{formatGrams(r.derived.sharpnessMedianG)}</td>
                  <td className={tdClass}>{r.sharpnessMethodName}</td>
                  <td className={tdClass}>{r.author.displayName}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableFrame>
      </div>
    </>
  );
}
