import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ResultBody, ResultsResponse, WeavingResult } from '../../../../shared/api/plans';
import { api } from '../../../lib/api-client';

/** Everything woven from this draft and measured, newest first. */
export function getResults(draftId: number, signal?: AbortSignal): Promise<ResultsResponse> {
  return api.get<ResultsResponse>(`/api/drafts/${draftId}/results`, { signal });
}

export const resultsQueryOptions = (draftId: number) =>
  queryOptions({ queryKey: ['drafts', 'results', draftId], queryFn: ({ signal }) => getResults(draftId, signal) });

export function useResults(draftId: number) {
  return useQuery(resultsQueryOptions(draftId));
}

/** Records measured sizes; the server works out take-up and shrinkage. */
export function addResult(draftId: number, body: ResultBody): Promise<{ result: WeavingResult }> {
  return api.post<{ result: WeavingResult }>(`/api/drafts/${draftId}/results`, body);
}

export function useAddResult(draftId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ResultBody) => addResult(draftId, body),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: resultsQueryOptions(draftId).queryKey });
      // New results change the allowances offered for the next plan.
      void queryClient.invalidateQueries({ queryKey: ['me', 'plan-defaults'] });
    },
  });
}
