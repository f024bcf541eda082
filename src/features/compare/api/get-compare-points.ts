import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { CompareFilters } from '@/config/paths';

/** One result as a chart point (grams-force, µm, HRC, degrees per side, cuts). */
export interface ComparePoint {
  id: number;
  steel: string;
  abrasive: string;
  material: string;
  gritUm: number;
  medianG: number;
  hrc: number;
  perSideDeg: number;
  retentionCuts: number | null;
  author: string | null;
}

/** The answer of GET /api/compare/points. */
export interface ComparePointsResponse {
  method: { slug: string; name: string; version: number };
  total: number;
  sampledEvery: number;
  points: ComparePoint[];
  steels: Record<string, string>;
  abrasives: Record<string, { name: string; material: string; bond: string }>;
}

/** GET /api/compare/points: the view's results as chart points. */
export function getComparePoints(params: CompareFilters, signal?: AbortSignal): Promise<ComparePointsResponse> {
  return apiGet<ComparePointsResponse>('/api/compare/points', { ...params }, signal);
}

/** Query options for the chart points. */
export const comparePointsQueryOptions = (params: CompareFilters) =>
  queryOptions({ queryKey: queryKeys.compare.points(params), queryFn: ({ signal }) => getComparePoints(params, signal) });

/** The chart points, as a query. */
export function useComparePoints(params: CompareFilters) {
  return useQuery(comparePointsQueryOptions(params));
}
