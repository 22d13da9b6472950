import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { replaceSession } from './get-session';
import type { AuthResponse } from '../../../types/api';

export interface SignUpInput {
  name: string;
  email: string;
  password: string;
}

/**
 * PASSWORD_MIN_LENGTH of shared/api/auth. NOTE: repeated, not imported: that module brings zod
 * (85 kB) into the page; tests/web/contract-constants.test.ts keeps the two equal.
 */
export const MIN_PASSWORD_LENGTH = 10;

/** Creates an account and signs it in; 409 when the e-mail is taken. */
export function signUp(input: SignUpInput): Promise<AuthResponse> {
  return api.post<AuthResponse>('/api/auth/sign-up', input);
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: ({ user }) => replaceSession(queryClient, user),
  });
}
