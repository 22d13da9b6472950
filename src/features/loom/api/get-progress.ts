import { queryOptions } from '@tanstack/react-query';
import type { ProgressResponse } from '../../../../shared/api/plans';
import { api } from '../../../lib/api-client';

/** This weaver's place in the draft's loom-side lists; null before they start. */
export function getProgress(draftId: number, signal?: AbortSignal): Promise<ProgressResponse> {
  return api.get<ProgressResponse>(`/api/drafts/${draftId}/progress`, { signal });
}

export const progressQueryOptions = (draftId: number) =>
  queryOptions({
    queryKey: ['drafts', 'progress', draftId],
    queryFn: ({ signal }) => getProgress(draftId, signal),
    // The place is read once per visit; the page keeps it from then on.
    staleTime: Infinity,
  });
