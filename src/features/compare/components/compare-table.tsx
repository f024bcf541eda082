import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { FEW_RESULTS, type CompareRow } from '@shared/compare-view';
import type { CompareSortKey } from '@shared/schemas/compare';
import { paths } from '@/config/paths';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { TableFrame, tdClass, thClass } from '@/components/ui/table-frame';
import { formatGrams, formatGritBand, formatNumber } from '@/lib/format';

export { FEW_RESULTS };

const column = createColumnHelper<CompareRow>();

/** The marks of a thin cell, in words (colour only supports them). */
export function ThinMarks({ row }: { row: Pick<CompareRow, 'fewResults' | 'singleTester'> }) {
  if (!row.fewResults && !row.singleTester) return null;
  return (
    <span className="inline-flex flex-wrap gap-1">
      {row.fewResults ? <Badge tone="caution">few results</Badge> : null}
      {row.singleTester ? <Badge tone="caution">one tester</Badge> : null}
    </span>
  );
}

export interface CompareTableProps {
  rows: CompareRow[];
  /** The URL's sort ("median", "-n", …); the server sorts every page alike. */
  sort?: string;
  /** A press on a sortable column's header (its id, a CompareSortKey). */
  onToggleSort: (column: CompareSortKey) => void;
  openCell?: string;
  onOpenCell: (cell: string) => void;
  pair: { a?: string; b?: string };
  onPair: (cell: string) => void;
}

/**
 * The comparison as a table: one row per cell with the sample size, testers, median and
 * quartiles, mean with its 95 % interval, median cuts, and the hardness and angle ranges.
 * Every column sorts (on the server, so the order holds across pages); thin cells are marked
 * in words; each row opens its results and can be chosen for the paired comparison.
 */
