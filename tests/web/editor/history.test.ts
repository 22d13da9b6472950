import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseDraft, type Draft } from '../../../shared/weave';
import { createDraftStore, HISTORY_LIMIT } from '../../../src/features/editor/store/draft-store';
import {
  addPaletteColor,
  deleteThreadsEdit,
  eraseRange,
  fillRun,
  flipRange,
  insertThreadsEdit,
  mirrorRun,
  paintColor,
  pasteClip,
  removePaletteColor,
  repeatRun,
  reverseRange,
  setCell,
  setPaletteColor,
  setShafts,
  setTreadles,
  setYarnName,
  toLiftPlanEdit,
  toTreadlingEdit,
  treadleAsDrawnInEdit,
  type Edit,
} from '../../../src/features/editor/store/edits';
import { keepHistory, restoreKeptHistory } from '../../../src/features/editor/store/kept-history';
import { memoryLocalStore } from '../../../src/lib/local-drafts';
import { twill } from './fixtures';

const clone = (d: Draft): Draft => JSON.parse(JSON.stringify(d)) as Draft;

describe('undo history', () => {
  it('undoes a drag as one step and redoes it', () => {
    const store = createDraftStore(twill());
    const before = store.get().draft;
    store.beginGesture();
    for (let e = 0; e < 8; e++) store.apply(setCell, { grid: 'threading', index: e, value: 1, on: true, single: true });
    store.endGesture();
    const after = store.get().draft;
    expect(after.threading.every((x) => x[0] === 1)).toBe(true);
    expect(store.undo()).toBe(true);
    expect(store.get().draft).toEqual(before);
    expect(store.undo()).toBe(false);
    expect(store.redo()).toBe(true);
    expect(store.get().draft).toEqual(after);
  });

  it('a gesture that changes nothing leaves no step', () => {
    const store = createDraftStore(twill());
    store.beginGesture();
    store.apply(setCell, { grid: 'threading', index: 0, value: 1, on: true, single: true });
    store.endGesture();
    expect(store.get().undoLabel).toBeNull();
  });

  it('keeps more than 200 steps', () => {
    const original = twill();
    const store = createDraftStore(original);
    for (let i = 0; i < 250; i++) store.apply(setShafts, { shafts: 5 + (i % 2) });
    let undone = 0;
    while (store.undo()) undone++;
    expect(undone).toBe(250);
    expect(HISTORY_LIMIT).toBeGreaterThanOrEqual(200);
    expect(store.get().draft).toEqual(original);
  });

  it('loading a draft is not an undo step and clears history', () => {
    const store = createDraftStore(twill());
    store.apply(setShafts, { shafts: 6 });
    store.load(twill({ name: 'From the server' }));
    expect(store.undo()).toBe(false);
    expect(store.get().draft.name).toBe('From the server');
  });

  it('a new edit after undo drops the redo steps', () => {
    const store = createDraftStore(twill());
    store.apply(setShafts, { shafts: 6 });
    store.undo();
    store.apply(setShafts, { shafts: 5 });
    expect(store.redo()).toBe(false);
    expect(store.get().draft.shafts).toBe(5);
  });
});

