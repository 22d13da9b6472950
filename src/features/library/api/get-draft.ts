import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, isApiError } from '../../../lib/api-client';
import { detailKey, openLocalStore, readUnsaved } from '../../../lib/local-drafts';
import type { DraftDetail } from '../../../types/api';

/**
 * One draft with its document and the viewer's role on it; 404 when absent or not visible.
 * Without a network, a draft with edits kept on this device opens from them (see {@link offlineDraft}).
 */
export async function getDraft(id: number, signal?: AbortSignal): Promise<{ draft: DraftDetail }> {
  try {
    const answer = await api.get<{ draft: DraftDetail }>(`/api/drafts/${id}`, { signal });
    void rememberDetails(answer.draft);
    return answer;
  } catch (error) {
    const offline = isApiError(error, 0) ? await offlineDraft(id) : null;
    if (offline) return { draft: offline };
    throw error;
  }
}

/** The draft's details without its document, kept for opening it offline. */
async function rememberDetails({ document: _document, ...details }: DraftDetail): Promise<void> {
  await (await openLocalStore())?.put(detailKey(String(details.id)), details).catch(() => undefined);
}

/**
 * The draft as last opened here, holding the edits kept on this device and based on the version
 * they were made on; the editor then restores and sends them when the network returns.
 */
async function offlineDraft(id: number): Promise<DraftDetail | null> {
  const local = await openLocalStore();
  const details = await local?.get<Omit<DraftDetail, 'document'>>(detailKey(String(id))).catch(() => undefined);
  const unsaved = details ? await readUnsaved(local ?? null, String(id)) : null;
  return details && unsaved ? { ...details, document: unsaved.document, version: unsaved.baseVersion } : null;
}

export const draftQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['drafts', 'detail', id], queryFn: ({ signal }) => getDraft(id, signal) });

export function useDraft(id: number) {
  return useQuery(draftQueryOptions(id));
}
