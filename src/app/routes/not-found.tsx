import { Link, useLocation } from 'react-router-dom';
import { paths } from '@/config/paths';
import { PageTitle } from '@/components/ui/page-title';

/** Any address that is not a page. */
export default function NotFoundRoute() {
  const location = useLocation();
  return (
    <div className="flex max-w-2xl flex-col gap-4">
      <PageTitle title="Page not found">Page not found</PageTitle>
      <p>
        There is no page at <code className="rounded bg-panel px-1">{location.pathname}</code>.
      </p>
      <ul className="list-disc space-y-1 pl-6">
        <li>
          <Link to={paths.home.getHref()}>Home page</Link>
        </li>
        <li>
          <Link to={paths.search.getHref()}>Search</Link>
        </li>
        <li>
          <Link to={paths.compare.getHref()}>Compare results</Link>
        </li>
      </ul>
    </div>
  );
}
