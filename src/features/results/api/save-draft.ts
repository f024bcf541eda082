import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ResultInput } from '@shared/schemas/result';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Result } from '@/types/api';

/** POST /api/results/drafts: keeps a result as a draft (not on the review desk), 201 with it. */
export function saveDraft(input: ResultInput): Promise<Result> {
  return apiPost<Result>('/api/results/drafts', input);
}

/** Saves a new draft; own lists are refreshed. */
export function useSaveDraft() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveDraft,
    onSuccess: (result) => {
      queryClient.setQueryData(queryKeys.results.detail(result.id), result);
      void queryClient.invalidateQueries({ queryKey: queryKeys.me });
    },
  });
}
