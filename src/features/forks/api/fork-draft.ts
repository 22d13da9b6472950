import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { DraftSummary } from '../../../types/api';

export interface ForkInput {
  draftId: number;
  name: string;
  /** The new colourway: one colour per palette entry of the draft. */
  palette?: string[];
  version?: number;
  studioId?: number;
}

/** A new draft of the caller's own, forked from this one. */
export function forkDraft({ draftId, ...body }: ForkInput): Promise<{ draft: DraftSummary }> {
  return api.post(`/api/drafts/${draftId}/fork`, body);
}

export function useForkDraft() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: forkDraft,
    onSuccess: (_data, { draftId }) => {
      void queryClient.invalidateQueries({ queryKey: ['drafts', 'list'] });
      void queryClient.invalidateQueries({ queryKey: ['drafts', 'lineage', draftId] });
    },
  });
}
