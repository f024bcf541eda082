/**
 * The session: who is signed in, their CSRF token, and signing out. Lives in lib (as in
 * bulletproof-react's lib/auth) because the layout and every feature read it.
 */
import { useState } from 'react';
import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiGet, apiPost, setCsrfToken } from '@/lib/api-client';
import { paths } from '@/config/paths';
import { queryKeys } from '@/lib/query-keys';
import { can, type Action } from '@shared/permissions';
import type { Session, SessionUser } from '@/types/api';

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
 * (own pending results, the review desk), since a visitor may not see them. A plain hook rather
 * than useMutation: the header is on every first page, and useMutation would add about 2 kB
 * of gzip to the first page's JavaScript, which sits close to its 120 kB budget.
 */
export function useSignOut(options: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  const [state, setState] = useState<{ isPending: boolean; error: unknown }>({ isPending: false, error: null });
  const mutate = async () => {
    setState({ isPending: true, error: null });
    try {
      await signOut();
      queryClient.removeQueries({ queryKey: queryKeys.reviewDesk });
      queryClient.removeQueries({ queryKey: queryKeys.results.all });
      await queryClient.invalidateQueries({ queryKey: queryKeys.session });
      setState({ isPending: false, error: null });
      options.onSuccess?.();
    } catch (error) {
      setState({ isPending: false, error });
    }
  };
  return { mutate, isPending: state.isPending, isError: state.error !== null, error: state.error };
}

/**
 * The client does not know a person's database id; `can()` needs it only for "own result"
 * checks, and for those the server sends its answer with each result (`result.can`).
 */
export function actorOf(user: SessionUser | null) {
  return user ? { id: -1, role: user.role } : null;
}

/** Whether the signed-in person may do `action` (used only to hide controls). */
export function useCan(action: Action): boolean {
  const user = useSession().data?.user ?? null;
  return can(actorOf(user), action);
}
