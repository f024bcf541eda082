import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { paths } from '@/config/paths';
import { Badge } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/table';
import { formatGrams, formatGritBand, formatNumber } from '@/lib/format';
import type { CompareRow } from '@/types/api';

const column = createColumnHelper<CompareRow>();

/** Cells below this many results are flagged: a median of two readings says little. */
export const FEW_RESULTS = 3;

/**
 * The comparison: one row per cell (method × steel × abrasive material × grit band) with the
 * sample size, testers, median and quartiles, mean with its 95 % interval, and median cuts.
 * Thin cells carry a text badge, so the warning does not depend on colour.
 */
export function CompareTable({ rows }: { rows: CompareRow[] }) {
  const columns = useMemo(
    () => [
      column.accessor('methodName', {
        header: 'Method',
        cell: (info) => (
          <Link to={paths.method.getHref(info.row.original.method)} className="block min-w-40">
            {info.getValue()}
          </Link>
        ),
      }),
      column.accessor('steelName', {
        header: 'Steel',
        cell: (info) => <Link to={paths.steel.getHref(info.row.original.steel)}>{info.getValue()}</Link>,
      }),
      column.accessor('materialLabel', { header: 'Abrasive material' }),
      column.accessor((r) => r.gritBand.loUm, {
        id: 'gritBand',
        header: 'Grit band',
        cell: (info) => <span className="whitespace-nowrap">{formatGritBand(info.row.original.gritBand)}</span>,
      }),
      column.accessor('n', {
        header: 'n',
        meta: { numeric: true },
        cell: (info) => (
          <span className="inline-flex items-center gap-1.5 whitespace-nowrap">
            {info.getValue() < FEW_RESULTS ? <Badge tone="caution">few results</Badge> : null}
            {info.getValue()}
          </span>
        ),
      }),
      column.accessor('testers', {
        header: 'Testers',
        meta: { numeric: true },
        cell: (info) => (
          <span className="inline-flex items-center gap-1.5 whitespace-nowrap">
            {info.getValue() === 1 ? <Badge tone="caution">one tester</Badge> : null}
            {info.getValue()}
          </span>
        ),
      }),
      column.accessor((r) => r.sharpnessG.median, {
        id: 'median',
        header: 'Median',
        meta: { numeric: true },
        cell: (info) => {
          const s = info.row.original.sharpnessG;
          return (
            <span className="whitespace-nowrap">
              <strong className="block font-semibold">{formatGrams(s.median)}</strong>
              <span className="block text-sm text-muted">
                <span className="sr-only">quartiles </span>
                {formatNumber(s.q1, 0)}–{formatNumber(s.q3, 0)}
              </span>
            </span>
          );
        },
      }),
      column.accessor((r) => r.sharpnessG.mean, {
        id: 'mean',
        header: 'Mean',
        meta: { numeric: true },
        cell: (info) => {
          const s = info.row.original.sharpnessG;
          return (
            <span className="whitespace-nowrap">
              <span className="block">{formatGrams(s.mean)}</span>
              <span className="block text-sm text-muted">
                {s.ci95 ? (
                  <>
                    <span className="sr-only">95 % confidence interval </span>
                    {formatNumber(s.ci95[0], 0)}–{formatNumber(s.ci95[1], 0)}
                  </>
                ) : (
                  'no interval'
                )}
              </span>
            </span>
          );
        },
      }),
      column.accessor((r) => r.retentionCuts?.median, {
        id: 'retention',
        header: 'Median cuts',
        meta: { numeric: true },
        sortUndefined: 'last',
        cell: (info) => (info.getValue() === undefined ? <span className="text-muted">not tested</span> : formatNumber(info.getValue(), 0)),
      }),
    ],
    [],
  );
  return (
    <DataTable
      label="Comparison table"
      data={rows}
      columns={columns}
      rowKey={(r) => `${r.method}|${r.steel}|${r.material}|${r.gritBand.loUm}`}
      caption="Sharpness in grams of force to cut the test medium (lower is sharper): the median with its quartiles q1–q3 beneath, the mean with its 95 % confidence interval beneath."
    />
  );
}
