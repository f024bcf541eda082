import { useMutation } from '@tanstack/react-query';
import { FLAG_REASONS, flagInputSchema, type FlagInput } from '@shared/schemas/publishing';
import { apiPost } from '@/lib/api-client';

export { FLAG_REASONS, flagInputSchema };
export type { FlagInput };

/** POST /api/flags: a member flags a published result (by number) or a page (by slug) for the moderators. */
export function useCreateFlag() {
  return useMutation({ mutationFn: (input: FlagInput) => apiPost<{ id: number }>('/api/flags', input) });
}
