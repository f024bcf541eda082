import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CompareRow } from '@shared/compare-view';
import type { OrderInterval } from '@shared/compare-paired';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { CompareFilters } from '@/config/paths';

/** The answer of GET /api/compare/paired (shared/compare-paired.ts explains the figures). */
export interface ComparePairedResponse {
  method: { slug: string; name: string; version: number };
  a: CompareRow | null;
  b: CompareRow | null;
  unpairedMedianDiffG: number | null;
  paired: {
    pairs: { tester: string; nA: number; nB: number; medianAG: number; medianBG: number; diffG: number }[];
    n: number;
    medianDiffG: number | null;
    ci95: OrderInterval | null;
    widest: OrderInterval | null;
    signs: { aLower: number; bLower: number; ties: number };
    unpairedTesters: { a: number; b: number };
  };
}

/** GET /api/compare/paired: tester-paired differences between cells a and b. */
export function getComparePaired(params: CompareFilters, signal?: AbortSignal): Promise<ComparePairedResponse> {
  return apiGet<ComparePairedResponse>('/api/compare/paired', { ...params }, signal);
}

/** Query options for the paired comparison. */
export const comparePairedQueryOptions = (params: CompareFilters) =>
  queryOptions({ queryKey: queryKeys.compare.paired(params), queryFn: ({ signal }) => getComparePaired(params, signal) });

/** The paired comparison, as a query (off until two cells are chosen). */
export function useComparePaired(params: CompareFilters, enabled: boolean) {
  return useQuery({ ...comparePairedQueryOptions(params), enabled });
}
