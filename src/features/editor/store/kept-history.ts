import type { Draft } from '../../../../shared/weave';
import { historyKey, type LocalStore } from '../../../lib/local-drafts';
import type { DraftStore, Step } from './draft-store';

/** Undo and redo steps kept on the device, with a fingerprint of the draft they end at. */
export interface KeptHistory {
  fingerprint: string;
  past: Step[];
  future: Step[];
}

/** A short fingerprint of a whole draft (FNV-1a over its JSON): equal drafts give equal fingerprints. */
export function fingerprint(draft: Draft): string {
  const text = JSON.stringify(draft);
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619) >>> 0;
  return `${text.length}:${h.toString(16)}`;
}

/**
 * Gives the store back the steps kept for this draft, when they end at the draft it opened with
 * (patches applied to another draft would undo the wrong things). Returns how many undo steps came back.
 */
export async function restoreKeptHistory(local: LocalStore | null, draftId: string, doc: DraftStore): Promise<number> {
  const kept = local ? await local.get<KeptHistory>(historyKey(draftId)).catch(() => undefined) : undefined;
  if (!kept || kept.fingerprint !== fingerprint(doc.get().draft)) return 0;
  doc.restoreHistory(kept);
  return kept.past.length;
}

/** Writes the undo history to the device a moment after each change, and at once on {@link flush}. */
export function keepHistory(local: LocalStore | null, draftId: string, doc: DraftStore, delay = 300): { flush(): void; dispose(): void } {
  let timer: ReturnType<typeof setTimeout> | null = null;
  const write = () => {
    if (timer) clearTimeout(timer);
    timer = null;
    const { past, future } = doc.history();
    void local?.put(historyKey(draftId), { fingerprint: fingerprint(doc.get().draft), past, future } satisfies KeptHistory).catch(() => {
      // Storage full or refused: undo still works until the page closes.
    });
  };
  const off = doc.subscribe(() => {
    if (!doc.inGesture() && !timer) timer = setTimeout(write, delay);
  });
  return {
    flush: () => {
      if (timer) write();
    },
    dispose() {
      off();
      if (timer) write();
    },
  };
}
