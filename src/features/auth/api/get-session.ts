import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { api, isApiError } from '../../../lib/api-client';
import type { SessionResponse, SessionUser } from '../../../types/api';

const LAST_USER_KEY = 'shedwright:last-signed-in';

/**
 * Who is signed in; the server answers `{ user: null }` rather than 401 when nobody is.
 * With no network, the weaver last signed in on this device is assumed, so pages that keep an
 * offline copy (the loom-side guide) still open; the server checks the session again on every call.
 */
export async function getSession(): Promise<SessionResponse> {
  try {
    const session = await api.get<SessionResponse>('/api/session');
    rememberUser(session.user);
    return session;
  } catch (error) {
    const last = isApiError(error, 0) ? lastUser() : null;
    if (last) return { user: last };
    throw error;
  }
}

function rememberUser(user: SessionUser | null): void {
  try {
    if (user) localStorage.setItem(LAST_USER_KEY, JSON.stringify(user));
    else localStorage.removeItem(LAST_USER_KEY);
  } catch {
    // Storage full or blocked: only the offline start is lost.
  }
}

function lastUser(): SessionUser | null {
  try {
    const stored = localStorage.getItem(LAST_USER_KEY);
    return stored ? (JSON.parse(stored) as SessionUser) : null;
  } catch {
    return null;
  }
}

export const sessionQueryOptions = () =>
  // 'always': asked even while the browser says it is offline, so the device's copy can answer.
  queryOptions({ queryKey: ['session'], queryFn: getSession, staleTime: 5 * 60_000, networkMode: 'always' });

export function useSession() {
  return useQuery(sessionQueryOptions());
}

/**
 * Puts a new session in the cache after sign-in, sign-up, reset or sign-out. Everything else
 * cached belonged to whoever was here before, so it is dropped rather than shown to someone else.
 */
export function replaceSession(queryClient: QueryClient, user: SessionUser | null): void {
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== 'session' });
  rememberUser(user);
  queryClient.setQueryData(sessionQueryOptions().queryKey, { user });
}

/** The signed-in user, for pages inside the sign-in guard, which never render without one. */
export function useSignedInUser(): SessionUser {
  const user = useSession().data?.user;
  if (!user) throw new Error('useSignedInUser is for pages behind RequireAuth');
  return user;
}
