import type { ProgressBody, ProgressResponse } from '../../../../shared/api/plans';
import { api } from '../../../lib/api-client';

/** Moves this weaver's place marker on the server; answers with the place the server keeps. */
export function saveProgress(draftId: number, body: ProgressBody): Promise<ProgressResponse> {
  return api.put<ProgressResponse>(`/api/drafts/${draftId}/progress`, body);
}
