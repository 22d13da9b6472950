import type { Draft } from '../../../../shared/weave';
import { unsavedKey, type LocalStore, type UnsavedCopy } from '../../../lib/local-drafts';
import { createStore, type Store } from './create-store';
import type { DraftStore } from './draft-store';
import { picksOf } from './editor';
import { fingerprint } from './kept-history';

export type SaveResult = { version: number } | { conflict: { version: number; document: Draft } };
/** Sends a snapshot on top of `baseVersion`; `keepalive` asks the browser to finish it even if the page closes. */
export type SaveFn = (doc: Draft, baseVersion: number, options?: { keepalive?: boolean }) => Promise<SaveResult>;

export type SaveStatus = 'saved' | 'saving' | 'offline' | 'conflict' | 'incomplete';

export const SAVE_STATUS_TEXT: Record<SaveStatus, string> = {
  saved: 'Saved',
  saving: 'Saving…',
  offline: 'Offline — edits kept on this device',
  conflict: 'Conflict',
  incomplete: 'Not saved: a draft needs at least one end and one pick — kept on this device',
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
  /**
   * The weaver is leaving the editor (another section or page, the tab hidden, the page closing):
   * the copy on the device is written and unsent edits go at once, in a request that outlives the page.
   */
  leave(): void;
  /** True when edits are not on the server and cannot be sent as the page closes: leaving should ask first. */
  cannotSendOnLeave(options?: { pageClosing?: boolean }): boolean;
  dispose(): void;
}

export interface AutosaveOptions {
  doc: DraftStore;
  /** Names the copy kept on the device. */
  draftId: string;
  version: number;
  onSave: SaveFn;
  /** Pause after the last edit before saving, ms. */
  delay?: number;
  /** Pause after the last edit before the copy on the device is written, ms. */
  keepDelay?: number;
  /** Where unsent edits are kept (IndexedDB in the browser); null keeps them in memory only. */
  local?: LocalStore | null;
  /** Where `online` events come from (window in the browser). */
  events?: Pick<Window, 'addEventListener' | 'removeEventListener'> | null;
}

const MAX_BACKOFF = 30_000;
/**
 * Browsers refuse `keepalive` requests whose bodies (all in flight together) pass 64 KiB; a larger
 * draft is sent normally, and one still unsent when the page closes is found on the device next time.
 */
export const KEEPALIVE_LIMIT = 60_000;

/** True when the draft may be saved: the server refuses a draft without ends or picks. */
export const isComplete = (d: Draft) => d.threading.length > 0 && picksOf(d) > 0;

/**
 * Saves the open draft a moment after the weaver stops editing. Each save sends a snapshot with
 * the version it was based on; until the server has it, the draft is kept on the device (written a
 * moment after every edit, so a crash loses at most that moment). Failed saves retry with backoff
 * and when the browser comes back online; a conflict waits for the weaver's choice and never
 * overwrites silently.
 */
