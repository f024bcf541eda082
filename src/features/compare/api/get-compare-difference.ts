import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CompareRow } from '@shared/compare-view';
import type { CellDifference } from '@shared/compare-difference';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { CompareFilters } from '@/config/paths';

/** The answer of GET /api/compare/difference (shared/compare-difference.ts explains the figures). */
export interface CompareDifferenceResponse extends CellDifference {
  method: { slug: string; name: string; version: number };
  a: CompareRow | null;
  b: CompareRow | null;
}

/** GET /api/compare/difference: the shift B − A between cells a and b, as independent samples. */
export function getCompareDifference(params: CompareFilters, signal?: AbortSignal): Promise<CompareDifferenceResponse> {
  return apiGet<CompareDifferenceResponse>('/api/compare/difference', { ...params }, signal);
}

/** Query options for the difference of two cells. */
export const compareDifferenceQueryOptions = (params: CompareFilters) =>
  queryOptions({ queryKey: queryKeys.compare.difference(params), queryFn: ({ signal }) => getCompareDifference(params, signal) });

/** The difference of two cells, as a query (off until two are chosen). */
export function useCompareDifference(params: CompareFilters, enabled: boolean) {
  return useQuery({ ...compareDifferenceQueryOptions(params), enabled });
}
