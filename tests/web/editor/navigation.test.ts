import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeLayout, regionOf } from '../../../src/features/editor/canvas/layout';
import { scrolledBy, wheelPixels, zoomedAbout, zoomedCell } from '../../../src/features/editor/canvas/wheel';
import { createEditor, DEFAULT_VIEW } from '../../../src/features/editor/store/editor';
import { parseGoTo } from '../../../src/features/editor/store/go-to';
import { twill } from './fixtures';

const wide = twill({ threading: Array.from({ length: 400 }, (_, e) => [(e % 4) + 1]), treadling: Array.from({ length: 300 }, (_, p) => [(p % 4) + 1]) });
const arrangement = DEFAULT_VIEW.arrangement;

describe('wheel and trackpad', () => {
  it('scroll both ways within the grids; Shift turns a mouse wheel sideways', () => {
    const layout = computeLayout(wide, arrangement, 10, 900, 560);
    const view = { cell: 10, scrollX: 0, scrollY: 0 };
    expect(scrolledBy(layout, view, 30, 45)).toEqual({ scrollX: 30, scrollY: 45 });
    expect(scrolledBy(layout, view, -30, 1e9)).toEqual({ scrollX: 0, scrollY: layout.maxScrollY });
    expect(wheelPixels({ deltaX: 0, deltaY: 3, deltaMode: 1, shiftKey: true }, { width: 900, height: 560 })).toEqual({ dx: 48, dy: 0 });
    expect(wheelPixels({ deltaX: 5, deltaY: -7, deltaMode: 0, shiftKey: false }, { width: 900, height: 560 })).toEqual({ dx: 5, dy: -7 });
  });

  it('zoom keeps the thread under the pointer under it', () => {
    const cells = fc.tuple(fc.integer({ min: 4, max: 40 }), fc.integer({ min: 4, max: 40 }));
    fc.assert(fc.property(cells, fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), ([c0, c1], fx, fy) => {
      const before = computeLayout(wide, arrangement, c0, 900, 560);
      const after = computeLayout(wide, arrangement, c1, 900, 560);
      const dd0 = regionOf(before, 'drawdown')!;
      const dd1 = regionOf(after, 'drawdown')!;
      const view = { cell: c0, scrollX: Math.floor(before.maxScrollX / 2), scrollY: Math.floor(before.maxScrollY / 2) };
      const point = { x: dd0.x + fx * (dd0.width - 1), y: dd0.y + fy * (dd0.height - 1) };
      const next = zoomedAbout(before, after, view, point);
      // The end and pick under the pointer, in fractional threads, before and after.
      const endBefore = (view.scrollX + point.x - dd0.x) / c0;
      const endAfter = (next.scrollX + point.x - dd1.x) / c1;
      const pickBefore = (view.scrollY + point.y - dd0.y) / c0;
      const pickAfter = (next.scrollY + point.y - dd1.y) / c1;
      // Unless the new scroll had to stop at an edge of the grids.
      if (next.scrollX > 0 && next.scrollX < after.maxScrollX) expect(endAfter).toBeCloseTo(endBefore, 6);
      if (next.scrollY > 0 && next.scrollY < after.maxScrollY) expect(pickAfter).toBeCloseTo(pickBefore, 6);
    }), { seed: 21, numRuns: 200 });
  });

  it('zooms in and out a little per pinch step and stays within 1–40 pixels a cell', () => {
    expect(zoomedCell(14, -100)).toBeGreaterThan(14 * 1.2);
    expect(zoomedCell(14, 100)).toBeLessThan(14 / 1.2);
    expect(zoomedCell(14, -2)).toBeCloseTo(14 * Math.exp(0.004), 6);
    expect(zoomedCell(40, -500)).toBe(40);
    expect(zoomedCell(1, 500)).toBe(1);
  });
});

describe('the go-to box', () => {
  it('reads ends and picks to go to or select, as a weaver counts them', () => {
    expect(parseGoTo('end 120', wide)).toEqual({ kind: 'go', axis: 'ends', index: 119 });
    expect(parseGoTo('Pick 30', wide)).toEqual({ kind: 'go', axis: 'picks', index: 29 });
    expect(parseGoTo('select ends 1–48', wide)).toEqual({ kind: 'select', axis: 'ends', from: 0, to: 47 });
    expect(parseGoTo('picks 20 to 10', wide)).toEqual({ kind: 'select', axis: 'picks', from: 9, to: 19 });
    expect(parseGoTo('go to p 5', wide)).toEqual({ kind: 'go', axis: 'picks', index: 4 });
  });

  it('says what is wrong', () => {
    expect(parseGoTo('end 401', wide)).toEqual({ error: 'The draft has ends 1 to 400.' });
    expect(parseGoTo('pick 0', wide)).toEqual({ error: 'The draft has picks 1 to 300.' });
    expect('error' in parseGoTo('120', wide)).toBe(true);
  });

  it('moves the cursor there and scrolls it into view; a selection covers every shaft', () => {
    const editor = createEditor(wide, {}, { confirm: () => true });
    const reveal = editor.view.get().revealCursor;
    expect(editor.goTo('ends 1-48')).toBe(true);
    const v = editor.view.get();
    expect(v.selection).toMatchObject({ grid: 'threading', from: { col: 0, row: 0 }, to: { col: 47, row: 0 } });
    expect(v.revealCursor).toBe(reveal + 1);
    editor.fill('straight');
    expect(editor.doc.get().draft.threading.slice(0, 5)).toEqual([[1], [2], [3], [4], [1]]);
    expect(editor.goTo('pick 250')).toBe(true);
    expect(editor.view.get().cursor).toEqual({ grid: 'treadling', col: 0, row: 249 });
    expect(editor.goTo('nonsense')).toBe(false);
    expect(editor.view.get().cursor).toEqual({ grid: 'treadling', col: 0, row: 249 });
  });
});
