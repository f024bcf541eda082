import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WheelMeasurementInput } from '@shared/schemas/wheels';
import { apiPost, apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/**
 * The wheel log's measurements from the workshop: POST /api/wheels/:id/measurements,
 * PATCH and DELETE /api/wheels/:id/measurements/:measurementId. Each refreshes the log and the workshop.
 */
export function useMeasurement(wheelId: number) {
  const client = useQueryClient();
  const onSuccess = () => client.invalidateQueries({ queryKey: queryKeys.wheels });
  return {
    add: useMutation({ mutationFn: (input: WheelMeasurementInput) => apiPost<unknown>(`/api/wheels/${wheelId}/measurements`, input), onSuccess }),
    edit: useMutation({
      mutationFn: ({ id, input }: { id: number; input: WheelMeasurementInput }) => apiRequest<void>(`/api/wheels/${wheelId}/measurements/${id}`, { method: 'PATCH', body: input }),
      onSuccess,
    }),
    remove: useMutation({ mutationFn: (id: number) => apiRequest<void>(`/api/wheels/${wheelId}/measurements/${id}`, { method: 'DELETE' }), onSuccess }),
  };
}
