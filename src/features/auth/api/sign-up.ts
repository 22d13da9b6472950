import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { replaceSession } from './get-session';
import type { AuthResponse } from '../../../types/api';

export interface SignUpInput {
  name: string;
  email: string;
  password: string;
  /** Where the mailed link leads once the account is made. */
  next?: string;
}

/**
 * Asks for an account: the server answers 202 whatever the address and mails it a link that makes
 * the account (or, for an address that has one, a note to its owner).
 */
export function signUp(input: SignUpInput): Promise<void> {
  return api.post<void>('/api/auth/sign-up', input);
}

export function useSignUp() {
  return useMutation({ mutationFn: signUp });
}

/** Makes the account from the mailed link's token and signs it in; 400 when the link is used or old. */
export function confirmSignUp(input: { token: string }): Promise<AuthResponse> {
  return api.post<AuthResponse>('/api/auth/sign-up/confirm', input);
}

export function useConfirmSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: confirmSignUp,
    onSuccess: ({ user }) => replaceSession(queryClient, user),
  });
}
