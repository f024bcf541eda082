import { lazy, Suspense, useCallback, useState } from 'react';
import { Link } from 'react-router-dom';
import { FEW_RESULTS } from '@shared/compare-view';
import { SHRINKAGE_PSEUDO_RESULTS, shrinkageShare } from '@shared/compare-shrinkage';
import { paths } from '@/config/paths';
import { PageTitle } from '@/components/ui/page-title';
import { Button, buttonClasses } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { GRIT_STANDARD_SHORT_LABELS } from '@shared/grit';
import { NOTATIONS, notationOf } from '../lib/grit-notation';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { ErrorBoundary } from '@/components/errors/error-boundary';
import { formatNumber } from '@/lib/format';
import { useMethods } from '@/features/methods/api/get-methods';
import { useSteels } from '@/features/steels/api/get-steels';
import { useCompare } from '../api/get-compare';
import { nextSort, useCompareUrl, type CompareViewMode } from '../hooks/use-compare-url';
import { CompareFilters } from './compare-filters';
import { CompareTable } from './compare-table';
import { CompareGrid } from './compare-grid';
import { CellResults } from './cell-results';
import { PairedPanel } from './paired-panel';
import { RowPanel, type RowButton } from './row-panel';

// recharts is large: the charts come in their own chunk, only when asked for.
const CompareCharts = lazy(() => import('./compare-charts'));

const LIVE_WORDS: Record<string, string> = {
  bond: 'bond',
  hrcMin: 'hardness',
  hrcMax: 'hardness',
  angleMin: 'angle',
  angleMax: 'angle',
  publisher: 'publishers only',
  postedFrom: 'posting date',
  postedTo: 'posting date',
  via: 'progression',
  steps: 'progression',
};

const VIEWS: { id: CompareViewMode; label: string }[] = [
  { id: 'table', label: 'Table of cells' },
  { id: 'grid', label: 'Steel × grit grid' },
  { id: 'charts', label: 'Charts' },
];

/** The export's URL: the same filters and order as the page, as CSV or JSON. */
function exportHref(params: Record<string, string | undefined>, format: 'csv' | 'json'): string {
  const q = new URLSearchParams({ format });
  for (const [k, v] of Object.entries(params)) if (v) q.set(k, v);
  return `/api/v1/compare/export?${q.toString()}`;
}

/**
 * The comparison page: cells of one method version (method × steel × abrasive material × grit
 * band) as a table, a grid or charts; every filter, the sort, the view, the open cell and the
 * chosen pair live in the URL, so a link or a reload reproduces the page.
 */
