// What a drag costs: the stage boxes redrawn for changed cells, and the cursor that waits for pointer up.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { changedRects, type StageRect } from '../../../src/features/editor/canvas/damage';
import { computeLayout, type RegionId } from '../../../src/features/editor/canvas/layout';
import { createEditor } from '../../../src/features/editor/store/editor';
import { twill } from './fixtures';

const contains = (outer: StageRect, inner: StageRect) =>
  inner.x >= outer.x - 1e-9 && inner.y >= outer.y - 1e-9 && inner.x + inner.width <= outer.x + outer.width + 1e-9 && inner.y + inner.height <= outer.y + outer.height + 1e-9;
const overlap = (a: StageRect, b: StageRect) => a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
const whole = (n: number) => Math.abs(n - Math.round(n)) < 1e-9;

describe('changed boxes of the stage', () => {
  const draft = twill({
    threading: Array.from({ length: 40 }, (_, i) => [(i % 4) + 1]),
    treadling: Array.from({ length: 30 }, (_, i) => [(i % 4) + 1]),
  });

  it('cover every changed cell in view, stay apart, and sit on whole device pixels', () => {
    const arrangement = fc.record({ threadingBelow: fc.boolean(), treadlingLeft: fc.boolean(), shaftsFromTop: fc.boolean(), endOneRight: fc.constant(false) });
    fc.assert(
      fc.property(
        arrangement,
        fc.integer({ min: 3, max: 20 }),
        fc.constantFrom(1, 1.25, 1.5, 2),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.array(fc.record({ region: fc.nat(), a: fc.nat(), b: fc.nat(), c: fc.nat(), d: fc.nat() }), { maxLength: 5 }),
        (arr, cell, ratio, fx, fy, picks) => {
          const layout = computeLayout(draft, arr, cell, 500, 400);
          const scrollX = Math.round(fx * layout.maxScrollX);
          const scrollY = Math.round(fy * layout.maxScrollY);
          const changes = picks.map(({ region, a, b, c, d }) => {
            const r = layout.regions[region % layout.regions.length];
            const [x0, x1] = [a % r.cols, b % r.cols].sort((m, n) => m - n);
            const [y0, y1] = [c % r.rows, d % r.rows].sort((m, n) => m - n);
            return { id: r.id as RegionId, box: { x0, y0, x1, y1 } };
          });
          const rects = changedRects(layout, changes, scrollX, scrollY, ratio);
          // Every cell's part that shows in its grid lies in a box.
          for (const { id, box } of changes) {
            const r = layout.regions.find((g) => g.id === id)!;
            const sx = r.scrollsX ? scrollX : 0;
            const sy = r.scrollsY ? scrollY : 0;
            for (let col = box.x0; col <= box.x1; col++) {
              for (let row = box.y0; row <= box.y1; row++) {
                const left = Math.max(r.x, r.x + col * cell - sx);
                const top = Math.max(r.y, r.y + row * cell - sy);
                const right = Math.min(r.x + r.width, r.x + (col + 1) * cell - sx);
                const bottom = Math.min(r.y + r.height, r.y + (row + 1) * cell - sy);
                if (right <= left || bottom <= top) continue;
                const shown = { x: left, y: top, width: right - left, height: bottom - top };
                expect(rects.some((rect) => contains(rect, shown))).toBe(true);
              }
            }
          }
          for (const [i, a] of rects.entries()) {
            for (const b of rects.slice(i + 1)) expect(overlap(a, b)).toBe(false);
            for (const v of [a.x, a.y, a.x + a.width, a.y + a.height]) expect(whole(v * ratio)).toBe(true);
            // No box reaches past the grids (a pixel for the edge lines, and one for snapping).
            expect(a.x).toBeGreaterThanOrEqual(-2);
            expect(a.y).toBeGreaterThanOrEqual(-2);
            expect(a.x + a.width).toBeLessThanOrEqual(layout.width + 2);
            expect(a.y + a.height).toBeLessThanOrEqual(layout.height + 2);
          }
        },
      ),
    );
  });

  it('gives nothing for cells scrolled out of view, and one small box for one cell', () => {
    const layout = computeLayout(draft, { threadingBelow: false, treadlingLeft: false, shaftsFromTop: false, endOneRight: false }, 10, 200, 200);
    expect(changedRects(layout, [{ id: 'drawdown', box: { x0: 39, y0: 29, x1: 39, y1: 29 } }], 0, 0)).toEqual([]);
    const [one] = changedRects(layout, [{ id: 'threading', box: { x0: 2, y0: 1, x1: 2, y1: 1 } }], 0, 0);
    expect([one.width, one.height]).toEqual([12, 12]);
    // A threading cell and the drawdown column under it (a toggle): one box, not two.
    const column = changedRects(layout, [{ id: 'threading', box: { x0: 2, y0: 1, x1: 2, y1: 1 } }, { id: 'drawdown', box: { x0: 2, y0: 0, x1: 2, y1: 29 } }], 0, 0);
    expect(column).toHaveLength(1);
    expect(column[0].width).toBe(12);
    // Far apart (a warp colour at the left, a weft colour at the bottom right): two boxes.
    expect(changedRects(layout, [{ id: 'warpColors', box: { x0: 0, y0: 0, x1: 0, y1: 0 } }, { id: 'weftColors', box: { x0: 0, y0: 5, x1: 0, y1: 5 } }], 0, 0)).toHaveLength(2);
  });
});

describe('drag drawing', () => {
  it('leaves the cursor where it was while drawing, and moves it to the last cell at pointer up', () => {
    const editor = createEditor(twill({ threading: Array.from({ length: 8 }, () => []) }));
    const start = { grid: 'threading' as const, col: 0, row: 3 };
    editor.pointerDown(start);
    for (let col = 1; col < 6; col++) editor.pointerMove({ grid: 'threading', col, row: 3 });
    expect(editor.view.get().cursor).toEqual(start);
    // Every cell passed over was drawn.
    expect(editor.doc.get().draft.threading.slice(0, 6)).toEqual(Array.from({ length: 6 }, () => [1]));
    editor.pointerUp();
    expect(editor.view.get().cursor).toEqual({ grid: 'threading', col: 5, row: 3 });
    expect(editor.doc.get().undoLabel).toBe('Draw');
  });

  it('follows the pointer with the selection while selecting', () => {
    const editor = createEditor(twill(), { tool: 'select' });
    editor.pointerDown({ grid: 'threading', col: 1, row: 0 });
    editor.pointerMove({ grid: 'threading', col: 4, row: 2 });
    expect(editor.view.get().selection?.to).toEqual({ grid: 'threading', col: 4, row: 2 });
    expect(editor.view.get().cursor).toEqual({ grid: 'threading', col: 4, row: 2 });
  });
});
