import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CompareRow } from '@shared/compare-view';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { CompareFilters } from '@/config/paths';

/** The answer of GET /api/compare (server/queries/compare.ts). */
export interface CompareResponse {
  method: { slug: string; name: string; version: number; replaces: string | null; replacedBy: string | null };
  step: 1 | 0.5;
  source: 'cells' | 'results';
  liveFilters: string[];
  sort: string | null;
  total: number;
  totalResults: number;
  methodResults: number;
  shrinkage: { pseudoResults: number; overallMedianG: number | null };
  page: number;
  pageSize: number;
  rows: CompareRow[];
}

/** GET /api/compare: one page of cells (method × steel × abrasive material × grit band). */
export function getCompare(params: CompareFilters, signal?: AbortSignal): Promise<CompareResponse> {
  return apiGet<CompareResponse>('/api/compare', { ...params }, signal);
}

/** Query options for the comparison; the old table stays while a changed filter loads. */
export const compareQueryOptions = (params: CompareFilters) =>
  queryOptions({
    queryKey: queryKeys.compare.table(params),
    queryFn: ({ signal }) => getCompare(params, signal),
    placeholderData: keepPreviousData,
  });

/** The comparison, as a query. */
export function useCompare(params: CompareFilters) {
  return useQuery(compareQueryOptions(params));
}
