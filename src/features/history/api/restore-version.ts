import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** Makes a new version holding version `n`'s document. */
export function restoreVersion({ draftId, n }: { draftId: number; n: number }): Promise<{ version: number }> {
  return api.post(`/api/drafts/${draftId}/versions/${n}/restore`);
}

export function useRestoreVersion() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: restoreVersion,
    // The draft, its version list and the library all show the new version.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['drafts'] }),
  });
}
