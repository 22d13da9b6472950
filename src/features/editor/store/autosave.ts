import type { Draft } from '../../../../shared/weave';
import { createStore, type Store } from './create-store';
import type { DraftStore } from './draft-store';

export type SaveResult = { version: number } | { conflict: { version: number; document: Draft } };
export type SaveFn = (doc: Draft, baseVersion: number) => Promise<SaveResult>;

export type SaveStatus = 'saved' | 'saving' | 'offline' | 'conflict';

export const SAVE_STATUS_TEXT: Record<SaveStatus, string> = {
  saved: 'Saved',
  saving: 'Saving…',
  offline: 'Offline — edits kept on this device',
  conflict: 'Conflict',
};

export interface AutosaveState {
  status: SaveStatus;
  /** The server version the open draft is based on. */
  version: number;
  /** What the server holds when someone else saved first. */
  conflict: { version: number; document: Draft } | null;
}

export interface Autosave extends Store<AutosaveState> {
  /** Keep my draft: saved as a new version on top of theirs. */
  keepMine(): void;
  /** Take theirs: the open draft becomes the server's copy (not an undo step). */
  takeTheirs(): void;
  /** Sends now, without waiting for the pause (also used when the connection returns). */
  flush(): void;
  /** Sends the open draft even if it has not changed since the last save (a restored local copy). */
  forceSave(): void;
  dispose(): void;
}

export interface AutosaveOptions {
  doc: DraftStore;
  /** Names the local copy; without it the draft's name is used. */
  draftId: string;
  version: number;
  onSave: SaveFn;
  /** Pause after the last edit before saving, ms. */
  delay?: number;
  storage?: Pick<Storage, 'getItem' | 'setItem' | 'removeItem' | 'key' | 'length'> | null;
  /** Where `online` events come from (window in the browser). */
  events?: Pick<Window, 'addEventListener' | 'removeEventListener'> | null;
}

const PREFIX = 'shedwright:unsaved:';
const keyFor = (draftId: string, version: number) => `${PREFIX}${draftId}:${version}`;
const MAX_BACKOFF = 30_000;

interface LocalCopy {
  document: Draft;
  baseVersion: number;
}

/** A copy of this draft kept on the device (edits not yet on the server), if there is one. */
export function findLocalCopy(storage: AutosaveOptions['storage'], draftId: string): LocalCopy | null {
  if (!storage) return null;
  let best: LocalCopy | null = null;
  for (let i = 0; i < storage.length; i++) {
    const key = storage.key(i);
    if (!key?.startsWith(`${PREFIX}${draftId}:`)) continue;
    try {
      const copy = JSON.parse(storage.getItem(key) ?? 'null') as LocalCopy | null;
      if (copy && typeof copy.baseVersion === 'number' && (!best || copy.baseVersion > best.baseVersion)) best = copy;
    } catch {
      // A damaged copy is skipped; the server's draft stands.
    }
  }
  return best;
}

/**
 * Saves the open draft a moment after the weaver stops editing. Each save sends a snapshot with
 * the version it was based on; until the server has it, the snapshot is kept in localStorage
 * (keyed by draft id and base version). Failed saves retry with backoff and when the browser
 * comes back online; a conflict waits for the weaver's choice and never overwrites silently.
 */
export function createAutosave({ doc, draftId, version, onSave, delay = 1000, storage = null, events = null }: AutosaveOptions): Autosave {
  const state = createStore<AutosaveState>({ status: 'saved', version, conflict: null });
  const set = (patch: Partial<AutosaveState>) => state.set((s) => ({ ...s, ...patch }));
  let savedRevision = doc.get().revision;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let inFlight = false;
  let attempts = 0;
  let disposed = false;

  const keep = (document: Draft, base: number) => {
    try {
      storage?.setItem(keyFor(draftId, base), JSON.stringify({ document, baseVersion: base } satisfies LocalCopy));
    } catch {
      // Storage full or blocked: the edits stay in memory and are still sent.
    }
  };
  const forget = (base: number) => storage?.removeItem(keyFor(draftId, base));

  const schedule = (ms: number) => {
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      void send();
    }, ms);
  };

  const send = async () => {
    if (disposed || inFlight || state.get().conflict) return;
    const { draft, revision } = doc.get();
    if (revision === savedRevision) {
      set({ status: 'saved' });
      return;
    }
    const base = state.get().version;
    keep(draft, base);
    inFlight = true;
    set({ status: 'saving' });
    try {
      const result = await onSave(draft, base);
      inFlight = false;
      if (disposed) return;
      attempts = 0;
      if ('conflict' in result) {
        set({ status: 'conflict', conflict: result.conflict });
        return;
      }
      forget(base);
      savedRevision = revision;
      set({ version: result.version });
      // Edits made while this save was on its way go in the next one.
      if (doc.get().revision !== revision) {
        keep(doc.get().draft, result.version);
        schedule(delay);
      } else set({ status: 'saved' });
    } catch {
      inFlight = false;
      if (disposed) return;
      attempts++;
      set({ status: 'offline' });
      schedule(Math.min(MAX_BACKOFF, 1000 * 2 ** (attempts - 1)));
    }
  };

  const forceSave = () => {
    savedRevision = -1;
    if (timer) clearTimeout(timer);
    timer = null;
    void send();
  };

  const offDoc = doc.subscribe(() => {
    if (doc.get().revision === savedRevision || state.get().conflict) return;
    if (state.get().status !== 'offline') set({ status: 'saving' });
    schedule(delay);
  });
  const onOnline = () => {
    attempts = 0;
    schedule(0);
  };
  events?.addEventListener('online', onOnline);

  return {
    ...state,
    keepMine() {
      const c = state.get().conflict;
      if (!c) return;
      forget(state.get().version);
      set({ conflict: null, version: c.version, status: 'saving' });
      // My draft goes on top of theirs even if nothing changed since the refused save.
      forceSave();
    },
    forceSave,
    takeTheirs() {
      const c = state.get().conflict;
      if (!c) return;
      forget(state.get().version);
      // Loaded while the conflict still stands, so the change is not taken for an edit to save.
      doc.load(c.document);
      savedRevision = doc.get().revision;
      set({ conflict: null, version: c.version, status: 'saved' });
    },
    flush() {
      if (timer) clearTimeout(timer);
      timer = null;
      void send();
    },
    dispose() {
      disposed = true;
      if (timer) clearTimeout(timer);
      offDoc();
      events?.removeEventListener('online', onOnline);
    },
  };
}
