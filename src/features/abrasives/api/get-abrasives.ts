import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { AbrasiveSummary } from '@/types/api';

/** GET /api/abrasives: every abrasive types Edgeledger has a reference page for. */
export function getAbrasives(signal?: AbortSignal): Promise<{ items: AbrasiveSummary[] }> {
  return apiGet<{ items: AbrasiveSummary[] }>('/api/abrasives', {}, signal);
}

/** Query options for the list of abrasive types; reference data changes rarely, so it stays fresh for five minutes. */
export const abrasivesQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.abrasives.list(),
    queryFn: ({ signal }) => getAbrasives(signal),
    staleTime: 5 * 60_000,
  });

/** The list of abrasive types, as a query. */
export function useAbrasives() {
  return useQuery(abrasivesQueryOptions());
}
