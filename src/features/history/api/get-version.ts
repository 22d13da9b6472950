import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { VersionDetailResponse } from '../../../types/api';

/** One version with its document; versions never change, so it is cached for good. */
export function getVersion(draftId: number, n: number, signal?: AbortSignal): Promise<VersionDetailResponse> {
  return api.get(`/api/drafts/${draftId}/versions/${n}`, { signal });
}

export const versionQueryOptions = (draftId: number, n: number) =>
  queryOptions({ queryKey: ['drafts', 'version', draftId, n], queryFn: ({ signal }) => getVersion(draftId, n, signal), staleTime: Infinity });

export function useVersion(draftId: number, n: number | null) {
  return useQuery({ ...versionQueryOptions(draftId, n ?? 0), enabled: n !== null });
}
