import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Result, SessionUser } from '@/types/api';

/** GET /api/profiles/:handle: a member's public profile. */
export interface Profile extends SessionUser {
  bio: string | null;
  joinedAt: string;
  badge: { label: string; workshop: string | null; link: string | null } | null;
  counts: { published: number; withdrawn: number; methods: number; steels: number };
  methods: { slug: string; name: string; results: number }[];
  steels: { slug: string; name: string; results: number }[];
  recent: Result[];
}

export function getProfile(handle: string, signal?: AbortSignal): Promise<Profile> {
  return apiGet<Profile>(`/api/profiles/${encodeURIComponent(handle)}`, {}, signal);
}

export const profileQueryOptions = (handle: string) => queryOptions({ queryKey: queryKeys.profile(handle), queryFn: ({ signal }) => getProfile(handle, signal) });

/** A member's public profile, as a query. */
export function useProfile(handle: string) {
  return useQuery(profileQueryOptions(handle));
}