export function createAutosave({ doc, draftId, version, onSave, delay = 1000, keepDelay = 150, local = null, events = null }: AutosaveOptions): Autosave {
  const state = createStore<AutosaveState>({ status: 'saved', version, conflict: null });
  const set = (patch: Partial<AutosaveState>) => state.set((s) => ({ ...s, ...patch }));
  let savedRevision = doc.get().revision;
  let keptRevision = savedRevision;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let keepTimer: ReturnType<typeof setTimeout> | null = null;
  let inFlight = false;
  let attempts = 0;
  let closed = false;

  const unsent = () => inFlight || doc.get().revision !== savedRevision;

  /** Writes the open draft to the device when it holds edits the server has not acknowledged. */
  const keep = () => {
    if (keepTimer) clearTimeout(keepTimer);
    keepTimer = null;
    const { draft, revision } = doc.get();
    if (revision === savedRevision || revision === keptRevision) return;
    keptRevision = revision;
    const copy: UnsavedCopy = { document: draft, baseVersion: state.get().version, keptAt: new Date().toISOString() };
    void local?.put(unsavedKey(draftId), copy).catch(() => {
      // Storage full or refused: the edits stay in memory and are still sent.
    });
  };
  const forget = () => {
    keptRevision = savedRevision;
    void local?.delete(unsavedKey(draftId)).catch(() => undefined);
  };

  const schedule = (ms: number) => {
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      void send();
    }, ms);
  };

  const send = async () => {
    if (inFlight || state.get().conflict) return;
    const { draft, revision } = doc.get();
    if (revision === savedRevision) {
      set({ status: 'saved' });
      return;
    }
    keep();
    if (!isComplete(draft)) {
      set({ status: 'incomplete' });
      return;
    }
    const base = state.get().version;
    inFlight = true;
    set({ status: 'saving' });
    try {
      const result = await onSave(draft, base, { keepalive: JSON.stringify(draft).length < KEEPALIVE_LIMIT });
      inFlight = false;
      attempts = 0;
      let saved: number;
      if ('version' in result) saved = result.version;
      // The server holding this very draft is no conflict: an earlier send of it arrived, but its
      // answer did not (the page closed first).
      else if (fingerprint(result.conflict.document) === fingerprint(draft)) saved = result.conflict.version;
      else {
        // The copy on the device stays until the weaver chooses.
        set({ status: 'conflict', conflict: result.conflict });
        return;
      }
      savedRevision = revision;
      set({ version: saved });
      if (doc.get().revision === revision) {
        forget();
        set({ status: 'saved' });
      } else {
        // Edits made while this save was on its way go in the next one, on top of the new version.
        keptRevision = savedRevision;
        keep();
        schedule(closed ? 0 : delay);
      }
    } catch {
      inFlight = false;
      attempts++;
      set({ status: 'offline' });
      // After the editor has closed the copy waits on the device for the next visit.
      if (!closed) schedule(Math.min(MAX_BACKOFF, 1000 * 2 ** (attempts - 1)));
    }
  };

  const forceSave = () => {
    savedRevision = -1;
    if (timer) clearTimeout(timer);
    timer = null;
    void send();
  };

  const offDoc = doc.subscribe(() => {
    if (doc.get().revision === savedRevision) return;
    if (!keepTimer) keepTimer = setTimeout(keep, keepDelay);
    if (state.get().conflict) return;
    if (state.get().status === 'saved') set({ status: 'saving' });
    schedule(delay);
  });
  const onOnline = () => {
    attempts = 0;
    schedule(0);
  };
  events?.addEventListener('online', onOnline);

  const leave = () => {
    keep();
    if (timer) clearTimeout(timer);
    timer = null;
    void send();
  };

  return {
    ...state,
    keepMine() {
      const c = state.get().conflict;
      if (!c) return;
      set({ conflict: null, version: c.version, status: 'saving' });
      keptRevision = -1;
      // My draft goes on top of theirs even if nothing changed since the refused save.
      forceSave();
    },
    forceSave,
    takeTheirs() {
      const c = state.get().conflict;
      if (!c) return;
      // Loaded while the conflict still stands, so the change is not taken for an edit to save.
      doc.load(c.document);
      savedRevision = doc.get().revision;
      forget();
      set({ conflict: null, version: c.version, status: 'saved' });
    },
    flush() {
      if (timer) clearTimeout(timer);
      timer = null;
      void send();
    },
    leave,
    cannotSendOnLeave({ pageClosing = false } = {}) {
      if (!unsent()) return false;
      const { status } = state.get();
      if (status === 'offline' || status === 'conflict' || status === 'incomplete') return true;
      return pageClosing && JSON.stringify(doc.get().draft).length >= KEEPALIVE_LIMIT;
    },
    dispose() {
      if (closed) return;
      leave();
      closed = true;
      if (keepTimer) clearTimeout(keepTimer);
      offDoc();
      events?.removeEventListener('online', onOnline);
    },
  };
}
