import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { AbrasiveDetail } from '@/types/api';

/** GET /api/abrasives/:slug: the reference page of one of the abrasive types. */
export function getAbrasive(slug: string, signal?: AbortSignal): Promise<AbrasiveDetail> {
  return apiGet<AbrasiveDetail>(`/api/abrasives/${encodeURIComponent(slug)}`, {}, signal);
}

/** Query options for one reference page. */
export const abrasiveQueryOptions = (slug: string) =>
  queryOptions({
    queryKey: queryKeys.abrasives.detail(slug),
    queryFn: ({ signal }) => getAbrasive(slug, signal),
    staleTime: 5 * 60_000,
  });

/** One reference page, as a query. */
export function useAbrasive(slug: string) {
  return useQuery(abrasiveQueryOptions(slug));
}
