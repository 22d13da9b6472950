import { describe, expect, it } from 'vitest';
import { computeDrawdown, liftPlanOf, parseDraft } from '../../../shared/weave';
import {
  addPaletteColor,
  copyRange,
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
  tryTreadling,
} from '../../../src/features/editor/store/edits';
import { twill } from './fixtures';

/** Every edit must leave a document the engine's parser accepts (lists in step, values in range). */
const valid = (d: ReturnType<typeof twill>) => expect(() => parseDraft(JSON.parse(JSON.stringify(d)))).not.toThrow();

describe('drawing', () => {
  it('puts an end on one shaft, replacing what it was on', () => {
    const d = setCell(twill(), { grid: 'threading', index: 0, value: 3, on: true, single: true });
    expect(d.threading[0]).toEqual([3]);
    expect(d.threading[1]).toEqual([2]);
    valid(d);
  });

  it('adds a second shaft when not single, and clears it again', () => {
    const a = setCell(twill(), { grid: 'threading', index: 0, value: 3, on: true });
    expect(a.threading[0]).toEqual([1, 3]);
    const b = setCell(a, { grid: 'threading', index: 0, value: 1, on: false });
    expect(b.threading[0]).toEqual([3]);
  });

  it('returns the same draft when nothing changes, and keeps untouched rows identical', () => {
    const d = twill();
    expect(setCell(d, { grid: 'threading', index: 0, value: 1, on: true, single: true })).toBe(d);
    expect(setCell(d, { grid: 'threading', index: 0, value: 9, on: true })).toBe(d); // shaft 9 of 4
    const e = setCell(d, { grid: 'tieup', index: 0, value: 4, on: true });
    expect(e.tieup[0]).toEqual([1, 2, 4]);
    expect(e.tieup[1]).toBe(d.tieup[1]);
    expect(e.threading).toBe(d.threading);
  });

  it('grows ends when drawing past the last one, carrying the last colour', () => {
    const d = paintColor(twill(), { grid: 'warpColors', from: 7, to: 7, color: 2 });
    const e = setCell(d, { grid: 'threading', index: 10, value: 2, on: true, single: true });
    expect(e.threading).toHaveLength(11);
    expect(e.threading[8]).toEqual([]);
    expect(e.threading[10]).toEqual([2]);
    expect(e.warpColors.slice(8)).toEqual([2, 2, 2]);
    valid(e);
  });

  it('grows picks in the treadling with weft colours', () => {
    const e = setCell(twill(), { grid: 'treadling', index: 9, value: 1, on: true, single: true });
    expect(e.treadling).toHaveLength(10);
    expect(e.weftColors).toHaveLength(10);
    valid(e);
  });

  it('toggles the tie-up and lift plan cells', () => {
    const d = twill({ control: 'liftplan', liftplan: [[1], [2]], treadling: [], treadles: 0, tieup: [] });
    const e = setCell(d, { grid: 'liftplan', index: 1, value: 4, on: true });
    expect(e.liftplan[1]).toEqual([2, 4]);
    valid(e);
  });

  it('erases a range', () => {
    const e = eraseRange(twill(), { grid: 'threading', from: 2, to: 4 });
    expect(e.threading.slice(1, 6)).toEqual([[2], [], [], [], [2]]);
    valid(e);
  });
});