export default function ComparePage() {
  const { params, filters, view, update } = useCompareUrl();
  const methods = useMethods();
  const steels = useSteels();
  const tableParams = { ...filters, sort: params.sort, page: params.page };
  const gridParams = { ...filters, pageSize: '5000' };
  const compare = useCompare(view === 'grid' ? gridParams : tableParams);
  const data = compare.data;

  // The panel a press opened takes the focus; one opened by a link or a reload leaves it where it is.
  const [pressed, setPressed] = useState<RowButton | null>(null);
  const onOpenCell = useCallback(
    (cell: string) => {
      setPressed('results');
      update({ cell: params.cell === cell ? undefined : cell, cellPage: undefined }, { keepPage: true });
    },
    [params.cell, update],
  );
  const onPair = useCallback(
    (cell: string) => {
      setPressed('pair');
      if (params.a === cell) update({ a: params.b, b: undefined }, { keepPage: true });
      else if (params.b === cell) update({ b: undefined }, { keepPage: true });
      else if (!params.a) update({ a: cell }, { keepPage: true });
      else update({ b: cell }, { keepPage: true });
    },
    [params.a, params.b, update],
  );
  const closeCell = () => update({ cell: undefined, cellPage: undefined }, { keepPage: true });
  const clearPair = () => update({ a: undefined, b: undefined }, { keepPage: true });

  const page = Number(params.page ?? 1);
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const ranked = params.sort === 'ranked' || params.sort === '-ranked';
  const notation = notationOf(params.notation);
  const live = data ? [...new Set(data.liveFilters.map((k) => LIVE_WORDS[k] ?? k))] : [];

  // The cell's results open under its row, the pair under its second cell's row, when the table
  // shows that row; otherwise (the grid, another page of the table) above the view.
  const cellPanel = params.cell ? <CellResults filters={filters} cell={params.cell} page={Number(params.cellPage ?? 1)} onPage={(p) => update({ cellPage: String(p) }, { keepPage: true })} onClose={closeCell} /> : null;
  const pairPanel = params.a && params.b ? <PairedPanel filters={filters} a={params.a} b={params.b} onClear={clearPair} /> : null;
  const shown = view === 'table' && data ? new Set(data.rows.map((r) => r.cell)) : new Set<string>();
  const cellUnderRow = !!params.cell && shown.has(params.cell);
  const pairUnderRow = !!params.b && shown.has(params.b);
  const panelFor = (cell: string) =>
    (cell === params.cell && cellPanel) || (cell === params.b && pairPanel) ? (
      <div className="flex flex-col gap-3">
        {cell === params.b && pairPanel ? (
          <RowPanel key={`pair-${cell}`} cell={cell} opener="pair" focusOnOpen={pressed === 'pair'} onClose={clearPair}>
            {pairPanel}
          </RowPanel>
        ) : null}
        {cell === params.cell && cellPanel ? (
          <RowPanel key={`results-${cell}`} cell={cell} opener="results" focusOnOpen={pressed === 'results'} onClose={closeCell}>
            {cellPanel}
          </RowPanel>
        ) : null}
      </div>
    ) : null;

  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Compare" lead="Published results side by side, with how many there are, who measured them and how much they spread.">
        Compare
      </PageTitle>
      <div className="max-w-3xl space-y-2">
        <p>
          Each row is a <strong className="font-semibold">cell</strong>: the published results measured with one version of a method on one steel, finished on one abrasive material within one grit band. <em>n</em> counts the results and <em>testers</em> the different people who posted them; each result counts once, with the median of its readings. Cells with fewer than {FEW_RESULTS} results or from a single tester are marked in words: read them as a hint, not as evidence. Bond is a filter, not a split.
        </p>
      </div>

      <CompareFilters methods={methods.data?.items ?? []} steels={steels.data?.items ?? []} />

      <div className="flex flex-wrap items-center justify-between gap-3">
        <div role="group" aria-label="How to show the comparison" className="inline-flex flex-wrap gap-1">
          {VIEWS.map((v) => (
            <Button key={v.id} size="sm" variant={view === v.id ? 'primary' : 'secondary'} aria-pressed={view === v.id} onClick={() => update({ view: v.id === 'table' ? undefined : v.id }, { keepPage: true })}>
              {v.label}
            </Button>
          ))}
        </div>
        <div className="inline-flex flex-wrap items-center gap-2">
          <label className="inline-flex items-center gap-2 text-sm">
            <span>Grit written as</span>
            <Select className="w-auto! py-1" value={notation} onChange={(e) => update({ notation: e.target.value === 'jis' ? undefined : e.target.value }, { keepPage: true })}>
              {NOTATIONS.map((n) => (
                <option key={n} value={n}>
                  µm and {GRIT_STANDARD_SHORT_LABELS[n]}
                </option>
              ))}
            </Select>
          </label>
          <Button size="sm" variant={ranked ? 'primary' : 'secondary'} aria-pressed={ranked} onClick={() => update({ sort: ranked ? undefined : 'ranked' })}>
            Ranked order
          </Button>
          <a className={buttonClasses('secondary', 'sm')} href={exportHref({ ...filters, sort: params.sort }, 'csv')} download>
            Export CSV
          </a>
          <a className={buttonClasses('secondary', 'sm')} href={exportHref({ ...filters, sort: params.sort }, 'json')} download>
            Export JSON
          </a>
        </div>
      </div>

      {data ? (
        <div className="space-y-1 text-sm">
          <p>
            Comparing results measured with <Link to={paths.method.getHref(data.method.slug)}>{data.method.name}</Link> only
            {data.method.replaces ? (
              <>
                {' '}
                (it replaces <Link to={paths.compare.getHref({ ...filters, method: data.method.replaces })}>an earlier version</Link>, compared on its own)
              </>
            ) : null}
            {data.method.replacedBy ? (
              <>
                {' '}
                — a <Link to={paths.compare.getHref({ ...filters, method: data.method.replacedBy })}>newer version</Link> exists
              </>
            ) : null}
            . {data.total} cell{data.total === 1 ? '' : 's'} from {data.totalResults} results; grit bands {data.step === 1 ? 'one' : 'half a'} φ wide.
          </p>
          {live.length ? <p className="text-muted">The {live.join(', ')} filter needs each result, so this view is worked out from the results as you asked (a moment slower than the precomputed cells).</p> : null}
          {ranked ? (
            <p className="max-w-3xl rounded-md border border-rule bg-paper px-3 py-2">
              <strong className="font-semibold">Ranked order</strong> sorts by each cell’s median pulled toward the method’s overall median ({formatNumber(data.shrinkage.overallMedianG, 0)} g) as if the cell held {SHRINKAGE_PSEUDO_RESULTS} more results sitting exactly there: (n × median + {SHRINKAGE_PSEUDO_RESULTS} × overall) ÷ (n + {SHRINKAGE_PSEUDO_RESULTS}). A cell of 2 results moves {formatNumber(shrinkageShare(2) * 100, 0)} % of the way, a cell of 30 only {formatNumber(shrinkageShare(30) * 100, 0)} %, so two lucky results cannot top the table. The “Ranked g” column shows the pulled value; the medians themselves are unchanged.
            </p>
          ) : null}
        </div>
      ) : null}

      {params.a && !params.b ? (
        <p className="text-sm" role="status">
          Cell A chosen for the paired comparison; choose “Pair” on a second cell.
        </p>
      ) : null}
      {pairPanel && !pairUnderRow ? pairPanel : null}
      {cellPanel && !cellUnderRow ? cellPanel : null}

      <div aria-live="polite" aria-busy={compare.isFetching}>
        {view === 'charts' ? (
          <ErrorBoundary fallback={(_error, reset) => <ErrorState title="The charts could not be drawn" error={new Error('The table view has the same data; or try again.')} onRetry={reset} />}>
            <Suspense fallback={<Loading label="Loading the charts…" />}>
              <CompareCharts filters={filters} chartSteel={params.cs} onChartSteel={(cs) => update({ cs }, { keepPage: true })} />
            </Suspense>
          </ErrorBoundary>
        ) : compare.isPending ? (
          <Loading label="Computing the comparison…" />
        ) : compare.isError ? (
          <ErrorState error={compare.error} onRetry={() => compare.refetch()} />
        ) : data!.rows.length === 0 ? (
          <Empty title="No published results match these filters">Widen a range or clear a filter.</Empty>
        ) : view === 'grid' ? (
          <CompareGrid rows={data!.rows} onOpenCell={onOpenCell} openCell={params.cell} />
        ) : (
          <>
            <CompareTable rows={data!.rows} sort={params.sort} onToggleSort={(column) => update((current) => ({ sort: nextSort(current.get('sort') ?? undefined, column) }))} onSort={(sort) => update({ sort })} openCell={params.cell} onOpenCell={onOpenCell} pair={{ a: params.a, b: params.b }} onPair={onPair} notation={notation} ranked={ranked} panelFor={panelFor} />
            {pages > 1 ? (
              <nav aria-label="Pages of the comparison" className="mt-3 flex items-center gap-3 text-sm">
                <Button size="sm" variant="secondary" disabled={page <= 1} onClick={() => update({ page: page - 1 > 1 ? String(page - 1) : undefined })}>
                  ← Previous {data!.pageSize}
                </Button>
                <span className="text-muted">
                  Page {page} of {pages}
                </span>
                <Button size="sm" variant="secondary" disabled={page >= pages} onClick={() => update({ page: String(page + 1) })}>
                  Next {data!.pageSize} →
                </Button>
              </nav>
            ) : null}
          </>
        )}
      </div>
    </div>
  );
}
