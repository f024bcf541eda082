import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { pageReviewSchema, type PageReview } from '@shared/schemas/pages';
import { apiGet, apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { DeskRevision, Revision } from '../types';

/** The input schema of POST /api/page-revisions/:id/review, shared with the server. */
export { pageReviewSchema };
export type { PageReview };

/**
 * GET /api/review-desk (moderators), the page edits in it. Same key as the results queue, so
 * one request serves both and a decision on either refreshes both.
 */
export const deskRevisionsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.reviewDesk,
    queryFn: ({ signal }) => apiGet<{ items: unknown[]; revisions?: DeskRevision[] }>('/api/review-desk', {}, signal),
    staleTime: 0,
  });

/** The page edits awaiting review, oldest first. */
export function useDeskRevisions(options: { enabled?: boolean } = {}) {
  return useQuery({ ...deskRevisionsQueryOptions(), ...options, select: (desk) => desk.revisions ?? [] });
}

/** POST /api/page-revisions/:id/review: approve (live at once, merged if others saved since) or decline with a note. */
export function reviewRevision(id: number, input: PageReview) {
  return apiPost<{ status: 'live' | 'declined'; revision: Revision; applied: Revision }>(`/api/page-revisions/${id}/review`, input);
}

/** Records a decision on a page edit; refreshes the desk, the page, its history and search. */
export function useReviewRevision(options: { onSuccess?: (outcome: Awaited<ReturnType<typeof reviewRevision>>) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: PageReview }) => reviewRevision(id, input),
    onSuccess: (outcome) => {
      const { section, slug } = outcome.revision.page;
      void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk });
      void queryClient.invalidateQueries({ queryKey: queryKeys.wiki.all });
      void queryClient.invalidateQueries({ queryKey: [section] });
      void queryClient.invalidateQueries({ queryKey: queryKeys.wiki.page(section, slug) });
      void queryClient.invalidateQueries({ queryKey: queryKeys.search.all });
      options.onSuccess?.(outcome);
    },
    onError: (error) => {
      if ((error as { status?: number }).status === 409) void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk });
    },
  });
}
