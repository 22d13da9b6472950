import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { AcceptInviteResponse } from '../../../types/api';

/** Joins the studio the invitation names. */
export function acceptInvitation(token: string): Promise<AcceptInviteResponse> {
  return api.post('/api/invitations/accept', { token });
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    // The session lists the studios, and the library now shows the studio's drafts.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
