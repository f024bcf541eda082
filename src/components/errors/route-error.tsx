import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { paths } from '@/config/paths';
import { ErrorState } from '@/components/ui/states';

/**
 * Shown in place of one page when it fails (its code could not load, or it threw while
 * rendering); the header and the rest of the site keep working.
 */
export function RouteError() {
  const error = useRouteError();
  const chunkFailed = error instanceof TypeError && /dynamically imported module|Importing a module/i.test(error.message);
  return (
    <div className="flex flex-col gap-4">
      <ErrorState
        title={chunkFailed ? 'This page could not be loaded' : 'This page ran into a problem'}
        error={
          isRouteErrorResponse(error)
            ? new Error(`${error.status} ${error.statusText}`)
            : chunkFailed
              ? new Error('A newer version of Edgeledger may have been published. Reload the page.')
              : error
        }
        onRetry={() => window.location.reload()}
      />
      <p>
        <Link to={paths.home.getHref()}>Back to the home page</Link>
      </p>
    </div>
  );
}
