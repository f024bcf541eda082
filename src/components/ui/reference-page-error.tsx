import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { PageTitle } from './page-title';
import { ErrorState } from './states';

/**
 * A reference page that could not be read: "no such steel" (with a way on: the list and a search
 * for what was asked) when the server answered 404, the error and a retry otherwise.
 */
export function ReferencePageError({ error, onRetry, what, slug, list }: { error: unknown; onRetry: () => void; what: string; slug: string; list: { href: string; label: string } }) {
  if (error instanceof ApiError && error.status === 404) {
    const words = slug.replace(/-/g, ' ');
    return (
      <div className="flex max-w-2xl flex-col gap-4">
        <PageTitle title={`No such ${what}`}>No such {what}</PageTitle>
        <p>
          There is no {what} page called <code className="rounded bg-panel px-1">{slug}</code>. It may have been renamed or merged, or the address may be mistyped.
        </p>
        <ul className="list-disc space-y-1 pl-6">
          <li>
            <Link to={list.href}>{list.label}</Link>
          </li>
          <li>
            <Link to={paths.search.getHref(words)}>Search for “{words}”</Link>
          </li>
        </ul>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-4">
      <ErrorState error={error} onRetry={onRetry} />
      <Link to={list.href}>{list.label}</Link>
    </div>
  );
}
