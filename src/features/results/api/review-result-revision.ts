import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReviewInput } from '@shared/schemas/result';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Result, ResultRevision } from '@/types/api';

/** POST /api/results/:id/revisions/:rev/review: a moderator approves, returns or rejects a correction. */
export function reviewResultRevision(id: number, rev: number, input: ReviewInput): Promise<{ result: Result; revision: ResultRevision }> {
  return apiPost(`/api/results/${id}/revisions/${rev}/review`, input);
}

/** Decides on a correction; an approval changes the comparison and search, so they are refreshed too. */
export function useReviewResultRevision(options: { onSuccess?: (done: { result: Result; revision: ResultRevision }) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, rev, input }: { id: number; rev: number; input: ReviewInput }) => reviewResultRevision(id, rev, input),
    onSuccess: (done) => {
      queryClient.setQueryData(queryKeys.results.detail(done.result.id), done.result);
      void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk });
      void queryClient.invalidateQueries({ queryKey: queryKeys.results.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.compare.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.search.all });
      options.onSuccess?.(done);
    },
    onError: (error) => {
      if ((error as { status?: number }).status === 409) void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk });
    },
  });
}
