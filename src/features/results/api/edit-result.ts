import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ResultInput } from '@shared/schemas/result';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { ResultEdit } from '@/types/api';

/**
 * PUT /api/results/:id (the author): a draft, pending or returned result is updated and goes
 * (back) on the review desk (200); a published one gets a correction that waits for a
 * moderator (202). With `keepDraft`, PUT /api/results/:id/draft saves a draft as a draft.
 */
export function editResult(id: number, input: ResultInput, keepDraft = false): Promise<ResultEdit> {
  return apiRequest<ResultEdit>(`/api/results/${id}${keepDraft ? '/draft' : ''}`, { method: 'PUT', body: input });
}

/** Edits a result; the result, its revisions, own lists and the desk are refreshed. */
export function useEditResult() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input, keepDraft }: { id: number; input: ResultInput; keepDraft?: boolean }) => editResult(id, input, keepDraft),
    onSuccess: (edit) => {
      queryClient.setQueryData(queryKeys.results.detail(edit.result.id), edit.result);
      void queryClient.invalidateQueries({ queryKey: queryKeys.results.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk });
      void queryClient.invalidateQueries({ queryKey: queryKeys.me });
    },
  });
}
