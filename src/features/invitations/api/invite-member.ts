import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { StudioRole } from '../../../types/api';

export interface InviteInput {
  studioId: number;
  email: string;
  role: StudioRole;
}

/** Mails an invitation to join the studio (owners only). */
export function inviteMember({ studioId, ...body }: InviteInput): Promise<{ invitation: { email: string; role: StudioRole; expiresAt: string } }> {
  return api.post(`/api/studios/${studioId}/invitations`, body);
}

export function useInviteMember() {
  return useMutation({ mutationFn: inviteMember });
}
