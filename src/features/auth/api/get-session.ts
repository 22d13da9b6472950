import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SessionResponse, SessionUser } from '../../../types/api';

/** Who is signed in; the server answers `{ user: null }` rather than 401 when nobody is. */
export function getSession(): Promise<SessionResponse> {
  return api.get<SessionResponse>('/api/session');
}

export const sessionQueryOptions = () =>
  queryOptions({ queryKey: ['session'], queryFn: getSession, staleTime: 5 * 60_000 });

export function useSession() {
  return useQuery(sessionQueryOptions());
}

/**
 * Puts a new session in the cache after sign-in, sign-up, reset or sign-out. Everything else
 * cached belonged to whoever was here before, so it is dropped rather than shown to someone else.
 */
export function replaceSession(queryClient: QueryClient, user: SessionUser | null): void {
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== 'session' });
  queryClient.setQueryData(sessionQueryOptions().queryKey, { user });
}

/** The signed-in user, for pages inside the sign-in guard, which never render without one. */
export function useSignedInUser(): SessionUser {
  const user = useSession().data?.user;
  if (!user) throw new Error('useSignedInUser is for pages behind RequireAuth');
  return user;
}
