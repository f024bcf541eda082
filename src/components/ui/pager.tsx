import { Link } from 'react-router-dom';

/** Previous / next links for a paged list, with "page 2 of 7" in words. */
export function Pager({ page, pageSize, total, hrefFor }: { page: number; pageSize: number; total: number; hrefFor: (page: number) => string }) {
  const pages = Math.max(1, Math.ceil(total / Math.max(1, pageSize)));
  if (pages <= 1) return null;
  return (
    <nav aria-label="Pages" className="mt-4 flex items-center gap-4">
      {page > 1 ? <Link to={hrefFor(page - 1)}>← Newer</Link> : <span className="text-muted">← Newer</span>}
      <span className="text-sm text-muted">
        Page {page} of {pages}
      </span>
      {page < pages ? <Link to={hrefFor(page + 1)}>Older →</Link> : <span className="text-muted">Older →</span>}
    </nav>
  );
}
