import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PageEdit } from '@shared/schemas/pages';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { SaveOutcome, WikiSection } from '../types';

/**
 * PUT /api/{section}/:slug: saves an edit. 200 when it went live (publishers, moderators), 202
 * when it waits for review (members); 409 (an ApiError) when someone saved since `baseRevision`.
 */
export function savePage(section: WikiSection, slug: string, edit: PageEdit): Promise<SaveOutcome> {
  return apiRequest<SaveOutcome>(`/api/${section}/${encodeURIComponent(slug)}`, { method: 'PUT', body: edit });
}

/** Saves an edit; a live one refreshes the page, its history, lists and search. */
export function useSavePage(section: WikiSection, slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (edit: PageEdit) => savePage(section, slug, edit),
    onSettled: () => {
      void queryClient.invalidateQueries({ queryKey: queryKeys.wiki.page(section, slug) });
      void queryClient.invalidateQueries({ queryKey: queryKeys.wiki.history(section, slug) });
      void queryClient.invalidateQueries({ queryKey: [section] });
      void queryClient.invalidateQueries({ queryKey: queryKeys.search.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.reviewDesk });
    },
  });
}