describe('runs and fills', () => {
  it('fills with a straight run over a band of shafts', () => {
    const d = setShafts(twill(), { shafts: 8 });
    const e = fillRun(d, { grid: 'threading', from: 0, to: 9, low: 3, high: 6, kind: 'straight' });
    expect(e.threading.map((x) => x[0])).toEqual([3, 4, 5, 6, 3, 4, 5, 6, 3, 4]);
    valid(e);
  });

  it('fills with the point draw of the engine', () => {
    const e = fillRun(twill(), { grid: 'threading', from: 0, to: 7, low: 1, high: 4, kind: 'point' });
    // Source: pointDraw(4) = [1, 2, 3, 4, 3, 2], documented in shared/weave/sequences.ts.
    expect(e.threading.map((x) => x[0])).toEqual([1, 2, 3, 4, 3, 2, 1, 2]);
  });

  it('fills with a broken run', () => {
    const e = fillRun(twill(), { grid: 'treadling', from: 0, to: 7, low: 1, high: 4, kind: 'broken' });
    // Source: brokenDraw(4, 4) = [1, 2, 3, 4, 2, 1, 4, 3] in shared/weave/sequences.ts.
    expect(e.treadling.map((x) => x[0])).toEqual([1, 2, 3, 4, 2, 1, 4, 3]);
    valid(e);
  });

  it('repeats a selected run after itself with its colours, growing the draft', () => {
    const d = paintColor(twill(), { grid: 'warpColors', from: 1, to: 1, color: 2 });
    const e = repeatRun(d, { axis: 'ends', from: 0, to: 2, times: 3 });
    expect(e.threading).toHaveLength(12);
    expect(e.threading.slice(3, 12).map((x) => x[0])).toEqual([1, 2, 3, 1, 2, 3, 1, 2, 3]);
    expect(e.warpColors.slice(3, 6)).toEqual([0, 2, 0]);
    valid(e);
  });

  it('mirrors a run into a point repeat', () => {
    const e = mirrorRun(twill(), { axis: 'ends', grid: 'threading', from: 0, to: 3 });
    expect(e.threading.slice(0, 7).map((x) => x[0])).toEqual([1, 2, 3, 4, 3, 2, 1]);
    valid(e);
  });

  it('reverses a run and flips one upside down', () => {
    const r = reverseRange(twill(), { grid: 'threading', from: 0, to: 3 });
    expect(r.threading.slice(0, 4).map((x) => x[0])).toEqual([4, 3, 2, 1]);
    const f = flipRange(twill(), { grid: 'threading', from: 0, to: 3, low: 1, high: 4 });
    expect(f.threading.slice(0, 4).map((x) => x[0])).toEqual([4, 3, 2, 1]);
    const w = reverseRange(paintColor(twill(), { grid: 'weftColors', from: 0, to: 0, color: 2 }), { grid: 'weftColors', from: 0, to: 2 });
    expect(w.weftColors.slice(0, 3)).toEqual([1, 1, 2]);
  });
});

describe('insert and delete', () => {
  it('inserts ends with the colour before them and deletes them again', () => {
    const d = paintColor(twill(), { grid: 'warpColors', from: 2, to: 2, color: 2 });
    const e = insertThreadsEdit(d, { axis: 'ends', at: 3, count: 2 });
    expect(e.threading).toHaveLength(10);
    expect(e.threading[3]).toEqual([]);
    expect(e.warpColors.slice(2, 6)).toEqual([2, 2, 2, 0]);
    valid(e);
    const f = deleteThreadsEdit(e, { axis: 'ends', from: 3, to: 4 });
    expect(f).toEqual(d);
  });

  it('inserts and deletes picks with layers kept in step', () => {
    const d = twill({ weftLayers: [1, 2, 1, 2, 1, 2, 1, 2] });
    const e = insertThreadsEdit(d, { axis: 'picks', at: 0, count: 1 });
    expect(e.treadling).toHaveLength(9);
    expect(e.weftLayers).toHaveLength(9);
    valid(e);
    const f = deleteThreadsEdit(e, { axis: 'picks', from: 5, to: 100 });
    expect(f.treadling).toHaveLength(5);
    expect(f.weftColors).toHaveLength(5);
    valid(f);
  });
});

