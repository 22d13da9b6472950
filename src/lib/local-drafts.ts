/**
 * What the browser keeps of a draft apart from the server's copy, in IndexedDB: edits the server
 * has not acknowledged yet, the editor's undo history, and the draft's details for opening it
 * again without a network. A store that cannot be opened (private windows, old browsers) is null:
 * the editor then works as before, without the copy on the device.
 */
import type { Draft } from '../../shared/weave';

/** A small key-value store; the browser's is IndexedDB, tests use {@link memoryLocalStore}. */
export interface LocalStore {
  get<T>(key: string): Promise<T | undefined>;
  put(key: string, value: unknown): Promise<void>;
  delete(key: string): Promise<void>;
}

/** Edits not yet on the server, with the version they were made on top of. */
export interface UnsavedCopy {
  document: Draft;
  baseVersion: number;
  /** When the copy was last written (ISO time), to tell the weaver how old it is. */
  keptAt: string;
}

export const unsavedKey = (draftId: string) => `unsaved:${draftId}`;
export const historyKey = (draftId: string) => `history:${draftId}`;
export const detailKey = (draftId: string) => `detail:${draftId}`;

const DB_NAME = 'shedwright';
const STORE = 'kept';

const request = <T>(r: IDBRequest<T>): Promise<T> =>
  new Promise((resolve, reject) => {
    r.onsuccess = () => resolve(r.result);
    r.onerror = () => reject(r.error ?? new Error('IndexedDB request failed'));
  });

let opened: Promise<LocalStore | null> | null = null;

/** The browser's store (opened once per page), or null where IndexedDB is missing or refused. */
export function openLocalStore(): Promise<LocalStore | null> {
  opened ??= openIndexedDb().catch(() => null);
  return opened;
}

async function openIndexedDb(): Promise<LocalStore | null> {
  if (typeof indexedDB === 'undefined') return null;
  const open = indexedDB.open(DB_NAME, 1);
  open.onupgradeneeded = () => open.result.createObjectStore(STORE);
  const db = await request(open);
  // Writes to one object store run in the order they were started, so a copy written after a
  // delete is never removed by it.
  const run = async <T>(mode: IDBTransactionMode, act: (s: IDBObjectStore) => IDBRequest<T>): Promise<T> =>
    request(act(db.transaction(STORE, mode).objectStore(STORE)));
  return {
    get: async <T>(key: string) => (await run('readonly', (s) => s.get(key))) as T | undefined,
    put: async (key, value) => void (await run('readwrite', (s) => s.put(value, key))),
    delete: async (key) => void (await run('readwrite', (s) => s.delete(key))),
  };
}

/** A store in memory, for tests: structured clones like IndexedDB, so stored values cannot change. */
export function memoryLocalStore(): LocalStore & { map: Map<string, unknown> } {
  const map = new Map<string, unknown>();
  return {
    map,
    get: async <T>(key: string) => (map.has(key) ? (structuredClone(map.get(key)) as T) : undefined),
    put: async (key, value) => void map.set(key, structuredClone(value)),
    delete: async (key) => void map.delete(key),
  };
}

// Earlier builds kept unsaved edits in localStorage under `shedwright:unsaved:<draft>:<version>`.
const LEGACY_PREFIX = 'shedwright:unsaved:';

/**
 * The unsaved copy of a draft on this device, if any: from IndexedDB, or one left in localStorage
 * by an earlier build (moved over, so it is not lost).
 */
export async function readUnsaved(store: LocalStore | null, draftId: string): Promise<UnsavedCopy | null> {
  const kept = store ? await store.get<UnsavedCopy>(unsavedKey(draftId)).catch(() => undefined) : undefined;
  if (kept) return kept;
  const legacy = readLegacy(draftId);
  if (legacy && store) {
    await store.put(unsavedKey(draftId), legacy.copy);
    for (const key of legacy.keys) localStorage.removeItem(key);
  }
  return legacy?.copy ?? null;
}

function readLegacy(draftId: string): { copy: UnsavedCopy; keys: string[] } | null {
  let storage: Storage;
  try {
    if (typeof localStorage === 'undefined') return null;
    storage = localStorage;
  } catch {
    return null;
  }
  let best: UnsavedCopy | null = null;
  const keys: string[] = [];
  for (let i = 0; i < storage.length; i++) {
    const key = storage.key(i);
    if (!key?.startsWith(`${LEGACY_PREFIX}${draftId}:`)) continue;
    keys.push(key);
    try {
      const copy = JSON.parse(storage.getItem(key) ?? 'null') as { document: Draft; baseVersion: number } | null;
      if (copy && typeof copy.baseVersion === 'number' && (!best || copy.baseVersion > best.baseVersion)) {
        best = { document: copy.document, baseVersion: copy.baseVersion, keptAt: new Date().toISOString() };
      }
    } catch {
      // A damaged copy is skipped; the server's draft stands.
    }
  }
  return best ? { copy: best, keys } : null;
}
