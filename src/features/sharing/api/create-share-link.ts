import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ShareLinkResponse } from '../../../types/api';
import { shareStatusQueryOptions } from './get-share-status';

/** A new public read-only link (any earlier one stops working). */
export function createShareLink(draftId: number): Promise<ShareLinkResponse> {
  return api.post(`/api/drafts/${draftId}/share`);
}

export function useCreateShareLink(draftId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => createShareLink(draftId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shareStatusQueryOptions(draftId).queryKey }),
  });
}