export function CompareTable({ rows, sort, onToggleSort, openCell, onOpenCell, pair, onPair }: CompareTableProps) {
  const columns = useMemo(
    () => [
      column.accessor('methodVersion', {
        id: 'method',
        header: 'Method',
        enableSorting: false,
        cell: (info) => <Link to={paths.method.getHref(info.row.original.method)} title={info.row.original.methodName}>v{info.getValue()}</Link>,
      }),
      column.accessor('steelName', {
        id: 'steel',
        header: 'Steel',
        cell: (info) => (
          <>
            <Link to={paths.steel.getHref(info.row.original.steel)}>{info.getValue()}</Link>{' '}
            <Link to={paths.decide.getHref(info.row.original.steel, { method: info.row.original.method })} className="text-sm" aria-label={`Choose an abrasive for ${info.getValue()}`} title={`Choose an abrasive for ${info.getValue()}`}>
              (choose)
            </Link>
          </>
        ),
      }),
      column.accessor('materialLabel', { id: 'material', header: 'Abrasive material' }),
      column.accessor((r) => r.band.phi, {
        id: 'band',
        header: 'Grit band',
        cell: (info) => (
          <span className="whitespace-nowrap">
            {formatGritBand(info.row.original.band)} <span className="text-muted">({info.row.original.band.words})</span>
          </span>
        ),
      }),
      column.accessor('n', {
        id: 'n',
        header: 'n',
        meta: { numeric: true },
        cell: (info) => (
          <span className="inline-flex items-center gap-1.5">
            <ThinMarks row={{ fewResults: info.row.original.fewResults, singleTester: false }} />
            {info.getValue()}
          </span>
        ),
      }),
      column.accessor('testers', {
        id: 'testers',
        header: 'Testers',
        meta: { numeric: true },
        cell: (info) => (
          <span className="inline-flex items-center gap-1.5">
            <ThinMarks row={{ fewResults: false, singleTester: info.row.original.singleTester }} />
            {info.getValue()}
          </span>
        ),
      }),
      column.accessor((r) => r.sharpnessG.median, {
        id: 'median',
        header: 'Median g',
        meta: { numeric: true },
        cell: (info) => <strong className="font-semibold">{formatGrams(info.getValue())}</strong>,
      }),
      column.accessor((r) => r.sharpnessG.q1, { id: 'q1', header: 'q1', meta: { numeric: true }, cell: (info) => formatNumber(info.getValue(), 0) }),
      column.accessor((r) => r.sharpnessG.q3, { id: 'q3', header: 'q3', meta: { numeric: true }, cell: (info) => formatNumber(info.getValue(), 0) }),
      column.accessor((r) => r.sharpnessG.mean, {
        id: 'mean',
        header: 'Mean g',
        meta: { numeric: true },
        cell: (info) => formatGrams(info.getValue()),
      }),
      column.accessor((r) => r.sharpnessG.ci95, {
        id: 'ci',
        header: '95 % CI of mean',
        meta: { numeric: true },
        cell: (info) => {
          const ci = info.getValue();
          return ci ? `${formatNumber(ci[0], 0)}–${formatNumber(ci[1], 0)}` : <span className="text-muted">none for n = 1</span>;
        },
      }),
      column.accessor((r) => r.rankedMedianG, {
        id: 'ranked',
        header: 'Ranked g',
        meta: { numeric: true },
        cell: (info) => formatNumber(info.getValue(), 0),
      }),
      column.accessor((r) => r.retentionCuts, {
        id: 'retention',
        header: 'Median cuts',
        meta: { numeric: true },
        cell: (info) => {
          const r = info.getValue();
          return r ? (
            <span>
              {formatNumber(r.median, 0)} <span className="text-muted">(of {r.n})</span>
            </span>
          ) : (
            <span className="text-muted">not tested</span>
          );
        },
      }),
      column.accessor((r) => r.hrcRange[0], {
        id: 'hrc',
        header: 'HRC',
        meta: { numeric: true },
        cell: (info) => {
          const [lo, hi] = info.row.original.hrcRange;
          return lo === hi ? formatNumber(lo) : `${formatNumber(lo)}–${formatNumber(hi)}`;
        },
      }),
      column.accessor((r) => r.angleRange[0], {
        id: 'angle',
        header: '° per side',
        meta: { numeric: true },
        cell: (info) => {
          const [lo, hi] = info.row.original.angleRange;
          return lo === hi ? formatNumber(lo) : `${formatNumber(lo)}–${formatNumber(hi)}`;
        },
      }),
      column.display({
        id: 'actions',
        header: 'Results · pair',
        cell: (info) => {
          const r = info.row.original;
          const role = pair.a === r.cell ? 'A' : pair.b === r.cell ? 'B' : null;
          return (
            <span className="inline-flex gap-1 whitespace-nowrap">
              <Button size="sm" variant={openCell === r.cell ? 'primary' : 'secondary'} aria-pressed={openCell === r.cell} onClick={() => onOpenCell(r.cell)} aria-label={`Results of ${r.steelName}, ${r.materialLabel}, ${formatGritBand(r.band)}`}>
                Results
              </Button>
              <Button size="sm" variant={role ? 'primary' : 'quiet'} aria-pressed={!!role} onClick={() => onPair(r.cell)} aria-label={`Pair ${r.steelName}, ${r.materialLabel}, ${formatGritBand(r.band)}`}>
                {role ? `Pair ${role}` : 'Pair'}
              </Button>
            </span>
          );
        },
      }),
    ],
    [openCell, onOpenCell, pair.a, pair.b, onPair],
  );

  const sorting: SortingState = sort ? [{ id: sort.replace(/^-/, ''), desc: sort.startsWith('-') }] : [];
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting },
    // The server sorts; the header's press goes to the URL (onToggleSort), not to table state.
    manualSorting: true,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (r) => r.cell,
  });

  return (
    <TableFrame label="Comparison table">
      <table className="w-full min-w-[64rem] border-collapse text-[0.95rem]">
        <caption className="px-3 py-2 text-left text-sm text-muted">
          Sharpness in grams of force to sever the method’s test medium: lower is keener. Each result counts once, with the median of its readings. Sorting applies to every page.
        </caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const meta = header.column.columnDef.meta as { numeric?: boolean } | undefined;
                const sorted = header.column.getIsSorted();
                const canSort = header.column.getCanSort() && header.column.id !== 'actions' && header.column.id !== 'method';
                const content = flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <th key={header.id} scope="col" aria-sort={canSort ? (sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none') : undefined} className={`${thClass} ${meta?.numeric ? 'text-right' : ''}`}>
                    {canSort ? (
                      <button type="button" onClick={() => onToggleSort(header.column.id as CompareSortKey)} className={`inline-flex items-center gap-1 rounded font-semibold hover:text-ink ${meta?.numeric ? 'flex-row-reverse' : ''}`}>
                        <span>{content}</span>
                        <span aria-hidden="true" className="w-3 text-xs">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                        </span>
                      </button>
                    ) : (
                      content
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className={openCell === row.id ? 'bg-accent-soft/60' : 'hover:bg-accent-soft/30'}>
              {row.getVisibleCells().map((cell) => {
                const meta = cell.column.columnDef.meta as { numeric?: boolean } | undefined;
                return (
                  <td key={cell.id} className={`${tdClass} ${meta?.numeric ? 'whitespace-nowrap text-right tabular-nums' : ''}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </TableFrame>
  );
}
