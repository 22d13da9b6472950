import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateDraftBody } from '../../../../shared/api/drafts';
import type { Draft } from '../../../../shared/weave';
import { api } from '../../../lib/api-client';
import type { DraftDetail } from '../../../types/api';
import { draftQueryOptions } from './get-draft';
import { saveDraft } from './save-draft';

/** Changes a draft's details (name, tags, the studio it lives in); no new version. */
export function updateDraft(id: number, body: UpdateDraftBody): Promise<{ draft: DraftDetail }> {
  return api.patch(`/api/drafts/${id}`, body);
}

/** The details change everywhere at once: the workspace's copy is replaced and the library's lists reload. */
export function useUpdateDraft(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateDraftBody) => updateDraft(id, body),
    onSuccess: (answer) => {
      queryClient.setQueryData(draftQueryOptions(id).queryKey, answer);
      void queryClient.invalidateQueries({ queryKey: ['drafts', 'list'] });
    },
  });
}

/**
 * Saves new notes as a version on top of the draft's newest one. The notes are the only change, so a
 * save that finds a newer version (the editor's last edits arriving) is made again on top of that one.
 */
export function useSaveNotes(draft: DraftDetail, document: Draft) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (notes: string) => {
      let base = { version: draft.version, document };
      for (let attempt = 0; attempt < 3; attempt++) {
        const next = { ...base.document, name: draft.name, notes };
        const result = await saveDraft(draft.id, next, base.version);
        if ('version' in result) return { version: result.version, document: next };
        base = result.conflict;
      }
      throw new Error('The draft kept changing while the notes were saved; try again.');
    },
    onSuccess: ({ version, document: saved }) => {
      queryClient.setQueryData(draftQueryOptions(draft.id).queryKey, (old) => old && { draft: { ...old.draft, version, document: saved } });
      void queryClient.invalidateQueries({ queryKey: ['drafts', 'versions', draft.id] });
    },
  });
}
