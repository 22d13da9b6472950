import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { StudioMember, StudioRole } from '../../../types/api';
import { studioQueryOptions } from './get-studio';

export interface UpdateMemberRoleInput {
  studioId: number;
  userId: number;
  role: StudioRole;
}

/** Gives a member another role (owners only); answers with the members as they now stand. */
export function updateMemberRole({ studioId, userId, role }: UpdateMemberRoleInput): Promise<{ members: StudioMember[] }> {
  return api.patch<{ members: StudioMember[] }>(`/api/studios/${studioId}/members/${userId}`, { role });
}

export function useUpdateMemberRole() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMemberRole,
    onSuccess: ({ members }, { studioId }) =>
      queryClient.setQueryData(studioQueryOptions(studioId).queryKey, (old) => old && { ...old, members }),
  });
}
