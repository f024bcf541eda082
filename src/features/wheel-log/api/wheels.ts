import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { WheelInput, WheelMeasurementInput } from '@shared/schemas/wheels';
import type { WheelLogSummary } from '@shared/wheel-log';
import { apiGet, apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** One wheel of the signed-in member's log, as GET /api/wheels gives it. */
export interface LoggedWheel extends WheelLogSummary {
  id: number;
  name: string;
  wears: boolean;
  originalDiameterMm: number;
  barDiameterMm: number;
  projectionMm: number;
  usualAnglesDeg: number[];
}

/** GET /api/wheels: the member's wheels with their measurements and today's gaps. */
export const wheelsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.wheels,
    queryFn: ({ signal }) => apiGet<{ items: LoggedWheel[] }>('/api/wheels', {}, signal),
  });

export function useWheels(enabled: boolean) {
  return useQuery({ ...wheelsQueryOptions(), enabled });
}

/** POST /api/wheels: add a wheel to the log. */
export function useAddWheel() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: WheelInput) => apiPost<LoggedWheel>('/api/wheels', input),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.wheels }),
  });
}

/** POST /api/wheels/:id/measurements: record a measured diameter. */
export function useMeasureWheel(wheelId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: WheelMeasurementInput) => apiPost<LoggedWheel>(`/api/wheels/${wheelId}/measurements`, input),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.wheels }),
  });
}
