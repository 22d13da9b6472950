import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { BinResponse } from '../../../../shared/api/drafts';
import { api } from '../../../lib/api-client';
import type { DraftDetail } from '../../../types/api';

export const binQueryOptions = () => queryOptions({ queryKey: ['drafts', 'bin'], queryFn: ({ signal }) => api.get<BinResponse>('/api/bin', { signal }) });

/** Drafts in the weaver's Bin, with when each goes for good. */
export function useBin() {
  return useQuery(binQueryOptions());
}

/** Puts a draft in the Bin (its owner only). */
export function useBinDraft() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete<void>(`/api/drafts/${id}`),
    onSuccess: (_data, id) => {
      queryClient.removeQueries({ queryKey: ['drafts', 'detail', id] });
      void queryClient.invalidateQueries({ queryKey: ['drafts', 'list'] });
      void queryClient.invalidateQueries({ queryKey: ['drafts', 'bin'] });
    },
  });
}

/** Takes a draft out of the Bin, as it was. */
export function useRestoreDraft() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.post<{ draft: DraftDetail }>(`/api/drafts/${id}/restore`),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: ['drafts', 'list'] });
      void queryClient.invalidateQueries({ queryKey: ['drafts', 'bin'] });
    },
  });
}
