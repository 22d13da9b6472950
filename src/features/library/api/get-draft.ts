import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { DraftDetail } from '../../../types/api';

/** One draft with its document and the viewer's role on it; 404 when absent or not visible. */
export function getDraft(id: number, signal?: AbortSignal): Promise<{ draft: DraftDetail }> {
  return api.get<{ draft: DraftDetail }>(`/api/drafts/${id}`, { signal });
}

export const draftQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['drafts', 'detail', id], queryFn: ({ signal }) => getDraft(id, signal) });

export function useDraft(id: number) {
  return useQuery(draftQueryOptions(id));
}
