import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** Asks for a reset link; the server answers 202 whether or not the address has an account. */
export function requestReset(input: { email: string }): Promise<void> {
  return api.post<void>('/api/auth/forgot', input);
}

export function useRequestReset() {
  return useMutation({ mutationFn: requestReset });
}
