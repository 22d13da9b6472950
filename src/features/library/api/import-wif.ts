import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { DraftSummary } from '../../../types/api';

/** What an import made, and what it had to guess or leave out of the file (in the weaver's words). */
export interface ImportedWif {
  draft: DraftSummary;
  warnings?: string[];
}

/** Makes a new draft from a WIF file; the server says what is wrong with a file it cannot read. */
export function importWif(file: File): Promise<ImportedWif> {
  const form = new FormData();
  form.append('file', file);
  return api.postForm('/api/drafts/import-wif', form);
}

export function useImportWif() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: importWif, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['drafts', 'list'] }) });
}
