import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useUser } from '@/lib/auth';
import { SignInRequired } from '@/lib/authorization';
import { buttonClasses } from '@/components/ui/button';
import { PageTitle } from '@/components/ui/page-title';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useResults } from '@/features/results/api/get-results';
import { ResultsTable } from '@/features/results/components/results-table';
import { OwnPageSections } from '@/features/me/components/own-page';

function MyResultsList({ handle }: { handle: string }) {
  const results = useResults({ author: handle, page: 1 });
  if (results.isPending) return <Loading label="Loading your results…" />;
  if (results.isError) return <ErrorState error={results.error} onRetry={() => results.refetch()} />;
  if (results.data.items.length === 0) {
    return (
      <Empty title="You have not posted a result yet">
        <Link to={paths.newResult.getHref()} className={buttonClasses('primary')}>
          Post a result
        </Link>
      </Empty>
    );
  }
  return (
    <ResultsTable
      results={results.data.items}
      label="My results"
      caption="Every state: awaiting review, published, changes asked, declined. Open a result to read its full trail."
      showStatus
      hideAuthor
    />
  );
}

/** My results (signed in): each of one's own results with its state and the reviewer's note. */
export default function MyResultsRoute() {
  const user = useUser();
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="My results" lead="What you have posted, and where each result stands in review.">
        My results
      </PageTitle>
      <SignInRequired what="see your results">
        {user ? <OwnPageSections /> : null}
        {user ? (
          <section aria-labelledby="all-results" className="mt-8 flex flex-col gap-2">
            <h2 id="all-results" className="text-xl font-semibold">
              All your results
            </h2>
            <MyResultsList handle={user.handle} />
          </section>
        ) : null}
      </SignInRequired>
    </div>
  );
}
