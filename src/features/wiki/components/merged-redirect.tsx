import { useEffect } from 'react';
import { useLocation, useNavigate, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import type { WikiSection } from '../types';

/**
 * A merged page's address answers with the page it was merged into (the API's 301 is followed
 * by the browser). This moves the address bar to the surviving page and returns the old slug,
 * so the page can say where the visitor came from.
 */
export function useMergedRedirect(section: WikiSection, slug: string): string | null {
  const params = useParams();
  const navigate = useNavigate();
  const location = useLocation();
  useEffect(() => {
    if (params.slug && params.slug !== slug) navigate(paths.wiki.page(section, slug), { replace: true, state: { mergedFrom: params.slug } });
  }, [params.slug, slug, section, navigate]);
  return (location.state as { mergedFrom?: string } | null)?.mergedFrom ?? null;
}

/** A note that the visitor followed the address of a page merged into this one. */
export function MergedNote({ from }: { from: string | null }) {
  if (!from) return null;
  return (
    <p role="status" className="rounded-md border border-rule bg-panel px-4 py-2 text-sm">
      “{from}” was merged into this page; its address leads here now.
    </p>
  );
}
