import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { applicationDecisionSchema, type ApplicationDecisionInput, type SiteSettings } from '@shared/schemas/publishing';
import { apiGet, apiPost, apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { SessionUser } from '@/types/api';

export { applicationDecisionSchema };
export type { ApplicationDecisionInput };

/** A publisher application as admins see it. */
export interface Application {
  id: number;
  status: 'pending' | 'approved' | 'declined';
  workshop: string;
  instruments: string;
  link: string;
  createdAt: string;
  applicant: SessionUser | null;
  decision: { at: string; note: string | null; by: { handle: string } | null } | null;
}

/** GET /api/publishers/applications?status= (admins). */
export const applicationsQueryOptions = (status?: string) =>
  queryOptions({
    queryKey: queryKeys.publisherApplications(status),
    queryFn: ({ signal }) => apiGet<{ items: Application[] }>('/api/publishers/applications', { status }, signal),
    staleTime: 0,
  });

export function useApplications(status?: string) {
  return useQuery(applicationsQueryOptions(status));
}

/** POST /api/publishers/applications/:id/decision: approve or decline (a reason needed); 409 when decided already. */
export function useDecideApplication() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: ApplicationDecisionInput }) => apiPost<Application>(`/api/publishers/applications/${id}/decision`, input),
    onSettled: () => void queryClient.invalidateQueries({ queryKey: ['publisher-applications'] }),
  });
}

/** GET and PUT /api/publishers/settings (admins): whether publishers' imports are published at once. */
export function usePublishingSettings() {
  return useQuery({ queryKey: queryKeys.publishingSettings, queryFn: ({ signal }) => apiGet<SiteSettings>('/api/publishers/settings', {}, signal) });
}

export function useUpdatePublishingSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (changes: Partial<SiteSettings>) => apiRequest<SiteSettings>('/api/publishers/settings', { method: 'PUT', body: changes }),
    onSuccess: (settings) => queryClient.setQueryData(queryKeys.publishingSettings, settings),
  });
}
