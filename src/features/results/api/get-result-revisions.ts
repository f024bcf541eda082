import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { ResultRevision } from '@/types/api';

/** GET /api/results/:id/revisions: every version, newest first (others see only versions that were the result). */
export function getResultRevisions(id: number, signal?: AbortSignal): Promise<{ items: ResultRevision[] }> {
  return apiGet<{ items: ResultRevision[] }>(`/api/results/${id}/revisions`, {}, signal);
}

export const resultRevisionsQueryOptions = (id: number) =>
  queryOptions({ queryKey: queryKeys.results.revisions(id), queryFn: ({ signal }) => getResultRevisions(id, signal) });

/** A result's revisions, as a query. */
export function useResultRevisions(id: number) {
  return useQuery(resultRevisionsQueryOptions(id));
}
