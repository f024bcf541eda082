import { useMutation, useQueryClient } from '@tanstack/react-query';
import { tokenCreateSchema } from '@shared/schemas/publishing';
import { apiPost, apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { ApiTokenInfo } from '../types';

export { tokenCreateSchema };

/** POST /api/tokens: a new token; the answer holds the token itself, shown once. */
export function useCreateToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => apiPost<ApiTokenInfo & { token: string }>('/api/tokens', { name }),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: queryKeys.me }),
  });
}

/** DELETE /api/tokens/:id: revokes a token; calls with it are refused from then on. */
export function useRevokeToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiRequest<void>(`/api/tokens/${id}`, { method: 'DELETE' }),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: queryKeys.me }),
  });
}
