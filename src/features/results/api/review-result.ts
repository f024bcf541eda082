import { useMutation, useQueryClient } from '@tanstack/react-query';
import { reviewInputSchema, type ReviewInput } from '@shared/schemas/result';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Result } from '@/types/api';

/** The input schema of POST /api/results/:id/review, shared with the server. */
export { reviewInputSchema };
export type { ReviewInput };

/** POST /api/results/:id/review: approve, return with a note, or reject with a reason (409 if already decided). */
export function reviewResult(id: number, input: ReviewInput): Promise<Result> {
  return apiPost<Result>(`/api/results/${id}/review`, input);
}

/**
 * Records a decision. An approval changes the comparison and search, so those are refreshed
 * along with the queue and the result itself.
 */
export function useReviewResult(options: { onSuccess?: (result: Result) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: ReviewInput }) => reviewResult(id, input),
    onSuccess: (result) => {
      queryClient.setQueryData(queryKeys.results.detail(result.id), result);
      queryClient.setQueryData<{ items: Result[] }>(queryKeys.reviewDesk, (desk) =>
        desk ? { ...desk, items: desk.items.filter((item) => item.id !== result.id) } : desk,
      );
      void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk });
      void queryClient.invalidateQueries({ queryKey: queryKeys.results.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.compare.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.search.all });
      options.onSuccess?.(result);
    },
    onError: (error) => {
      // 409: someone else decided first; the queue is out of date.
      if ((error as { status?: number }).status === 409) void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk });
    },
  });
}
