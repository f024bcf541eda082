import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { ReviewDeskQuery } from '@shared/schemas/publishing';
import type { DeskCorrection, Result } from '@/types/api';

/** The review desk's results and corrections (flags, imports and page edits have their own readers). */
export interface ReviewDesk {
  items: Result[];
  resultRevisions: DeskCorrection[];
}

/** GET /api/review-desk (moderators): results awaiting review, oldest first; `filters` narrow it (author, steel, importId, kind). */
export function getReviewDesk(signal?: AbortSignal, filters: ReviewDeskQuery = {}): Promise<ReviewDesk> {
  return apiGet<ReviewDesk>('/api/review-desk', { ...filters }, signal);
}

/** Query options for the review desk; always refetched on open, since others review too. Unfiltered, the key is `queryKeys.reviewDesk` itself. */
export const reviewDeskQueryOptions = (filters: ReviewDeskQuery = {}) =>
  queryOptions({
    queryKey: (Object.keys(filters).length ? [...queryKeys.reviewDesk, filters] : queryKeys.reviewDesk) as readonly unknown[],
    queryFn: ({ signal }) => getReviewDesk(signal, filters),
    staleTime: 0,
  });

/** The review desk's queue, as a query. */
export function useReviewDesk(options: { enabled?: boolean; filters?: ReviewDeskQuery } = {}) {
  const { filters, ...rest } = options;
  return useQuery({ ...reviewDeskQueryOptions(filters), ...rest });
}
