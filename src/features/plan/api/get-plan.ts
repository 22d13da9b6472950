import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanResponse } from '../../../../shared/api/plans';
import { api } from '../../../lib/api-client';

/** The draft's saved plan; `plan` is null before the first save. */
export function getPlan(draftId: number, signal?: AbortSignal): Promise<PlanResponse> {
  return api.get<PlanResponse>(`/api/drafts/${draftId}/plan`, { signal });
}

export const planQueryOptions = (draftId: number) =>
  queryOptions({ queryKey: ['drafts', 'plan', draftId], queryFn: ({ signal }) => getPlan(draftId, signal) });

export function usePlan(draftId: number) {
  return useQuery(planQueryOptions(draftId));
}
