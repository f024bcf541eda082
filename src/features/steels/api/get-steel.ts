import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { SteelDetail } from '@/types/api';

/** GET /api/steels/:slug: the reference page of one of the steel grades. */
export function getSteel(slug: string, signal?: AbortSignal): Promise<SteelDetail> {
  return apiGet<SteelDetail>(`/api/steels/${encodeURIComponent(slug)}`, {}, signal);
}

/** Query options for one reference page. */
export const steelQueryOptions = (slug: string) =>
  queryOptions({
    queryKey: queryKeys.steels.detail(slug),
    queryFn: ({ signal }) => getSteel(slug, signal),
    staleTime: 5 * 60_000,
  });

/** One reference page, as a query. */
export function useSteel(slug: string) {
  return useQuery(steelQueryOptions(slug));
}
