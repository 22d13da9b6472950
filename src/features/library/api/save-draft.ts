import { useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { saveConflictSchema } from '../../../../shared/api/drafts';
import { parseDraft, type Draft } from '../../../../shared/weave';
import { api, isApiError } from '../../../lib/api-client';

export type SaveDraftResult = { version: number } | { conflict: { version: number; document: Draft } };

/**
 * Saves a document as a new version on top of `baseVersion`. A 409 is not an error here: it comes
 * back as the version the server holds now, so the editor can show the conflict.
 */
export async function saveDraft(id: number, document: Draft, baseVersion: number): Promise<SaveDraftResult> {
  try {
    return await api.put<{ version: number }>(`/api/drafts/${id}`, { document, baseVersion });
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
 * The editor's save function for one draft. A successful save refreshes the library's lists; the
 * open draft itself is not refetched, since the editor holds the newer copy.
 */
export function useSaveDraft(id: number) {
  const queryClient = useQueryClient();
  return useCallback(
    async (document: Draft, baseVersion: number) => {
      const result = await saveDraft(id, document, baseVersion);
      if ('version' in result) void queryClient.invalidateQueries({ queryKey: ['drafts', 'list'] });
      return result;
    },
    [id, queryClient],
  );
}
