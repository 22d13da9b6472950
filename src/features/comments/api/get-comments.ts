import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Comment } from '../../../types/api';

/** The conversation on a draft, oldest first. */
export function getComments(draftId: number, signal?: AbortSignal): Promise<{ comments: Comment[] }> {
  return api.get(`/api/drafts/${draftId}/comments`, { signal });
}

export const commentsQueryOptions = (draftId: number) =>
  queryOptions({ queryKey: ['drafts', 'comments', draftId], queryFn: ({ signal }) => getComments(draftId, signal) });

export function useComments(draftId: number) {
  return useQuery(commentsQueryOptions(draftId));
}
