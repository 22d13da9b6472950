import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LineageResponse } from '../../../types/api';

/** Where a draft came from and what was forked from it, as far as the caller can see. */
export function getLineage(draftId: number, signal?: AbortSignal): Promise<LineageResponse> {
  return api.get(`/api/drafts/${draftId}/lineage`, { signal });
}

export const lineageQueryOptions = (draftId: number) =>
  queryOptions({ queryKey: ['drafts', 'lineage', draftId], queryFn: ({ signal }) => getLineage(draftId, signal) });

export function useLineage(draftId: number) {
  return useQuery(lineageQueryOptions(draftId));
}
