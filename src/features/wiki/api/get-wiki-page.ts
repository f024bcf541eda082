import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { WikiPage, WikiSection } from '../types';

/** GET /api/{section}/:slug: a page with its wiki parts (revision, citations, permissions). */
export function getWikiPage(section: WikiSection, slug: string, signal?: AbortSignal): Promise<WikiPage> {
  return apiGet<WikiPage>(`/api/${section}/${encodeURIComponent(slug)}`, {}, signal);
}

/** Query options for a page as the editor needs it; shares its key with the section's detail page. */
export const wikiPageQueryOptions = (section: WikiSection, slug: string) =>
  queryOptions({
    queryKey: queryKeys.wiki.page(section, slug),
    queryFn: ({ signal }) => getWikiPage(section, slug, signal),
    staleTime: 0,
  });

/** One page, as a query. */
export function useWikiPage(section: WikiSection, slug: string) {
  return useQuery(wikiPageQueryOptions(section, slug));
}
