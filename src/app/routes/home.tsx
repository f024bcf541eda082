import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { PageTitle } from '@/components/ui/page-title';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useResults } from '@/features/results/api/get-results';
import { LatestResultsTable } from '@/features/results/components/latest-results-table';
import { SearchForm } from '@/features/search/components/search-form';

/** Home: what Edgeledger is, the demo notice, a search box and the latest published results. */
export default function HomeRoute() {
  const latest = useResults({ status: 'approved', page: 1 });
  return (
    <div className="flex flex-col gap-10">
      <div className="grid gap-8 lg:grid-cols-[3fr_2fr] lg:items-end">
        <PageTitle
          title="Measured edges"
          lead="Edgeledger collects measured sharpening results (which abrasive, at which grit and angle, gave which edge on which steel, and how long it lasted) beside a reference wiki of steels, abrasives and test methods."
        >
          Measured edges, shown with their method and spread
        </PageTitle>
        <SearchForm />
      </div>

      <p role="note" className="rounded-md border border-caution/40 bg-caution-soft px-4 py-3">
        <strong className="font-semibold">Demo:</strong> the people, results and reference notes here are invented
        to show how Edgeledger works. They are not measurements.
      </p>

      <section aria-labelledby="latest">
        <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="latest" className="text-2xl font-semibold">
            Latest published results
          </h2>
          <span className="flex gap-4">
            <Link to={paths.results.getHref()}>All results</Link>
            <Link to={paths.compare.getHref()}>Compare</Link>
          </span>
        </div>
        {latest.isPending ? (
          <Loading label="Loading the latest results…" />
        ) : latest.isError ? (
          <ErrorState error={latest.error} onRetry={() => latest.refetch()} />
        ) : latest.data.items.length === 0 ? (
          <Empty title="No results are published yet">Results appear here once a moderator has reviewed them.</Empty>
        ) : (
          <LatestResultsTable results={latest.data.items.slice(0, 10)} label="Table of the latest results" />
        )}
      </section>
    </div>
  );
}
