import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PageCreate } from '@shared/schemas/pages';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { SaveOutcome, WikiSection } from '../types';

/** POST /api/{section}: starts a page (moderators, admins); 201 with the page and its revision 1, 409 when the slug is taken. */
export function createPage(section: WikiSection, input: PageCreate): Promise<Required<SaveOutcome>> {
  return apiRequest<Required<SaveOutcome>>(`/api/${section}`, { method: 'POST', body: input });
}

/** Starts a page; the section's lists and search are fetched again. */
export function useCreatePage(section: WikiSection) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PageCreate) => createPage(section, input),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: [section] });
      void queryClient.invalidateQueries({ queryKey: queryKeys.search.all });
    },
  });
}
