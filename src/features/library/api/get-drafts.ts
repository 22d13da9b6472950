import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { DraftListResponse } from '../../../types/api';
import type { DraftsSearch } from '../drafts-search';

/** One page of the drafts the signed-in weaver owns or can see through a studio. */
export function getDrafts(search: DraftsSearch, signal?: AbortSignal): Promise<DraftListResponse> {
  return api.get<DraftListResponse>('/api/drafts', { query: { ...search }, signal });
}

export const draftsQueryOptions = (search: DraftsSearch) =>
  queryOptions({
    queryKey: ['drafts', 'list', search],
    queryFn: ({ signal }) => getDrafts(search, signal),
    // Keep the old page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export function useDrafts(search: DraftsSearch) {
  return useQuery(draftsQueryOptions(search));
}
