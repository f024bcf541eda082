import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { MethodSummary } from '@/types/api';

/** GET /api/methods: every test methods Edgeledger has a reference page for. */
export function getMethods(signal?: AbortSignal): Promise<{ items: MethodSummary[] }> {
  return apiGet<{ items: MethodSummary[] }>('/api/methods', {}, signal);
}

/** Query options for the list of test methods; reference data changes rarely, so it stays fresh for five minutes. */
export const methodsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.methods.list(),
    queryFn: ({ signal }) => getMethods(signal),
    staleTime: 5 * 60_000,
  });

/** The list of test methods, as a query. */
export function useMethods() {
  return useQuery(methodsQueryOptions());
}
