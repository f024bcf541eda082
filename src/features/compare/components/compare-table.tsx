import { Fragment, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState, type VisibilityState } from '@tanstack/react-table';
import type { GritStandard } from '@shared/grit';
import { FEW_RESULTS, type CompareRow } from '@shared/compare-view';
import type { CompareSortKey } from '@shared/schemas/compare';
import { paths } from '@/config/paths';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { TableFrame, tdClass } from '@/components/ui/table-frame';
import { SortableTh } from '@/components/ui/table';
import { formatGrams, formatGritBand, formatNumber } from '@/lib/format';
import { bandGrade } from '../lib/grit-notation';

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

/** The row's identity: the card's heading lines on a phone. */
const IDENTITY = new Set(['steel', 'material', 'band']);
/** A row as a card below the md breakpoint. */
const CARD = 'max-md:grid max-md:grid-cols-2 max-md:gap-x-3 max-md:gap-y-1 max-md:rounded-md max-md:border max-md:border-rule max-md:p-3';
/** A figure in a card: no rule, its column's name above it. */
const CARD_CELL = 'max-md:border-0 max-md:p-0 max-md:before:block max-md:before:text-xs max-md:before:text-muted max-md:before:content-[attr(data-label)]';

export interface CompareTableProps {
  rows: CompareRow[];
  /** The URL's sort ("median", "-n", …); the server sorts every page alike. */
  sort?: string;
  /** A press on a sortable column's header (its id, a CompareSortKey). */
  onToggleSort: (column: CompareSortKey) => void;
  /** A sort chosen in the phone's "Sort by" list (where the headers are hidden); undefined: the default order. */
  onSort: (sort: string | undefined) => void;
  openCell?: string;
  onOpenCell: (cell: string) => void;
  pair: { a?: string; b?: string };
  onPair: (cell: string) => void;
  /** The notation grit bands are labelled in beside the µm. */
  notation: GritStandard;
  /** Ranked order is on: its column shows whatever the chooser says. */
  ranked?: boolean;
  /** What opens under a row (its results, the pair), drawn in a full-width row right after it. */
  panelFor?: (cell: string) => ReactNode;
}

/** The columns shown unless the reader chooses otherwise: the row's identity, its figures, its actions. */
const DEFAULT_COLUMNS = ['steel', 'material', 'band', 'n', 'testers', 'median', 'retention', 'actions'];
/** The columns the chooser offers, with their names in the chooser. */
const OPTIONAL_COLUMNS: [string, string][] = [
  ['q1', 'Lower quartile (q1)'],
  ['q3', 'Upper quartile (q3)'],
  ['mean', 'Mean'],
  ['ci', '95 % interval of the mean'],
  ['ranked', 'Ranked g'],
  ['retention', 'Median cuts'],
  ['hrc', 'Hardness (HRC)'],
  ['angle', 'Angle per side'],
  ['method', 'Method (its version)'],
];
const COLUMNS_KEY = 'edgeledger.compare.columns';

/** The optional columns this browser last chose (kept in localStorage), else the default ones. */
function useChosenColumns(): [Set<string>, (next: Set<string>) => void] {
  const [chosen, setChosen] = useState<Set<string>>(() => {
    try {
      const kept = JSON.parse(window.localStorage.getItem(COLUMNS_KEY) ?? 'null') as unknown;
      if (Array.isArray(kept)) return new Set(kept.filter((c): c is string => typeof c === 'string'));
    } catch {
      // unreadable: the default columns
    }
    return new Set(OPTIONAL_COLUMNS.map(([c]) => c).filter((c) => DEFAULT_COLUMNS.includes(c)));
  });
  const choose = (next: Set<string>) => {
    setChosen(next);
    try {
      window.localStorage.setItem(COLUMNS_KEY, JSON.stringify([...next]));
    } catch {
      // storage refused (private window): the choice holds for this page only
    }
  };
  return [chosen, choose];
}

/** The column chooser: a disclosure of check boxes, one per optional column. */
function ColumnChooser({ chosen, onChange }: { chosen: Set<string>; onChange: (next: Set<string>) => void }) {
  return (
    <details className="relative max-md:hidden">
      <summary className="cursor-pointer rounded-md border border-rule bg-panel px-2.5 py-1 text-sm font-medium">More columns ({chosen.size} of {OPTIONAL_COLUMNS.length})</summary>
      <fieldset className="absolute right-0 z-20 mt-1 grid w-64 gap-1 rounded-md border border-rule bg-panel p-3 text-sm shadow-lg">
        <legend className="sr-only">Columns to show</legend>
        {OPTIONAL_COLUMNS.map(([c, label]) => (
          <label key={c} className="flex items-center gap-2">
            <input
              type="checkbox"
              checked={chosen.has(c)}
              onChange={(e) => {
                const next = new Set(chosen);
                if (e.target.checked) next.add(c);
                else next.delete(c);
                onChange(next);
              }}
            />
            {label}
          </label>
        ))}
      </fieldset>
    </details>
  );
}

/** How each sortable column's two orders read in the phone's list. */
const ORDER_WORDS: Record<string, [string, string]> = {
  steel: ['A to Z', 'Z to A'],
  material: ['A to Z', 'Z to A'],
  band: ['coarse to fine', 'fine to coarse'],
};

/**
 * The sort on a phone, where the cards hide the sortable headers: one list of every shown column
 * in both orders, the same URL sort the headers set.
 */
