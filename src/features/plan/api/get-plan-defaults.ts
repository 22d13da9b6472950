import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanDefaultsResponse } from '../../../../shared/api/plans';
import { api } from '../../../lib/api-client';

/** The signed-in weaver's measured allowances, overall and per pair of yarns. */
export function getPlanDefaults(signal?: AbortSignal): Promise<PlanDefaultsResponse> {
  return api.get<PlanDefaultsResponse>('/api/me/plan-defaults', { signal });
}

export const planDefaultsQueryOptions = () =>
  queryOptions({ queryKey: ['me', 'plan-defaults'], queryFn: ({ signal }) => getPlanDefaults(signal) });

export function usePlanDefaults() {
  return useQuery(planDefaultsQueryOptions());
}
