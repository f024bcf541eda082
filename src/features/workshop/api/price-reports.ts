import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PriceReportInput } from '@shared/schemas/workshop';
import { apiGet, apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export interface PriceGroup {
  currency: string;
  condition: 'new' | 'used';
  medianPrice: number;
  n: number;
  from: string;
  to: string;
}

/** GET /api/price-reports?abrasive=: prices members paid, medians with n. */
export const priceReportsQueryOptions = (abrasive: string) =>
  queryOptions({
    queryKey: queryKeys.priceReports(abrasive),
    queryFn: ({ signal }) => apiGet<{ abrasive: string; groups: PriceGroup[] }>('/api/price-reports', { abrasive }, signal),
  });

export function usePriceReports(abrasive: string) {
  return useQuery(priceReportsQueryOptions(abrasive));
}

/** POST /api/price-reports: report a price paid. */
export function useReportPrice() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: PriceReportInput) => apiPost<unknown>('/api/price-reports', input),
    onSuccess: (_data, input) => client.invalidateQueries({ queryKey: queryKeys.priceReports(input.abrasive) }),
  });
}
