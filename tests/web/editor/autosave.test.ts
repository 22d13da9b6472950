import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Draft } from '../../../shared/weave';
import { createAutosave, findLocalCopy, type SaveResult } from '../../../src/features/editor/store/autosave';
import { createDraftStore } from '../../../src/features/editor/store/draft-store';
import { setCell, setShafts } from '../../../src/features/editor/store/edits';
import { twill } from './fixtures';

/** A Storage stand-in (a Map), so each test starts with an empty device. */
function memoryStorage() {
  const map = new Map<string, string>();
  return {
    map,
    get length() {
      return map.size;
    },
    key: (i: number) => [...map.keys()][i] ?? null,
    getItem: (k: string) => map.get(k) ?? null,
    setItem: (k: string, v: string) => void map.set(k, v),
    removeItem: (k: string) => void map.delete(k),
  };
}

/** window stand-in for the `online` event. */
function eventTarget() {
  const target = new EventTarget();
  return { addEventListener: target.addEventListener.bind(target), removeEventListener: target.removeEventListener.bind(target), fire: (t: string) => target.dispatchEvent(new Event(t)) };
}

const flush = async () => {
  // Let the save promise settle between timer steps.
  for (let i = 0; i < 5; i++) await Promise.resolve();
};

beforeEach(() => {
  vi.useFakeTimers();
});
afterEach(() => {
  vi.useRealTimers();
});

describe('autosave', () => {
  it('waits for a pause, sends one snapshot with its base version, then shows Saved', async () => {
    const doc = createDraftStore(twill());
    const onSave = vi.fn(async (_d: Draft, base: number): Promise<SaveResult> => ({ version: base + 1 }));
    const storage = memoryStorage();
    const saver = createAutosave({ doc, draftId: '7', version: 4, onSave, delay: 1000, storage });
    doc.apply(setShafts, { shafts: 5 });
    doc.apply(setShafts, { shafts: 6 });
    expect(saver.get().status).toBe('saving');
    await vi.advanceTimersByTimeAsync(999);
    expect(onSave).not.toHaveBeenCalled();
    await vi.advanceTimersByTimeAsync(1);
    await flush();
    expect(onSave).toHaveBeenCalledTimes(1);
    expect(onSave.mock.calls[0][0].shafts).toBe(6);
    expect(onSave.mock.calls[0][1]).toBe(4);
    expect(saver.get()).toMatchObject({ status: 'saved', version: 5 });
    // Once the server has it, the copy on the device is dropped.
    expect(storage.map.size).toBe(0);
    saver.dispose();
  });

  it('keeps edits on the device while offline and sends them when the connection returns', async () => {
    const doc = createDraftStore(twill());
    let online = false;
    const onSave = vi.fn(async (_d: Draft, base: number): Promise<SaveResult> => {
      if (!online) throw new TypeError('Failed to fetch');
      return { version: base + 1 };
    });
    const storage = memoryStorage();
    const events = eventTarget();
    const saver = createAutosave({ doc, draftId: '9', version: 2, onSave, delay: 500, storage, events });
    doc.apply(setCell, { grid: 'threading', index: 0, value: 4, on: true, single: true });
    await vi.advanceTimersByTimeAsync(500);
    await flush();
    expect(saver.get().status).toBe('offline');
    // Kept under the draft id and the version the edits are based on.
    expect([...storage.map.keys()]).toEqual(['shedwright:unsaved:9:2']);
    expect(findLocalCopy(storage, '9')?.document.threading[0]).toEqual([4]);
    // Retries back off: 1 s, then 2 s.
    await vi.advanceTimersByTimeAsync(1000);
    await flush();
    expect(onSave).toHaveBeenCalledTimes(2);
    await vi.advanceTimersByTimeAsync(1999);
    expect(onSave).toHaveBeenCalledTimes(2);
    online = true;
    events.fire('online');
    await vi.advanceTimersByTimeAsync(0);
    await flush();
    expect(onSave).toHaveBeenCalledTimes(3);
    expect(saver.get()).toMatchObject({ status: 'saved', version: 3 });
    expect(storage.map.size).toBe(0);
    saver.dispose();
  });

  it('shows a conflict and never overwrites: keep mine saves on top of theirs', async () => {
    const doc = createDraftStore(twill());
    const theirs = twill({ name: 'Their edit' });
    const onSave = vi
      .fn<(d: Draft, base: number) => Promise<SaveResult>>()
      .mockResolvedValueOnce({ conflict: { version: 8, document: theirs } })
      .mockResolvedValueOnce({ version: 9 });
    const saver = createAutosave({ doc, draftId: '3', version: 7, onSave, delay: 100, storage: memoryStorage() });
    doc.apply(setShafts, { shafts: 6 });
    await vi.advanceTimersByTimeAsync(100);
    await flush();
    expect(saver.get().status).toBe('conflict');
    expect(saver.get().conflict?.version).toBe(8);
    // More edits during the conflict are not sent until the weaver chooses.
    doc.apply(setShafts, { shafts: 7 });
    await vi.advanceTimersByTimeAsync(5000);
    expect(onSave).toHaveBeenCalledTimes(1);
    saver.keepMine();
    await flush();
    expect(onSave).toHaveBeenCalledTimes(2);
    expect(onSave.mock.calls[1][1]).toBe(8);
    expect(onSave.mock.calls[1][0].shafts).toBe(7);
    expect(saver.get()).toMatchObject({ status: 'saved', version: 9, conflict: null });
    saver.dispose();
  });

  it('take theirs loads the server copy without an undo step', async () => {
    const doc = createDraftStore(twill());
    const theirs = twill({ name: 'Their edit' });
    const onSave = vi.fn(async (): Promise<SaveResult> => ({ conflict: { version: 12, document: theirs } }));
    const saver = createAutosave({ doc, draftId: '4', version: 11, onSave, delay: 100, storage: memoryStorage() });
    doc.apply(setShafts, { shafts: 6 });
    await vi.advanceTimersByTimeAsync(100);
    await flush();
    saver.takeTheirs();
    expect(doc.get().draft.name).toBe('Their edit');
    expect(doc.undo()).toBe(false);
    expect(saver.get()).toMatchObject({ status: 'saved', version: 12 });
    await vi.advanceTimersByTimeAsync(5000);
    expect(onSave).toHaveBeenCalledTimes(1);
    saver.dispose();
  });

  it('edits made while a save is on its way go in the next save', async () => {
    const doc = createDraftStore(twill());
    let resolve: (r: SaveResult) => void = () => {};
    const onSave = vi.fn((_d: Draft, base: number) => new Promise<SaveResult>((r) => (resolve = () => r({ version: base + 1 }))));
    const saver = createAutosave({ doc, draftId: '5', version: 1, onSave, delay: 100, storage: memoryStorage() });
    doc.apply(setShafts, { shafts: 5 });
    await vi.advanceTimersByTimeAsync(100);
    doc.apply(setShafts, { shafts: 6 });
    resolve({ version: 2 });
    await flush();
    await vi.advanceTimersByTimeAsync(100);
    await flush();
    expect(onSave).toHaveBeenCalledTimes(2);
    expect(onSave.mock.calls[1][0].shafts).toBe(6);
    expect(onSave.mock.calls[1][1]).toBe(2);
    resolve({ version: 3 });
    await flush();
    expect(saver.get()).toMatchObject({ status: 'saved', version: 3 });
    saver.dispose();
  });
});