function PhoneSort({ sort, onSort, columns }: { sort?: string; onSort: (sort: string | undefined) => void; columns: [string, string][] }) {
  return (
    <label className="flex w-full items-center gap-2 text-sm md:hidden">
      <span className="shrink-0 font-medium">Sort by</span>
      <Select className="py-1" value={sort ?? ''} onChange={(e) => onSort(e.target.value || undefined)}>
        <option value="">Steel, material, then grit band</option>
        {columns.flatMap(([id, name]) => {
          const [up, down] = ORDER_WORDS[id] ?? ['low to high', 'high to low'];
          return [
            <option key={id} value={id}>
              {name}, {up}
            </option>,
            <option key={`-${id}`} value={`-${id}`}>
              {name}, {down}
            </option>,
          ];
        })}
      </Select>
    </label>
  );
}

/**
 * The comparison as a table: one row per cell with the sample size, testers, median and
 * quartiles, mean with its 95 % interval, median cuts, and the hardness and angle ranges.
 * Every column sorts (on the server, so the order holds across pages); thin cells are marked
 * in words; each row opens its results and can be chosen for the paired comparison.
 */
export function CompareTable({ rows, sort, onToggleSort, onSort, openCell, onOpenCell, pair, onPair, notation, ranked, panelFor }: CompareTableProps) {
  const [chosen, setChosen] = useChosenColumns();
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
          <>
            <span className="whitespace-nowrap">{formatGritBand(info.row.original.band)}</span> <span className="whitespace-nowrap text-muted">({info.row.original.band.words})</span>
            <span className="block whitespace-nowrap text-sm text-muted">{bandGrade(info.row.original.band, notation)}</span>
          </>
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
              <Button size="sm" variant={openCell === r.cell ? 'primary' : 'secondary'} aria-pressed={openCell === r.cell} onClick={() => onOpenCell(r.cell)} data-row-button="results" data-cell={r.cell} aria-label={`Results of ${r.steelName}, ${r.materialLabel}, ${formatGritBand(r.band)}`}>
                Results
              </Button>
              <Button size="sm" variant={role ? 'primary' : 'quiet'} aria-pressed={!!role} onClick={() => onPair(r.cell)} data-row-button="pair" data-cell={r.cell} aria-label={`Pair ${r.steelName}, ${r.materialLabel}, ${formatGritBand(r.band)}`}>
                {role ? `Pair ${role}` : 'Pair'}
              </Button>
            </span>
          );
        },
      }),
    ],
    [openCell, onOpenCell, pair.a, pair.b, onPair, notation],
  );

  const sorting: SortingState = sort ? [{ id: sort.replace(/^-/, ''), desc: sort.startsWith('-') }] : [];
  // Default columns always; optional ones as chosen; the ranked column whenever ranked order is on.
  const columnVisibility: VisibilityState = Object.fromEntries(OPTIONAL_COLUMNS.map(([c]) => [c, chosen.has(c) || (c === 'ranked' && !!ranked)]));
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, columnVisibility },
    // The server sorts; the header's press goes to the URL (onToggleSort), not to table state.
    manualSorting: true,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (r) => r.cell,
  });

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <p className="text-sm text-muted">
          Sharpness in grams of force to sever the method’s test medium: lower is keener. Each result counts once, with the median of its readings. Sorting applies to every page.
        </p>
        <ColumnChooser chosen={chosen} onChange={setChosen} />
        <PhoneSort sort={sort} onSort={onSort} columns={table.getVisibleLeafColumns().filter((c) => c.getCanSort() && c.id !== 'actions' && c.id !== 'method').map((c) => [c.id, String(c.columnDef.header)])} />
      </div>
      <TableFrame label="Comparison table">
        {/* On a phone each row is a card: the head is hidden and every figure carries its column's name. */}
        <table className="w-full border-collapse text-[0.95rem] max-md:block">
          <thead className="max-md:sr-only">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const meta = header.column.columnDef.meta as { numeric?: boolean } | undefined;
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort() && header.column.id !== 'actions' && header.column.id !== 'method';
                  const content = flexRender(header.column.columnDef.header, header.getContext());
                  return (
                    <SortableTh key={header.id} sorted={sorted} canSort={canSort} numeric={meta?.numeric} onToggle={() => onToggleSort(header.column.id as CompareSortKey)}>
                      {content}
                    </SortableTh>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="max-md:flex max-md:flex-col max-md:gap-3 max-md:p-3">
            {table.getRowModel().rows.map((row) => {
              const chosenAs = pair.a === row.id || pair.b === row.id;
              const panel = panelFor?.(row.id);
              return (
                <Fragment key={row.id}>
                  <tr className={`${openCell === row.id || chosenAs ? 'bg-accent-soft/60' : 'hover:bg-accent-soft/30'} ${CARD}`}>
                    {row.getVisibleCells().map((cell) => {
                      const meta = cell.column.columnDef.meta as { numeric?: boolean } | undefined;
                      const header = cell.column.columnDef.header;
                      const identity = IDENTITY.has(cell.column.id);
                      return (
                        <td
                          key={cell.id}
                          data-label={identity || cell.column.id === 'actions' || typeof header !== 'string' ? undefined : header}
                          className={`${tdClass} ${meta?.numeric ? 'whitespace-nowrap text-right tabular-nums max-md:text-left' : ''} ${identity || cell.column.id === 'actions' ? 'max-md:col-span-2' : ''} ${CARD_CELL}`}
                        >
                          {flexRender(cell.column.columnDef.cell, cell.getContext())}
                        </td>
                      );
                    })}
                  </tr>
                  {panel ? (
                    <tr className="max-md:block">
                      <td colSpan={row.getVisibleCells().length} className="border-b border-rule/70 bg-accent-soft/20 p-3 max-md:block max-md:p-0 max-md:bg-transparent">
                        {panel}
                      </td>
                    </tr>
                  ) : null}
                </Fragment>
              );
            })}
          </tbody>
        </table>
      </TableFrame>
    </div>
  );
}
