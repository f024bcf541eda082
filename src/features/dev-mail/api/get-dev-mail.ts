import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** One message caught by the local mail catcher. */
export interface CaughtMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  date: string;
  unsubscribe?: string;
}

/** GET /api/dev/mail (admins, not in production): what the app sent, newest first. */
export const devMailQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.devMail, queryFn: ({ signal }) => apiGet<CaughtMail[]>('/api/dev/mail', {}, signal), staleTime: 0 });

export function useDevMail(options: { enabled?: boolean } = {}) {
  return useQuery({ ...devMailQueryOptions(), ...options });
}
