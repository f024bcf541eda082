import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CompareRow } from '@shared/compare-view';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { CompareFilters } from '@/config/paths';
import type { Result } from '@/types/api';

/** The answer of GET /api/compare/cell: the cell's figures and a page of its results. */
export interface CompareCellResponse {
  method: { slug: string; name: string; version: number };
  cell: CompareRow | null;
  items: Result[];
  page: number;
  pageSize: number;
  total: number;
}

/** GET /api/compare/cell: one cell's results under the view's filters. */
export function getCompareCell(params: CompareFilters, signal?: AbortSignal): Promise<CompareCellResponse> {
  return apiGet<CompareCellResponse>('/api/compare/cell', { ...params }, signal);
}

/** Query options for a cell's results. */
export const compareCellQueryOptions = (params: CompareFilters) =>
  queryOptions({ queryKey: queryKeys.compare.cell(params), queryFn: ({ signal }) => getCompareCell(params, signal), placeholderData: keepPreviousData });

/** A cell's results, as a query (off while no cell is open). */
export function useCompareCell(params: CompareFilters, enabled: boolean) {
  return useQuery({ ...compareCellQueryOptions(params), enabled });
}
