import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Comment } from '../../../types/api';
import { commentsQueryOptions } from './get-comments';

export interface AddCommentInput {
  text: string;
  version?: number;
  end?: number;
  pick?: number;
}

export function addComment(draftId: number, body: AddCommentInput): Promise<{ comment: Comment }> {
  return api.post(`/api/drafts/${draftId}/comments`, body);
}

export function useAddComment(draftId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AddCommentInput) => addComment(draftId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: commentsQueryOptions(draftId).queryKey }),
  });
}
