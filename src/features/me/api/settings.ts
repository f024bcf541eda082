import { useMutation, useQueryClient } from '@tanstack/react-query';
import { notificationSettingsSchema, followInputSchema, publisherApplicationSchema, type EmailTopic, type FollowablePage, type PublisherApplicationInput } from '@shared/schemas/publishing';
import { apiPost, apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { OwnPage, PublisherApplicationInfo } from '../types';

export { notificationSettingsSchema, followInputSchema, publisherApplicationSchema };
export type { PublisherApplicationInput };

/** PUT /api/me/notifications: turns kinds of e-mail on or off. */
export function useUpdateNotifications() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (changes: Partial<Record<EmailTopic, boolean>>) => apiRequest<Record<EmailTopic, boolean>>('/api/me/notifications', { method: 'PUT', body: changes }),
    onSuccess: (notifications) => {
      queryClient.setQueryData<OwnPage>(queryKeys.me, (me) => (me ? { ...me, notifications } : me));
    },
  });
}

/** POST /api/me/follows and DELETE /api/me/follows/:pageType/:slug: follow a page for the weekly digest, or stop. */
export function useFollow() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ pageType, slug, follow }: { pageType: FollowablePage; slug: string; follow: boolean }) =>
      follow
        ? apiPost<unknown>('/api/me/follows', { pageType, slug })
        : apiRequest<void>(`/api/me/follows/${pageType}/${encodeURIComponent(slug)}`, { method: 'DELETE' }),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: queryKeys.me }),
  });
}

/** POST /api/publishers/applications: a member applies to become a publisher. */
export function useApplyForPublisher() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PublisherApplicationInput) => apiPost<PublisherApplicationInfo>('/api/publishers/applications', input),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: queryKeys.me }),
  });
}

/** POST /api/me/unsubscribe: the signed link from an e-mail; no sign-in needed. */
export function unsubscribe(params: { user: string; topic: string; sig: string }) {
  return apiPost<{ topic: EmailTopic; topicLabel: string; unsubscribed: true }>('/api/me/unsubscribe', params);
}
