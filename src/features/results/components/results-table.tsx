import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { paths } from '@/config/paths';
import { DataTable } from '@/components/ui/table';
import { formatDate, formatDegrees, formatGrams, formatMicrometres, formatNumber } from '@/lib/format';
import type { ResultSummary } from '@/types/api';
import { StatusBadge } from './status-badge';

const column = createColumnHelper<ResultSummary>();

export interface ResultsTableProps {
  results: ResultSummary[];
  label: string;
  caption?: string;
  /** Adds the state and the reviewer's note (for one's own results). */
  showStatus?: boolean;
  /** Hides the tester column (e.g. on "my results"). */
  hideAuthor?: boolean;
}

/** Results as a sortable table: steel and hardness, final abrasive and grit, angle, median reading. */
export function ResultsTable({ results, label, caption, showStatus, hideAuthor }: ResultsTableProps) {
  const columns = useMemo(
    () => [
      column.accessor('createdAt', {
        header: 'Posted',
        cell: (info) => (
          <Link to={paths.result.getHref(info.row.original.id)} className="whitespace-nowrap" aria-label={`Result ${info.row.original.id}, posted ${formatDate(info.getValue())}`}>
            {formatDate(info.getValue())}
          </Link>
        ),
      }),
      // One's own results: the state comes right after the date, so a phone shows it without scrolling.
      ...(showStatus ? [column.accessor('status', { header: 'State', cell: (info) => <StatusBadge status={info.getValue()} /> })] : []),
      column.accessor('steelName', { header: 'Steel' }),
      column.accessor((r) => r.derived.hrc, {
        id: 'hrc',
        header: 'HRC',
        meta: { numeric: true },
        cell: (info) => formatNumber(info.getValue(), 1),
      }),
      column.accessor('abrasiveName', { header: 'Final abrasive', meta: { wide: true } }),
      column.accessor((r) => r.derived.gritUm, {
        id: 'gritUm',
        header: 'Grit (µm)',
        meta: { numeric: true },
        sortUndefined: 'last',
        cell: (info) => formatMicrometres(info.getValue()),
      }),
      column.accessor((r) => r.derived.perSideDeg, {
        id: 'angle',
        header: 'Per side',
        meta: { numeric: true },
        cell: (info) => formatDegrees(info.getValue()),
      }),
      column.accessor((r) => r.derived.sharpnessMedianG, {
        id: 'median',
        header: 'Median',
        meta: { numeric: true },
        cell: (info) => formatGrams(info.getValue()),
      }),
      column.accessor('sharpnessMethodName', { header: 'Method', meta: { wide: true } }),
      ...(hideAuthor ? [] : [column.accessor((r) => r.author.displayName, { id: 'author', header: 'Tester' })]),
      ...(showStatus
        ? [
            column.accessor((r) => r.review?.note ?? '', {
              id: 'reviewNote',
              header: 'Reviewer’s note',
              enableSorting: false,
              cell: (info) => <span className="block min-w-64 max-w-xs text-sm">{info.getValue() || "—"}</span>,
            }),
          ]
        : []),
    ],
    [showStatus, hideAuthor],
  );
  return <DataTable label={label} caption={caption} data={results} columns={columns} rowKey={(r) => String(r.id)} />;
}
