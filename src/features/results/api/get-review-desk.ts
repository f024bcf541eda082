import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Result } from '@/types/api';

/** GET /api/review-desk (moderators): results awaiting review, oldest first. */
export function getReviewDesk(signal?: AbortSignal): Promise<{ items: Result[] }> {
  return apiGet<{ items: Result[] }>('/api/review-desk', {}, signal);
}

/** Query options for the review desk; always refetched on open, since others review too. */
export const reviewDeskQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.reviewDesk,
    queryFn: ({ signal }) => getReviewDesk(signal),
    staleTime: 0,
  });

/** The review desk's queue, as a query. */
export function useReviewDesk(options: { enabled?: boolean } = {}) {
  return useQuery({ ...reviewDeskQueryOptions(), ...options });
}
