import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { replaceSession } from './get-session';

/** Ends the session; the response carries the CSRF token of the new, anonymous session. */
export function signOut(): Promise<{ csrfToken: string }> {
  return api.post<{ csrfToken: string }>('/api/auth/sign-out');
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => replaceSession(queryClient, null),
  });
}
