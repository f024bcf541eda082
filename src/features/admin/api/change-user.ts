import { useMutation, useQueryClient } from '@tanstack/react-query';
import { adminUserChangeSchema, type AdminUserChange } from '@shared/schemas/admin';
import { apiRequest } from '@/lib/api-client';

export { adminUserChangeSchema };
export type { AdminUserChange };

/** PATCH /api/admin/users/:handle (admins): a new role, a ban or its lifting, with the reason (audited). */
export function changeUser(handle: string, change: AdminUserChange) {
  return apiRequest<{ handle: string; role: string; banned: boolean }>(`/api/admin/users/${encodeURIComponent(handle)}`, { method: 'PATCH', body: change });
}

export function useChangeUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ handle, change }: { handle: string; change: AdminUserChange }) => changeUser(handle, change),
    onSettled: () => {
      void queryClient.invalidateQueries({ queryKey: ['admin-users'] });
      void queryClient.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}
