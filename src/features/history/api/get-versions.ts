import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { VersionSummary } from '../../../types/api';

/** Every saved version of a draft, newest first. */
export function getVersions(draftId: number, signal?: AbortSignal): Promise<{ versions: VersionSummary[] }> {
  return api.get(`/api/drafts/${draftId}/versions`, { signal });
}

export const versionsQueryOptions = (draftId: number) =>
  queryOptions({ queryKey: ['drafts', 'versions', draftId], queryFn: ({ signal }) => getVersions(draftId, signal) });

export function useVersions(draftId: number) {
  return useQuery(versionsQueryOptions(draftId));
}
