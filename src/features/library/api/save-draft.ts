import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect } from 'react';
import { saveConflictSchema } from '../../../../shared/api/drafts';
import { parseDraft, type Draft } from '../../../../shared/weave';
import { api, isApiError, prepareWrites } from '../../../lib/api-client';
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
 * The editor's save function for one draft (`canSave`: the weaver may save, so the CSRF token is fetched ahead). A successful save refreshes the library's lists and
 * puts the saved document in the cached draft, so the editor opened again (another section and
 * back) starts from it, not from what it opened with.
 */
export function useSaveDraft(id: number, { canSave = true } = {}) {
  const queryClient = useQueryClient();
  useEffect(() => {
    if (!canSave) return;
    // Saves sent as the weaver leaves cannot wait for a token: have it before the first edit.
    prepareWrites().catch(() => {
      // Offline: the first save fetches it, and the edits are kept on the device meanwhile.
    });
  }, [canSave]);
  return useCallback(
    async (edited: Draft, baseVersion: number, options?: { keepalive?: boolean }) => {
      // The name is a detail kept with the draft (renamed in Notes and photos, not drawn): the
      // document saved carries the name the library shows, whatever the editor opened with.
      const name = queryClient.getQueryData(draftQueryOptions(id).queryKey)?.draft.name;
      const document = name === undefined || name === edited.name ? edited : { ...edited, name };
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
