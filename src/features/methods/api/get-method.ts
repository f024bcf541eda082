import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { MethodDetail } from '@/types/api';

/** GET /api/methods/:slug: the reference page of one of the test methods. */
export function getMethod(slug: string, signal?: AbortSignal): Promise<MethodDetail> {
  return apiGet<MethodDetail>(`/api/methods/${encodeURIComponent(slug)}`, {}, signal);
}

/** Query options for one reference page. */
export const methodQueryOptions = (slug: string) =>
  queryOptions({
    queryKey: queryKeys.methods.detail(slug),
    queryFn: ({ signal }) => getMethod(slug, signal),
    staleTime: 5 * 60_000,
  });

/** One reference page, as a query. */
export function useMethod(slug: string) {
  return useQuery(methodQueryOptions(slug));
}
