import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ShareStatusResponse } from '../../../types/api';
import { shareStatusQueryOptions } from './get-share-status';

/** Stops the draft's public link. */
export function revokeShareLink(draftId: number): Promise<ShareStatusResponse> {
  return api.delete(`/api/drafts/${draftId}/share`);
}

export function useRevokeShareLink(draftId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => revokeShareLink(draftId),
    onSuccess: (status) => queryClient.setQueryData(shareStatusQueryOptions(draftId).queryKey, status),
  });
}
