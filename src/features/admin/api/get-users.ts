import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Role } from '@shared/permissions';

/** An account as the admins' screen shows it. */
export interface ManagedUser {
  handle: string;
  displayName: string;
  role: Role;
  banned: boolean;
  createdAt: string;
  published: number;
  returned: number;
  pending: number;
}

/** GET /api/admin/users?q= (admins): accounts whose handle or name contains q. */
export const adminUsersQueryOptions = (q: string) =>
  queryOptions({
    queryKey: queryKeys.adminUsers(q),
    queryFn: ({ signal }) => apiGet<{ items: ManagedUser[]; total: number }>('/api/admin/users', { q }, signal),
    placeholderData: keepPreviousData,
    staleTime: 0,
  });

export function useAdminUsers(q: string) {
  return useQuery(adminUsersQueryOptions(q));
}
