import { PageTitle } from '@/components/ui/page-title';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useCompare } from '@/features/compare/api/get-compare';
import { CompareFilters, useCompareFilters } from '@/features/compare/components/compare-filters';
import { CompareTable, FEW_RESULTS } from '@/features/compare/components/compare-table';
import { useMethods } from '@/features/methods/api/get-methods';
import { useSteels } from '@/features/steels/api/get-steels';

/** The comparison: published results grouped into cells, with sample size and spread; filters live in the URL. */
export default function CompareRoute() {
  const [filters] = useCompareFilters();
  const compare = useCompare(filters);
  const methods = useMethods();
  const steels = useSteels();

  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Compare" lead="Published results side by side, with how many there are and how much they spread.">
        Compare
      </PageTitle>
      <p className="max-w-3xl">
        Each row is a <strong className="font-semibold">cell</strong>: the published results measured with one method on
        one steel, finished on one abrasive material within one grit band. <em>n</em> counts the results in the cell and{' '}
        <em>testers</em> the different people who posted them; each result counts with its median reading. Rows with fewer
        than {FEW_RESULTS} results or a single tester are marked: read them as a hint, not as evidence.
      </p>
      <CompareFilters methods={methods.data?.items ?? []} steels={steels.data?.items ?? []} />
      <div aria-live="polite" aria-busy={compare.isFetching}>
        {compare.isPending ? (
          <Loading label="Computing the comparison…" />
        ) : compare.isError ? (
          <ErrorState error={compare.error} onRetry={() => compare.refetch()} />
        ) : compare.data.rows.length === 0 ? (
          <Empty title="No published results match these filters">Widen the hardness range or clear a filter.</Empty>
        ) : (
          <>
            <p className="mb-2 text-sm text-muted">
              {compare.data.rows.length} cell{compare.data.rows.length === 1 ? '' : 's'} from{' '}
              {compare.data.rows.reduce((sum, r) => sum + r.n, 0)} results
            </p>
            <CompareTable rows={compare.data.rows} />
          </>
        )}
      </div>
    </div>
  );
}