type AnyEdit = [Edit<never>, unknown];
const index = fc.integer({ min: 0, max: 14 });
const shaft = fc.integer({ min: 1, max: 8 });
const editArb: fc.Arbitrary<AnyEdit> = fc.oneof(
  fc.record({ grid: fc.constantFrom('threading', 'tieup', 'treadling', 'liftplan'), index, value: shaft, on: fc.boolean(), single: fc.boolean() }).map((a) => [setCell, a] as AnyEdit),
  fc.record({ grid: fc.constantFrom('warpColors', 'weftColors'), from: index, to: index, color: fc.integer({ min: 0, max: 3 }) }).map((a) => [paintColor, a] as AnyEdit),
  fc.record({ grid: fc.constantFrom('threading', 'treadling', 'weftColors'), from: index, to: index }).map((a) => [eraseRange, a] as AnyEdit),
  fc.record({ grid: fc.constantFrom('threading', 'treadling', 'liftplan'), from: index, to: index, low: shaft, high: shaft, kind: fc.constantFrom('straight', 'point', 'broken') }).map((a) => [fillRun, a] as AnyEdit),
  fc.record({ axis: fc.constantFrom('ends', 'picks'), from: index, to: index, times: fc.integer({ min: 1, max: 3 }) }).map((a) => [repeatRun, a] as AnyEdit),
  fc.record({ axis: fc.constantFrom('ends', 'picks'), grid: fc.constant('threading'), from: index, to: index }).map((a) => [mirrorRun, a] as AnyEdit),
  fc.record({ grid: fc.constantFrom('threading', 'warpColors', 'treadling'), from: index, to: index }).map((a) => [reverseRange, a] as AnyEdit),
  fc.record({ grid: fc.constantFrom('threading', 'tieup'), from: index, to: index, low: shaft, high: shaft }).map((a) => [flipRange, a] as AnyEdit),
  fc.record({ axis: fc.constantFrom('ends', 'picks'), at: index, count: fc.integer({ min: 1, max: 3 }) }).map((a) => [insertThreadsEdit, a] as AnyEdit),
  fc.record({ axis: fc.constantFrom('ends', 'picks'), from: index, to: index }).map((a) => [deleteThreadsEdit, a] as AnyEdit),
  fc.record({ grid: fc.constantFrom('threading', 'treadling'), at: index, clip: fc.record({ kind: fc.constant('lists'), entries: fc.array(fc.array(shaft, { maxLength: 2 }), { maxLength: 4 }) }) }).map((a) => [pasteClip, a] as AnyEdit),
  fc.record({ shafts: fc.integer({ min: 1, max: 10 }) }).map((a) => [setShafts, a] as AnyEdit),
  fc.record({ treadles: fc.integer({ min: 1, max: 10 }) }).map((a) => [setTreadles, a] as AnyEdit),
  fc.record({ index: fc.integer({ min: 0, max: 3 }), color: fc.constantFrom('#102030', '#ffffff', '#a0b0c0') }).map((a) => [setPaletteColor, a] as AnyEdit),
  fc.record({ color: fc.constantFrom('#123456', '#654321') }).map((a) => [addPaletteColor, a] as AnyEdit),
  fc.record({ index: fc.integer({ min: 0, max: 3 }) }).map((a) => [removePaletteColor, a] as AnyEdit),
  fc.record({ color: fc.integer({ min: 0, max: 3 }), name: fc.constantFrom('', 'Undyed linen', 'Indigo cotton') }).map((a) => [setYarnName, a] as AnyEdit),
  fc.constant([treadleAsDrawnInEdit, undefined] as AnyEdit),
  fc.constant([toLiftPlanEdit, undefined] as AnyEdit),
  fc.record({ treadles: fc.integer({ min: 1, max: 10 }) }).map((a) => [toTreadlingEdit, a] as AnyEdit),
);

describe('undo property', () => {
  it('any edits then as many undos give back the original, and redo replays to the same end', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(editArb, fc.boolean()), { maxLength: 30 }),
        (steps) => {
          const original = twill();
          const snapshot = clone(original);
          const store = createDraftStore(original);
          let recorded = 0;
          for (const [[edit, args], inGesture] of steps) {
            // Some edits run inside a gesture, as a drag would run them.
            if (inGesture) store.beginGesture();
            const changed = store.apply(edit, args as never);
            if (inGesture) store.endGesture();
            if (changed) recorded++;
          }
          const end = clone(store.get().draft);
          // Every edit keeps the document one the engine's parser accepts.
          expect(() => parseDraft(end)).not.toThrow();
          let undone = 0;
          while (store.undo()) undone++;
          expect(undone).toBe(recorded);
          expect(store.get().draft).toEqual(snapshot);
          while (store.redo());
          expect(store.get().draft).toEqual(end);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('undo history kept on the device', () => {
  it('comes back after a reload, 250 steps deep, and undoes to the original', async () => {
    const local = memoryLocalStore();
    const original = twill();
    const first = createDraftStore(original);
    const keeper = keepHistory(local, '42', first, 10);
    for (let i = 0; i < 250; i++) first.apply(setShafts, { shafts: 5 + (i % 2) });
    first.undo();
    keeper.dispose();
    // The reload: a new store opening the draft as it was left.
    const second = createDraftStore(clone(first.get().draft));
    expect(await restoreKeptHistory(local, '42', second)).toBe(249);
    expect(second.get().undoLabel).toBe(first.get().undoLabel);
    expect(second.redo()).toBe(true);
    expect(second.undo()).toBe(true);
    while (second.undo());
    expect(second.get().draft).toEqual(original);
  });

  it('is not used for a draft that has changed since (patches would undo the wrong things)', async () => {
    const local = memoryLocalStore();
    const first = createDraftStore(twill());
    const keeper = keepHistory(local, '43', first, 10);
    first.apply(setShafts, { shafts: 6 });
    keeper.dispose();
    const second = createDraftStore(twill({ name: 'Changed elsewhere' }));
    expect(await restoreKeptHistory(local, '43', second)).toBe(0);
    expect(second.undo()).toBe(false);
  });
});
