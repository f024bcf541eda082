import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { flagResolutionSchema, type FlagResolutionInput, type ReviewDeskQuery } from '@shared/schemas/publishing';
import { apiGet, apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { DeskFlag, DeskImport } from '../types';

export { flagResolutionSchema };

/** GET /api/review-desk: the open flags and the imports still pending (the results list is the desk's own). */
export function getDeskExtras(filters: ReviewDeskQuery, signal?: AbortSignal) {
  return apiGet<{ flags: DeskFlag[]; imports: DeskImport[] }>('/api/review-desk', { ...filters }, signal);
}

export const deskExtrasQueryOptions = (filters: ReviewDeskQuery) =>
  queryOptions({ queryKey: [...queryKeys.reviewDesk, 'extras', filters] as const, queryFn: ({ signal }) => getDeskExtras(filters, signal), staleTime: 0 });

/** Flags and imports on the desk, as a query (refreshed whenever the desk is). */
export function useDeskExtras(filters: ReviewDeskQuery) {
  return useQuery(deskExtrasQueryOptions(filters));
}

const refreshAfterDecision = (queryClient: ReturnType<typeof useQueryClient>) => {
  void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk });
  void queryClient.invalidateQueries({ queryKey: queryKeys.results.all });
  void queryClient.invalidateQueries({ queryKey: queryKeys.compare.all });
  void queryClient.invalidateQueries({ queryKey: queryKeys.search.all });
};

/** POST /api/review-desk/bulk-approve `{ importId }`: approves every still-pending result of an import. */
export function useBulkApprove() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { importId: number; note?: string } | { ids: number[]; note?: string }) =>
      apiPost<{ approved: number[]; refused: { id: number; reason: string }[] }>('/api/review-desk/bulk-approve', input),
    onSuccess: () => refreshAfterDecision(queryClient),
  });
}

/** POST /api/flags/:id/resolve: closes a flag as upheld or dismissed (409 when someone closed it first). */
export function useResolveFlag() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: FlagResolutionInput }) => apiPost<DeskFlag>(`/api/flags/${id}/resolve`, input),
    onSettled: () => void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk }),
  });
}
