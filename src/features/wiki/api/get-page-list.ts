import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { WikiSection } from '../types';

/** GET /api/{section}: the pages of a section (merged ones left out), for choosing a merge target. */
export const pageListQueryOptions = (section: WikiSection) =>
  queryOptions({
    queryKey: [section, 'list'] as const,
    queryFn: ({ signal }) => apiGet<{ items: { slug: string; name: string }[] }>(`/api/${section}`, {}, signal),
    staleTime: 60_000,
  });

/** The pages of a section, as a query. */
export function usePageList(section: WikiSection, enabled = true) {
  return useQuery({ ...pageListQueryOptions(section), enabled });
}
