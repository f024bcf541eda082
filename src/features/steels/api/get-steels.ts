import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { SteelSummary } from '@/types/api';

/** GET /api/steels: every steel grades Edgeledger has a reference page for. */
export function getSteels(signal?: AbortSignal): Promise<{ items: SteelSummary[] }> {
  return apiGet<{ items: SteelSummary[] }>('/api/steels', {}, signal);
}

/** Query options for the list of steel grades; reference data changes rarely, so it stays fresh for five minutes. */
export const steelsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.steels.list(),
    queryFn: ({ signal }) => getSteels(signal),
    staleTime: 5 * 60_000,
  });

/** The list of steel grades, as a query. */
export function useSteels() {
  return useQuery(steelsQueryOptions());
}
