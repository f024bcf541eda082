import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Revision, WikiSection } from '../types';

/** GET /api/{section}/:slug/revisions/:id: one revision whole (fields and body as saved). */
export function getRevision(section: WikiSection, slug: string, id: number, signal?: AbortSignal): Promise<Revision> {
  return apiGet<Revision>(`/api/${section}/${encodeURIComponent(slug)}/revisions/${id}`, {}, signal);
}

/** Query options for one revision; a saved revision never changes, except a proposal's state. */
export const revisionQueryOptions = (section: WikiSection, slug: string, id: number) =>
  queryOptions({
    queryKey: queryKeys.wiki.revision(section, slug, id),
    queryFn: ({ signal }) => getRevision(section, slug, id, signal),
    enabled: Number.isInteger(id) && id > 0,
    staleTime: 30_000,
  });

/** One revision, as a query. */
export function useRevision(section: WikiSection, slug: string, id: number) {
  return useQuery(revisionQueryOptions(section, slug, id));
}
