import { useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { saveConflictSchema } from '../../../../shared/api/drafts';
import { parseDraft, type Draft } from '../../../../shared/weave';
import { api, isApiError } from '../../../lib/api-client';
import { draftQueryOptions } from './get-draft';

export type SaveDraftResult = { version: number } | { conflict: { version: number; document: Draft } };

/**
 * Saves a document on top of `baseVersion`. A 409 is not an error here: it comes back as the
 * version the server holds now, so the editor can show the conflict. `keepalive` lets the request
 * finish after the page has gone.
 */
export async function saveDraft(id: number, document: Draft, baseVersion: number, { keepalive = false } = {}): Promise<SaveDraftResult> {
  try {
    return await api.put<{ version: number }>(`/api/drafts/${id}`, { document, baseVersion }, { keepalive });
  } catch (error) {
    if (isApiError(error, 409)) {
      const conflict = saveConflictSchema.safeParse(error.payload);
      if (conflict.success) {
        return { conflict: { version: conflict.data.current.version, document: parseDraft(conflict.data.current.document) } };
      }
    }
    throw error;
  }
}

/**
 * The editor's save function for one draft. A successful save refreshes the library's lists and
 * puts the saved document in the cached draft, so the editor opened again (another section and
 * back) starts from it, not from what it opened with.
 */
export function useSaveDraft(id: number) {
  const queryClient = useQueryClient();
  return useCallback(
    async (document: Draft, baseVersion: number, options?: { keepalive?: boolean }) => {
      const result = await saveDraft(id, document, baseVersion, options);
      if ('version' in result) {
        const picks = document.control === 'liftplan' ? document.liftplan.length : document.treadling.length;
        queryClient.setQueryData(draftQueryOptions(id).queryKey, (old) =>
          old && { draft: { ...old.draft, document, version: result.version, ends: document.threading.length, picks, shafts: document.shafts } },
        );
        void queryClient.invalidateQueries({ queryKey: ['drafts', 'list'] });
      }
      return result;
    },
    [id, queryClient],
  );
}
