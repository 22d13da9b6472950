import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { AuthResponse } from '../../../types/api';
import { replaceSession } from './get-session';

export interface SignInInput {
  email: string;
  password: string;
}

/** Signs in with e-mail and password; 401 for wrong credentials, 429 when rate limited. */
export function signIn(input: SignInInput): Promise<AuthResponse> {
  return api.post<AuthResponse>('/api/auth/sign-in', input);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => replaceSession(queryClient, user),
  });
}
