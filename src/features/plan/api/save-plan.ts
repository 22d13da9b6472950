import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlanResponse } from '../../../../shared/api/plans';
import type { PlanDocument } from '../../../../shared/plan/plan-schema';
import { api } from '../../../lib/api-client';
import { planQueryOptions } from './get-plan';

/** Saves the draft's plan (editors and owners). */
export function savePlan(draftId: number, plan: PlanDocument): Promise<PlanResponse> {
  return api.put<PlanResponse>(`/api/drafts/${draftId}/plan`, plan);
}

export function useSavePlan(draftId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (plan: PlanDocument) => savePlan(draftId, plan),
    onSuccess: (saved) => queryClient.setQueryData(planQueryOptions(draftId).queryKey, saved),
  });
}
