import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Draft } from '../../../shared/weave';
import { memoryLocalStore, unsavedKey, type UnsavedCopy } from '../../../src/lib/local-drafts';
import { createAutosave, type SaveResult } from '../../../src/features/editor/store/autosave';
import { createDraftStore } from '../../../src/features/editor/store/draft-store';
import { deleteThreadsEdit, setCell, setShafts } from '../../../src/features/editor/store/edits';
import { twill } from './fixtures';

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
    const local = memoryLocalStore();
    const saver = createAutosave({ doc, draftId: '7', version: 4, onSave, delay: 1000, local });
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
    expect(local.map.size).toBe(0);
    saver.dispose();
  });

  it('keeps edits on the device while offline and sends them when the connection returns', async () => {
    const doc = createDraftStore(twill());
    let online = false;
    const onSave = vi.fn(async (_d: Draft, base: number): Promise<SaveResult> => {
      if (!online) throw new TypeError('Failed to fetch');
      return { version: base + 1 };
    });
    const local = memoryLocalStore();
    const events = eventTarget();
    const saver = createAutosave({ doc, draftId: '9', version: 2, onSave, delay: 500, local, events });
    doc.apply(setCell, { grid: 'threading', index: 0, value: 4, on: true, single: true });
    await vi.advanceTimersByTimeAsync(500);
    await flush();
    expect(saver.get().status).toBe('offline');
    // Kept under the draft id, with the version the edits are based on.
    expect([...local.map.keys()]).toEqual([unsavedKey('9')]);
    expect(local.map.get(unsavedKey('9'))).toMatchObject({ baseVersion: 2, document: { threading: expect.arrayContaining([[4]]) } });
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
    expect(local.map.size).toBe(0);
    saver.dispose();
  });

  it('shows a conflict and never overwrites: keep mine saves on top of theirs', async () => {
    const doc = createDraftStore(twill());
    const theirs = twill({ name: 'Their edit' });
    const onSave = vi
      .fn<(d: Draft, base: number) => Promise<SaveResult>>()
      .mockResolvedValueOnce({ conflict: { version: 8, document: theirs } })
      .mockResolvedValueOnce({ version: 9 });
    const saver = createAutosave({ doc, draftId: '3', version: 7, onSave, delay: 100, local: memoryLocalStore() });
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
    const saver = createAutosave({ doc, draftId: '4', version: 11, onSave, delay: 100, local: memoryLocalStore() });
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
    const saver = createAutosave({ doc, draftId: '5', version: 1, onSave, delay: 100, local: memoryLocalStore() });
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

  it('writes the copy on the device a moment after an edit, before the save is due', async () => {
    const doc = createDraftStore(twill());
    const local = memoryLocalStore();
    const onSave = vi.fn(async (_d: Draft, base: number): Promise<SaveResult> => ({ version: base + 1 }));
    const saver = createAutosave({ doc, draftId: '6', version: 1, onSave, delay: 1000, keepDelay: 150, local });
    doc.apply(setShafts, { shafts: 6 });
    await vi.advanceTimersByTimeAsync(150);
    expect(onSave).not.toHaveBeenCalled();
    expect((local.map.get(unsavedKey('6')) as UnsavedCopy).document.shafts).toBe(6);
    saver.dispose();
  });

  it('leaving sends unsent edits at once, in a request that outlives the page', async () => {
    const doc = createDraftStore(twill());
    const local = memoryLocalStore();
    const onSave = vi.fn(async (_d: Draft, base: number, _o?: { keepalive?: boolean }): Promise<SaveResult> => ({ version: base + 1 }));
    const saver = createAutosave({ doc, draftId: '8', version: 1, onSave, delay: 1000, local });
    doc.apply(setShafts, { shafts: 6 });
    // Unmounting (another section, another page) leaves: nothing waits for the pause.
    saver.dispose();
    expect(onSave).toHaveBeenCalledTimes(1);
    expect(onSave.mock.calls[0][2]).toEqual({ keepalive: true });
    expect((local.map.get(unsavedKey('8')) as UnsavedCopy).document.shafts).toBe(6);
    await flush();
    // The answer still clears the copy on the device, though the editor has gone.
    expect(local.map.size).toBe(0);
  });

  it('a conflict with the very draft sent is no conflict: an earlier send arrived without its answer', async () => {
    const doc = createDraftStore(twill());
    const onSave = vi.fn(async (d: Draft): Promise<SaveResult> => ({ conflict: { version: 5, document: structuredClone(d) } }));
    const saver = createAutosave({ doc, draftId: '10', version: 4, onSave, delay: 100, local: memoryLocalStore() });
    saver.forceSave();
    await flush();
    expect(saver.get()).toMatchObject({ status: 'saved', version: 5, conflict: null });
    saver.dispose();
  });

  it('never sends a draft without ends or picks, and says why; the copy stays on the device', async () => {
    const doc = createDraftStore(twill());
    const local = memoryLocalStore();
    const onSave = vi.fn(async (_d: Draft, base: number): Promise<SaveResult> => ({ version: base + 1 }));
    const saver = createAutosave({ doc, draftId: '11', version: 1, onSave, delay: 100, local });
    doc.apply(deleteThreadsEdit, { axis: 'ends', from: 0, to: 7 });
    await vi.advanceTimersByTimeAsync(100);
    await flush();
    expect(onSave).not.toHaveBeenCalled();
    expect(saver.get().status).toBe('incomplete');
    expect(saver.cannotSendOnLeave()).toBe(true);
    expect((local.map.get(unsavedKey('11')) as UnsavedCopy).document.threading).toEqual([]);
    // Drawing an end again makes it saveable.
    doc.apply(setCell, { grid: 'threading', index: 0, value: 1, on: true, single: true });
    await vi.advanceTimersByTimeAsync(100);
    await flush();
    expect(onSave).toHaveBeenCalledTimes(1);
    expect(saver.get().status).toBe('saved');
    saver.dispose();
  });

  it('asks before the page closes only when the edits cannot go with it', async () => {
    const doc = createDraftStore(twill());
    const onSave = vi.fn(async (): Promise<SaveResult> => {
      throw new TypeError('Failed to fetch');
    });
    const saver = createAutosave({ doc, draftId: '12', version: 1, onSave, delay: 100, local: memoryLocalStore() });
    expect(saver.cannotSendOnLeave({ pageClosing: true })).toBe(false);
    doc.apply(setShafts, { shafts: 6 });
    // Not yet tried: it can still go with the page.
    expect(saver.cannotSendOnLeave({ pageClosing: true })).toBe(false);
    await vi.advanceTimersByTimeAsync(100);
    await flush();
    expect(saver.get().status).toBe('offline');
    expect(saver.cannotSendOnLeave({ pageClosing: true })).toBe(true);
    saver.dispose();
  });
});
