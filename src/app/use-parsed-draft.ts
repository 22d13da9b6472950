import { useMemo } from 'react';
import { DraftError, parseDraft, type Draft } from '../../shared/weave';

/** The stored document as a draft, parsed once per document, or the reason it cannot be opened. */
export function useParsedDraft(document: unknown): { document: Draft } | { error: Error } {
  return useMemo(() => {
    try {
      return { document: parseDraft(document) };
    } catch (error) {
      return { error: error instanceof DraftError ? error : new Error(String(error)) };
    }
  }, [document]);
}
