import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { OwnPage } from '../types';

/** GET /api/me (signed in): drafts, pending and returned results, follows, e-mail settings, tokens, application, imports. */
export function getMe(signal?: AbortSignal): Promise<OwnPage> {
  return apiGet<OwnPage>('/api/me', {}, signal);
}

export const meQueryOptions = () => queryOptions({ queryKey: queryKeys.me, queryFn: ({ signal }) => getMe(signal) });

/** The member's own page, as a query (only when signed in). */
export function useMe(options: { enabled?: boolean } = {}) {
  return useQuery({ ...meQueryOptions(), ...options });
}
