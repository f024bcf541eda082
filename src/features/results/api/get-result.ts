import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Result } from '@/types/api';

/** GET /api/results/:id: one result with its derived values (and, for its author and moderators, its trail). */
export function getResult(id: number, signal?: AbortSignal): Promise<Result> {
  return apiGet<Result>(`/api/results/${id}`, {}, signal);
}

/** Query options for one result. */
export const resultQueryOptions = (id: number) =>
  queryOptions({
    queryKey: queryKeys.results.detail(id),
    queryFn: ({ signal }) => getResult(id, signal),
  });

/** One result, as a query. */
export function useResult(id: number) {
  return useQuery({ ...resultQueryOptions(id), enabled: Number.isInteger(id) && id > 0 });
}
