import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { CompareResponse } from '../../../types/api';

/** What changed from version a to version b, with the address of the difference image. */
export function compareVersions(draftId: number, a: number, b: number, signal?: AbortSignal): Promise<CompareResponse> {
  return api.get(`/api/drafts/${draftId}/compare`, { query: { a, b }, signal });
}

export const compareQueryOptions = (draftId: number, a: number, b: number) =>
  queryOptions({ queryKey: ['drafts', 'compare', draftId, a, b], queryFn: ({ signal }) => compareVersions(draftId, a, b, signal), staleTime: Infinity });

export function useCompareVersions(draftId: number, pair: [number, number] | null) {
  return useQuery({ ...compareQueryOptions(draftId, pair?.[0] ?? 0, pair?.[1] ?? 0), enabled: pair !== null });
}