describe('copy and paste', () => {
  it('pastes a threading run into the treadling, dropping treadles the loom lacks', () => {
    const d = setTreadles(setShafts(twill(), { shafts: 8 }), { treadles: 4 });
    const threaded = fillRun(d, { grid: 'threading', from: 0, to: 7, low: 1, high: 8, kind: 'straight' });
    const clip = copyRange(threaded, { grid: 'threading', from: 2, to: 5 });
    const e = pasteClip(threaded, { grid: 'treadling', at: 0, clip });
    expect(e.treadling.slice(0, 4)).toEqual([[3], [4], [], []]);
    valid(e);
  });

  it('pastes colours only into colour orders', () => {
    const d = paintColor(twill(), { grid: 'warpColors', from: 0, to: 1, color: 2 });
    const clip = copyRange(d, { grid: 'warpColors', from: 0, to: 2 });
    const e = pasteClip(d, { grid: 'weftColors', at: 6, clip });
    expect(e.weftColors.slice(6)).toEqual([2, 2, 0]);
    expect(pasteClip(d, { grid: 'threading', at: 0, clip })).toBe(d);
    valid(e);
  });
});

describe('engine tools', () => {
  it('treadles as drawn in', () => {
    const d = fillRun(twill(), { grid: 'threading', from: 0, to: 7, low: 1, high: 4, kind: 'point' });
    const e = treadleAsDrawnInEdit(d, undefined);
    expect(e.treadling).toEqual(d.threading);
    valid(e);
  });

  it('switches to a lift plan and back without changing the cloth', () => {
    const d = twill();
    const lp = toLiftPlanEdit(d, undefined);
    expect(lp.control).toBe('liftplan');
    expect(lp.liftplan).toEqual(liftPlanOf(d));
    valid(lp);
    const back = toTreadlingEdit(lp, { treadles: 4 });
    expect(back.control).toBe('treadling');
    expect(computeDrawdown(back).bits).toEqual(computeDrawdown(d).bits);
    valid(back);
  });

  it('leaves the draft alone and says why when there are too few treadles', () => {
    const lp = toLiftPlanEdit(twill(), undefined);
    const result = tryTreadling(lp, 1);
    expect(result.ok).toBe(false);
    expect(toTreadlingEdit(lp, { treadles: 1 })).toBe(lp);
  });

  it('changes shaft and treadle counts in place', () => {
    const e = setShafts(twill(), { shafts: 3 });
    expect(e.threading.map((x) => x[0] ?? 0)).toEqual([1, 2, 3, 0, 1, 2, 3, 0]);
    expect(e.tieup[2]).toEqual([3]);
    valid(e);
    const f = setTreadles(twill(), { treadles: 2 });
    expect(f.tieup).toHaveLength(2);
    expect(f.treadling[2]).toEqual([]);
    valid(f);
    expect(setTreadles(twill(), { treadles: 40 }).treadles).toBe(32);
  });
});

describe('palette', () => {
  it('edits, adds and removes colours, remapping ends and picks', () => {
    const d = paintColor(twill(), { grid: 'warpColors', from: 0, to: 0, color: 2 });
    expect(setPaletteColor(d, { index: 0, color: '#ABCDEF' }).palette[0]).toBe('#abcdef');
    expect(setPaletteColor(d, { index: 0, color: 'red' })).toBe(d);
    const a = addPaletteColor(d, { color: '#000000' });
    expect(a.palette).toHaveLength(4);
    const r = removePaletteColor(d, { index: 1 });
    expect(r.palette).toEqual(['#223344', '#aa3311']);
    expect(r.warpColors[0]).toBe(1);
    expect(r.weftColors.every((c) => c === 0)).toBe(true);
    valid(r);
  });

  it('names yarns by colour and removes a yarn with an empty name', () => {
    const d = setYarnName(twill(), { color: 2, name: ' Madder wool ' });
    expect(d.yarns).toEqual([{ id: 'yarn-1', name: 'Madder wool', color: 2 }]);
    const e = setYarnName(d, { color: 2, name: '' });
    expect(e.yarns).toEqual([]);
    valid(d);
  });
});
