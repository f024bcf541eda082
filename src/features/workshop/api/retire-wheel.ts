import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RetireWheelInput } from '@shared/schemas/workshop';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** POST /api/workshop/wheels/:id/retire: the wheel leaves the kit; the sharpenings it gave become its reported life. */
export function useRetireWheel(wheelId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: RetireWheelInput) => apiPost<unknown>(`/api/workshop/wheels/${wheelId}/retire`, input),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.wheels }),
  });
}
