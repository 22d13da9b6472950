import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SharedDraftResponse } from '../../../types/api';

/** The draft behind a public link; no sign-in needed. */
export function getSharedDraft(token: string, signal?: AbortSignal): Promise<SharedDraftResponse> {
  return api.get(`/api/shared/${encodeURIComponent(token)}`, { signal });
}

export const sharedDraftQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['shared', token], queryFn: ({ signal }) => getSharedDraft(token, signal), retry: false });

export function useSharedDraft(token: string) {
  return useQuery(sharedDraftQueryOptions(token));
}
