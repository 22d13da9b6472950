import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { StudioMember } from '../../../types/api';
import { studioQueryOptions } from './get-studio';
import { studiosQueryOptions } from './get-studios';

export interface RemoveMemberInput {
  studioId: number;
  userId: number;
}

/** Removes a member (owners), or the signed-in member themself (leaving); answers with the members left. */
export function removeMember({ studioId, userId }: RemoveMemberInput): Promise<{ members: StudioMember[] }> {
  return api.delete<{ members: StudioMember[] }>(`/api/studios/${studioId}/members/${userId}`);
}

export function useRemoveMember({ onSuccess }: { onSuccess?: (input: RemoveMemberInput) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: async ({ members }, input) => {
      // The answer is the new member list, so the studio is not refetched: someone who just
      // left would get a 404 for it before being taken elsewhere.
      queryClient.setQueryData(studioQueryOptions(input.studioId).queryKey, (old) => old && { ...old, members });
      onSuccess?.(input);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: studiosQueryOptions().queryKey }),
        // Drafts seen through the studio may no longer be visible.
        queryClient.invalidateQueries({ queryKey: ['drafts'] }),
      ]);
    },
  });
}
