import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ShareStatusResponse } from '../../../types/api';

/** Whether the draft has a live public link. */
export function getShareStatus(draftId: number, signal?: AbortSignal): Promise<ShareStatusResponse> {
  return api.get(`/api/drafts/${draftId}/share`, { signal });
}

export const shareStatusQueryOptions = (draftId: number) =>
  queryOptions({ queryKey: ['drafts', 'share', draftId], queryFn: ({ signal }) => getShareStatus(draftId, signal) });

export function useShareStatus(draftId: number) {
  return useQuery(shareStatusQueryOptions(draftId));
}
