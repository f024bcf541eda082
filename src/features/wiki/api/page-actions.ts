import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PageMerge, PageProtect, PageRevert } from '@shared/schemas/pages';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Revision, WikiPage, WikiSection } from '../types';

/** POST /api/{section}/:slug/revert (moderators): restores an earlier revision as a new one. */
export function revertPage(section: WikiSection, slug: string, input: PageRevert) {
  return apiPost<{ status: 'live'; revision: Revision; page: WikiPage }>(`/api/${section}/${encodeURIComponent(slug)}/revert`, input);
}

/** POST /api/{section}/:slug/protect (moderators): only moderators edit a protected page. */
export function protectPage(section: WikiSection, slug: string, input: PageProtect) {
  return apiPost<WikiPage>(`/api/${section}/${encodeURIComponent(slug)}/protect`, input);
}

/** POST /api/{section}/:slug/merge (moderators): this duplicate's results move to `into`, and it redirects there. */
export function mergePages(section: WikiSection, slug: string, input: PageMerge) {
  return apiPost<{ merged: { slug: string; name: string }; movedResults: number; page: WikiPage }>(`/api/${section}/${encodeURIComponent(slug)}/merge`, input);
}

function useRefresh(section: WikiSection, slug: string) {
  const queryClient = useQueryClient();
  return () => {
    void queryClient.invalidateQueries({ queryKey: [section] });
    void queryClient.invalidateQueries({ queryKey: queryKeys.wiki.all });
    void queryClient.invalidateQueries({ queryKey: queryKeys.search.all });
    void queryClient.invalidateQueries({ queryKey: queryKeys.wiki.page(section, slug) });
  };
}

/** Reverts a page; refreshes the page and its history. */
export function useRevertPage(section: WikiSection, slug: string) {
  const refresh = useRefresh(section, slug);
  return useMutation({ mutationFn: (input: PageRevert) => revertPage(section, slug, input), onSuccess: refresh });
}

/** Protects or releases a page. */
export function useProtectPage(section: WikiSection, slug: string) {
  const refresh = useRefresh(section, slug);
  return useMutation({ mutationFn: (input: PageProtect) => protectPage(section, slug, input), onSuccess: refresh });
}

/** Merges a duplicate into another page; results and comparisons change too. */
export function useMergePages(section: WikiSection, slug: string) {
  const refresh = useRefresh(section, slug);
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PageMerge) => mergePages(section, slug, input),
    onSuccess: () => {
      refresh();
      void queryClient.invalidateQueries({ queryKey: queryKeys.results.all });
      void queryClient.invalidateQueries({ queryKey: queryKeys.compare.all });
    },
  });
}
