import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateDraftBody } from '../../../../shared/api/drafts';
import { api } from '../../../lib/api-client';
import type { DraftSummary } from '../../../types/api';

/** Makes a new draft (version 1) from the New draft form's choices; a 422 names the field at fault. */
export function createDraft(body: CreateDraftBody): Promise<{ draft: DraftSummary }> {
  return api.post('/api/drafts', body);
}

export function useCreateDraft() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createDraft, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['drafts', 'list'] }) });
}
