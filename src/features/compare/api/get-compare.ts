import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { CompareFilters } from '@/config/paths';
import type { CompareRow } from '@/types/api';

/** GET /api/compare: published results grouped by method × steel × abrasive material × grit band. */
export function getCompare(filters: CompareFilters, signal?: AbortSignal): Promise<{ rows: CompareRow[] }> {
  return apiGet<{ rows: CompareRow[] }>('/api/compare', { ...filters }, signal);
}

/** Query options for the comparison; the old table stays while a changed filter loads. */
export const compareQueryOptions = (filters: CompareFilters) =>
  queryOptions({
    queryKey: queryKeys.compare.table(filters),
    queryFn: ({ signal }) => getCompare(filters, signal),
    placeholderData: keepPreviousData,
  });

/** The comparison table, as a query. */
export function useCompare(filters: CompareFilters) {
  return useQuery(compareQueryOptions(filters));
}
