import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { limits } from '@shared/validations';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { SearchHitType, SearchResponse } from '@/types/api';

/** GET /api/search: hits across steels, abrasives, methods and published results, with counts per type. */
export function search(q: string, type?: SearchHitType, signal?: AbortSignal): Promise<SearchResponse> {
  return apiGet<SearchResponse>('/api/search', { q, type }, signal);
}

/** Query options for a search; a blank query asks nothing, and earlier hits stay while typing. */
export const searchQueryOptions = (q: string, type?: SearchHitType) =>
  queryOptions({
    queryKey: queryKeys.search.query(q, type),
    queryFn: ({ signal }) => search(q, type, signal),
    enabled: q.trim().length > 0 && q.length <= limits.searchQueryMax,
    placeholderData: keepPreviousData,
    staleTime: 15_000,
  });

/** Search hits for `q`, as a query. */
export function useSearch(q: string, type?: SearchHitType) {
  return useQuery(searchQueryOptions(q, type));
}
