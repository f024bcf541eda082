import { useMutation, useQueryClient } from '@tanstack/react-query';
import { resultInputSchema, type ResultInput } from '@shared/schemas/result';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Result } from '@/types/api';

/** The input schema of POST /api/results, shared with the server. */
export { resultInputSchema };
export type { ResultInput };

/** POST /api/results: submits a measured edge; the server answers 201 with the stored result ("pending"). */
export function createResult(input: ResultInput): Promise<Result> {
  return apiPost<Result>('/api/results', input);
}

/** Submits a result; own lists and the review desk are refreshed, and the new result is cached. */
export function useCreateResult() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createResult,
    onSuccess: (result) => {
      queryClient.setQueryData(queryKeys.results.detail(result.id), result);
      void queryClient.invalidateQueries({ queryKey: queryKeys.results.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk });
    },
  });
}
