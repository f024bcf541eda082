/**
 * The session: who is signed in, their CSRF token, and signing out. Lives in lib (as in
 * bulletproof-react's lib/auth) because the layout and every feature read it.
 */
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiGet, apiPost, setCsrfToken } from '@/lib/api-client';
import { paths } from '@/config/paths';
import { queryKeys } from '@/lib/query-keys';
import type { Session } from '@/types/api';

/** GET /api/session: who is signed in (null for a visitor) and the CSRF token for writes. */
export async function getSession(signal?: AbortSignal): Promise<Session> {
  const session = await apiGet<Session>('/api/session', {}, signal);
  setCsrfToken(session.csrfToken);
  return session;
}

/** Query options for the session; kept fresh for a minute, refetched when the tab regains focus. */
export const sessionQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.session,
    queryFn: ({ signal }) => getSession(signal),
    staleTime: 60_000,
  });

/** The current session, as a query. */
export function useSession() {
  return useQuery(sessionQueryOptions());
}

/** The signed-in person, or null for a visitor (also null while the session is loading). */
export function useUser() {
  return useSession().data?.user ?? null;
}


/** POST /auth/signout (204): ends the session on the server. */
export function signOut(): Promise<void> {
  return apiPost<void>(paths.auth.signOut);
}

/**
 * Signs out, then refetches the session and drops everything cached under the old identity
 * (own pending results, the review desk), since a visitor may not see them.
 */
export function useSignOut(options: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: async () => {
      queryClient.removeQueries({ queryKey: queryKeys.reviewDesk });
      queryClient.removeQueries({ queryKey: queryKeys.results.all });
      await queryClient.invalidateQueries({ queryKey: queryKeys.session });
      options.onSuccess?.();
    },
  });
}
