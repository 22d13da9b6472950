import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { commentsQueryOptions } from './get-comments';

/** Deletes one of the caller's own comments. */
export function deleteComment(draftId: number, commentId: number): Promise<void> {
  return api.delete(`/api/drafts/${draftId}/comments/${commentId}`);
}

export function useDeleteComment(draftId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (commentId: number) => deleteComment(draftId, commentId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: commentsQueryOptions(draftId).queryKey }),
  });
}
