import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeDrawdown, renderCloth } from '../../../shared/weave';
import { pixel } from '../../../src/features/editor/canvas/bitmap';
import { createDerived } from '../../../src/features/editor/canvas/derived';
import { DraftPainter } from '../../../src/features/editor/canvas/draft-painter';
import { cellAt, cellPosition, columnX, computeLayout, refAt, regionOf, rowOfShaft } from '../../../src/features/editor/canvas/layout';
import { createDraftStore } from '../../../src/features/editor/store/draft-store';
import { paintColor, setCell, setPaletteColor } from '../../../src/features/editor/store/edits';
import { twill } from './fixtures';

describe('layout', () => {
  const arrangements = fc.record({ threadingBelow: fc.boolean(), treadlingLeft: fc.boolean(), shaftsFromTop: fc.boolean(), endOneRight: fc.boolean() });

  it('finds the cell under any point of a grid, and the point of any cell (every arrangement)', () => {
    fc.assert(
      fc.property(arrangements, fc.integer({ min: 4, max: 20 }), fc.boolean(), (arrangement, cell, lift) => {
        const draft = lift ? twill({ control: 'liftplan', liftplan: [[1], [2], [3]], treadling: [], treadles: 0, tieup: [] }) : twill();
        const layout = computeLayout(draft, arrangement, cell, 2000, 1500);
        for (const r of layout.regions) {
          if (r.id === 'drawdown') continue;
          for (let col = 0; col < Math.min(r.cols, 6); col++) {
            for (let row = 0; row < Math.min(r.rows, 6); row++) {
              const ref = refAt(r.id, col, row, draft.shafts, arrangement.shaftsFromTop);
              const back = cellAt(layout, columnX(layout, r, col, 0) + cell / 2, r.y + row * cell + cell / 2, 0, 0, draft.shafts, arrangement.shaftsFromTop);
              expect(back).toEqual(ref);
              expect(cellPosition(ref, draft.shafts, arrangement.shaftsFromTop)).toEqual({ col, row });
            }
          }
        }
        // No two grids overlap.
        for (const a of layout.regions) {
          for (const b of layout.regions) {
            if (a === b) continue;
            const overlap = a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
            expect(overlap).toBe(false);
          }
        }
      }),
    );
  });

  it('puts the threading above or below the drawdown and the treadling right or left', () => {
    const draft = twill();
    const at = (threadingBelow: boolean, treadlingLeft: boolean) => {
      const l = computeLayout(draft, { threadingBelow, treadlingLeft, shaftsFromTop: false, endOneRight: false }, 10, 1000, 800);
      return { t: regionOf(l, 'threading')!, d: regionOf(l, 'drawdown')!, tr: regionOf(l, 'treadling')! };
    };
    const normal = at(false, false);
    expect(normal.t.y).toBeLessThan(normal.d.y);
    expect(normal.tr.x).toBeGreaterThan(normal.d.x);
    const flipped = at(true, true);
    expect(flipped.t.y).toBeGreaterThan(flipped.d.y);
    expect(flipped.tr.x).toBeLessThan(flipped.d.x);
  });

  it('counts shafts from the bottom or the top', () => {
    expect(rowOfShaft(1, 8, false)).toBe(7);
    expect(rowOfShaft(1, 8, true)).toBe(0);
  });
});

describe('painter', () => {
  it('repainting only changed cells gives the same drawdown as painting it whole', () => {
    const cellEdit = fc.record({ grid: fc.constantFrom('threading', 'tieup', 'treadling'), index: fc.integer({ min: 0, max: 9 }), value: fc.integer({ min: 1, max: 4 }), on: fc.boolean() });
    fc.assert(
      fc.property(fc.array(cellEdit, { maxLength: 12 }), fc.boolean(), (edits, colour) => {
        const store = createDraftStore(twill());
        const derived = createDerived();
        const painter = new DraftPainter(derived);
        const settings = { shaftsFromTop: false, drawdownView: colour ? ('colour' as const) : ('structure' as const) };
        painter.paint(store.get().draft, settings);
        for (const e of edits) {
          store.apply(setCell, e as Parameters<typeof setCell>[1]);
          painter.paint(store.get().draft, settings);
        }
        const fresh = new DraftPainter(createDerived());
        const draft = store.get().draft;
        fresh.paint(draft, settings);
        const a = painter.bitmap('drawdown');
        const b = fresh.bitmap('drawdown');
        expect([a.width, a.height]).toEqual([b.width, b.height]);
        const dd = computeDrawdown(draft);
        const cloth = renderCloth(draft, dd);
        for (let p = 0; p < dd.picks; p++) {
          for (let e = 0; e < dd.ends; e++) {
            expect(a.pixelAt(e, p)).toBe(b.pixelAt(e, p));
            // And both show the engine's colour where the view is colour.
            if (colour) expect(a.pixelAt(e, p)).toBe(pixel(cloth.colorAt(e, p)));
          }
        }
      }),
      { numRuns: 60 },
    );
    // Some seconds of work: under a loaded machine it needs room past the default 5 s.
  }, 60_000);

  it('repaints only the grids whose lists changed', () => {
    const store = createDraftStore(twill());
    const painter = new DraftPainter(createDerived());
    const settings = { shaftsFromTop: false, drawdownView: 'colour' as const };
    expect(painter.paint(store.get().draft, settings).size).toBeGreaterThan(0);
    expect(painter.paint(store.get().draft, settings).size).toBe(0);
    store.apply(paintColor, { grid: 'weftColors', from: 0, to: 0, color: 2 });
    expect([...painter.paint(store.get().draft, settings)].sort()).toEqual(['drawdown', 'weftColors']);
    store.apply(setCell, { grid: 'tieup', index: 0, value: 3, on: true });
    expect([...painter.paint(store.get().draft, settings)].sort()).toEqual(['drawdown', 'tieup']);
    store.apply(setPaletteColor, { index: 2, color: '#000000' });
    expect([...painter.paint(store.get().draft, settings)].sort()).toEqual(['drawdown', 'weftColors']);
  });
});
