import { useMutation, useQueryClient } from '@tanstack/react-query';
import { retractInputSchema } from '@shared/schemas/publishing';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Result } from '@/types/api';

export { retractInputSchema };

/** POST /api/results/:id/retract (the author): withdraws a published result, keeping it. */
export function useRetractResult() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, reason }: { id: number; reason: string }) => apiPost<Result>(`/api/results/${id}/retract`, { reason }),
    onSuccess: (result) => {
      queryClient.setQueryData(queryKeys.results.detail(result.id), result);
      void queryClient.invalidateQueries({ queryKey: queryKeys.results.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.compare.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.search.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.me });
    },
  });
}
