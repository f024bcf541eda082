import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { History, WikiSection } from '../types';

/** GET /api/{section}/:slug/revisions: every revision the viewer may see, newest first, and page actions. */
export function getHistory(section: WikiSection, slug: string, signal?: AbortSignal): Promise<History> {
  return apiGet<History>(`/api/${section}/${encodeURIComponent(slug)}/revisions`, {}, signal);
}

/** Query options for a page's history. */
export const historyQueryOptions = (section: WikiSection, slug: string) =>
  queryOptions({
    queryKey: queryKeys.wiki.history(section, slug),
    queryFn: ({ signal }) => getHistory(section, slug, signal),
    staleTime: 0,
  });

/** A page's history, as a query. */
export function useHistory(section: WikiSection, slug: string) {
  return useQuery(historyQueryOptions(section, slug));
}
