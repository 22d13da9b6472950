import { describe, expect, it } from 'vitest';
import { parseDraft } from '../../../shared/weave';
import { computeLayout, regionOf } from '../../../src/features/editor/canvas/layout';
import { createEditor } from '../../../src/features/editor/store/editor';
import { copyRange, fillLayers, paintColor, pasteClip, repeatWithChangeRun } from '../../../src/features/editor/store/edits';
import { visibleGrids } from '../../../src/features/editor/store/grids';
import { twill } from './fixtures';

const valid = (d: ReturnType<typeof twill>) => expect(() => parseDraft(JSON.parse(JSON.stringify(d)))).not.toThrow();
const arrangement = { threadingBelow: false, treadlingLeft: false, shaftsFromTop: false, endOneRight: false };

describe('layer rows', () => {
  it('paints a layer like a colour, filling out an empty layer list first', () => {
    const d = twill();
    expect(d.warpLayers).toEqual([]);
    const painted = paintColor(d, { grid: 'warpLayers', from: 2, to: 3, color: 2 });
    expect(painted.warpLayers).toEqual([1, 1, 2, 2, 1, 1, 1, 1]);
    valid(painted);
    expect(paintColor(d, { grid: 'warpLayers', from: 0, to: 0, color: 17 })).toBe(d);
    // Copy and paste along a layer row, as along a colour row.
    const clip = copyRange(painted, { grid: 'warpLayers', from: 2, to: 3 });
    expect(pasteClip(painted, { grid: 'weftLayers', at: 0, clip }).weftLayers).toEqual([2, 2, 1, 1, 1, 1, 1, 1]);
  });

  it('fills layers by alternating, by colour and by shaft', () => {
    const d = twill({ warpColors: [0, 1, 0, 1, 1, 1, 0, 0] });
    expect(fillLayers(d, { axis: 'ends', by: { kind: 'alternate', from: 0, to: 7 } }).warpLayers).toEqual([1, 2, 1, 2, 1, 2, 1, 2]);
    expect(fillLayers(d, { axis: 'ends', by: { kind: 'colour', colour: 1, layer: 2 } }).warpLayers).toEqual([1, 2, 1, 2, 2, 2, 1, 1]);
    // The twill is threaded 1-2-3-4 twice: ends on shafts 3-4 are ends 3, 4, 7, 8.
    const byShaft = fillLayers(d, { axis: 'ends', by: { kind: 'shaft', low: 3, high: 4, layer: 2 } });
    expect(byShaft.warpLayers).toEqual([1, 1, 2, 2, 1, 1, 2, 2]);
    valid(byShaft);
    expect(fillLayers(d, { axis: 'picks', by: { kind: 'alternate', from: 0, to: 7 } }).weftLayers).toEqual([1, 2, 1, 2, 1, 2, 1, 2]);
  });

  it('shows the rows beside the colour rows once asked for or once the draft has layers', () => {
    const d = twill();
    expect(regionOf(computeLayout(d, arrangement, 10, 900, 600), 'warpLayers')).toBeUndefined();
    const layout = computeLayout(d, arrangement, 10, 900, 600, true);
    const warp = regionOf(layout, 'warpLayers')!;
    const colours = regionOf(layout, 'warpColors')!;
    expect(warp.y + warp.height).toBeLessThan(colours.y);
    expect(warp.x).toBe(colours.x);
    const weft = regionOf(layout, 'weftLayers')!;
    expect(weft.x).toBeGreaterThan(regionOf(layout, 'weftColors')!.x);
    expect(visibleGrids(d)).not.toContain('warpLayers');
    expect(visibleGrids(fillLayers(d, { axis: 'ends', by: { kind: 'alternate', from: 0, to: 7 } }))).toEqual(['warpLayers', 'warpColors', 'threading', 'tieup', 'treadling', 'weftColors', 'weftLayers']);
  });

  it('draws in a layer row with the pointer, one undo step', () => {
    const editor = createEditor(twill(), { layerRows: true, layer: 2 });
    editor.pointerDown({ grid: 'warpLayers', col: 1, row: 0 });
    editor.pointerMove({ grid: 'warpLayers', col: 3, row: 0 });
    editor.pointerUp();
    expect(editor.doc.get().draft.warpLayers).toEqual([1, 2, 2, 2, 1, 1, 1, 1]);
    editor.undo();
    expect(editor.doc.get().draft.warpLayers).toEqual([]);
  });
});

describe('repeat with a change', () => {
  it('repeats a colour unit K times and then reversed K times across the warp, leaving the threading', () => {
    const d = twill({ threading: Array.from({ length: 24 }, (_, i) => [(i % 4) + 1]), warpColors: [0, 1, 0, 1, ...new Array(20).fill(0)] });
    const out = repeatWithChangeRun(d, { grid: 'warpColors', from: 0, to: 3, times: 2, change: 'reverse' });
    expect(out.warpColors).toEqual([0, 1, 0, 1, 0, 1, 0, 1, 1, 0, 1, 0, 1, 0, 1, 0, 0, 1, 0, 1, 0, 1, 0, 1]);
    expect(out.threading).toBe(d.threading);
    valid(out);
  });

  it('grows the draft to hold at least one run and one change', () => {
    const d = twill();
    const out = repeatWithChangeRun(d, { grid: 'threading', from: 0, to: 3, times: 2, change: 'reverse' });
    expect(out.threading.map(([s]) => s)).toEqual([1, 2, 3, 4, 1, 2, 3, 4, 4, 3, 2, 1, 4, 3, 2, 1]);
    valid(out);
  });
});
