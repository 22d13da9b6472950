import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { replaceSession } from './get-session';
import type { AuthResponse } from '../../../types/api';

export interface ResetPasswordInput {
  token: string;
  password: string;
}

/** Sets a new password from a mailed token and signs in; 400 when the token is invalid or expired. */
export function resetPassword(input: ResetPasswordInput): Promise<AuthResponse> {
  return api.post<AuthResponse>('/api/auth/reset', input);
}

export function useResetPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resetPassword,
    onSuccess: ({ user }) => replaceSession(queryClient, user),
  });
}
