import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cellCentre, cellOrigin, gridBounds, placeDraftTile, type DraftShape, type GridPlacement } from '../../../shared/print/draft-layout';
import { planDraftPages, type PrintView } from '../../../shared/print/draft-pages';
import { MIN_CELL_MM, PT_PER_MM } from '../../../shared/print/cell-size';
import { pageSize, type DraftArrangement, type Rect } from '../../../shared/print/types';

const arrangement = fc.record({ threadingAbove: fc.boolean(), treadlingRight: fc.boolean(), shaftsFromBottom: fc.boolean(), endOneRight: fc.boolean() });
const shape = fc
  .record({
    ends: fc.integer({ min: 1, max: 400 }),
    picks: fc.integer({ min: 1, max: 400 }),
    shafts: fc.integer({ min: 2, max: 32 }),
    treadles: fc.integer({ min: 2, max: 32 }),
    liftPlan: fc.boolean(),
  })
  .map(({ treadles, ...s }): DraftShape => ({ ...s, pickColumns: s.liftPlan ? s.shafts : treadles }));

const overlaps = (a: Rect, b: Rect) =>
  a.x < b.x + b.width - 1e-6 && b.x < a.x + a.width - 1e-6 && a.y < b.y + b.height - 1e-6 && b.y < a.y + a.height - 1e-6;
const inside = (a: Rect, b: Rect) =>
  a.x >= b.x - 1e-6 && a.y >= b.y - 1e-6 && a.x + a.width <= b.x + b.width + 1e-6 && a.y + a.height <= b.y + b.height + 1e-6;

describe('placeDraftTile', () => {
  const plain: DraftArrangement = { threadingAbove: true, treadlingRight: true, shaftsFromBottom: true, endOneRight: true };
  const s: DraftShape = { ends: 8, picks: 6, shafts: 4, pickColumns: 4, liftPlan: false };

  it('puts end 1 on the side the arrangement names and pick 1 next to the threading', () => {
    const l = placeDraftTile(0, 0, s, 8, 6, 10, plain);
    const dd = gridBounds(l.drawdown);
    expect(cellOrigin(l.drawdown, 0, 0).x).toBeCloseTo(dd.x + dd.width - 10);
    expect(cellOrigin(l.drawdown, 0, 0).y).toBeCloseTo(dd.y);
    const mirrored = placeDraftTile(0, 0, s, 8, 6, 10, { threadingAbove: false, treadlingRight: false, shaftsFromBottom: false, endOneRight: false });
    const md = gridBounds(mirrored.drawdown);
    expect(cellOrigin(mirrored.drawdown, 0, 0).x).toBeCloseTo(md.x);
    expect(cellOrigin(mirrored.drawdown, 0, 0).y).toBeCloseTo(md.y + md.height - 10);
    expect(gridBounds(mirrored.treadling).x).toBeLessThan(md.x);
    expect(gridBounds(mirrored.threading).y).toBeGreaterThan(md.y);
  });

  it('numbers shafts from the bottom row or the top row as asked', () => {
    const up = placeDraftTile(0, 0, s, 8, 6, 10, plain);
    expect(cellOrigin(up.threading, 0, 0).y).toBeGreaterThan(cellOrigin(up.threading, 0, 3).y);
    const down = placeDraftTile(0, 0, s, 8, 6, 10, { ...plain, shaftsFromBottom: false });
    expect(cellOrigin(down.threading, 0, 0).y).toBeLessThan(cellOrigin(down.threading, 0, 3).y);
  });

  it('lines the parts up cell for cell and never overlaps them, in every arrangement', () => {
    fc.assert(
      fc.property(shape, arrangement, fc.integer({ min: 1, max: 80 }), fc.integer({ min: 1, max: 80 }), (sh, arr, cols, rows) => {
        const c = 7;
        const l = placeDraftTile(10, 20, sh, cols, rows, c, arr);
        const grids: GridPlacement[] = [l.drawdown, l.threading, l.treadling, l.warpColours, l.weftColours, ...(l.tieup ? [l.tieup] : [])];
        expect(l.tieup === null).toBe(sh.liftPlan);
        for (const g of grids) expect(inside(gridBounds(g), l.box)).toBe(true);
        for (let i = 0; i < grids.length; i++) for (let j = i + 1; j < grids.length; j++) expect(overlaps(gridBounds(grids[i]), gridBounds(grids[j]))).toBe(false);
        for (const col of [0, cols - 1]) {
          expect(cellOrigin(l.threading, col, 0).x).toBeCloseTo(cellOrigin(l.drawdown, col, 0).x);
          expect(cellOrigin(l.warpColours, col, 0).x).toBeCloseTo(cellOrigin(l.drawdown, col, 0).x);
        }
        for (const row of [0, rows - 1]) {
          expect(cellOrigin(l.treadling, 0, row).y).toBeCloseTo(cellOrigin(l.drawdown, 0, row).y);
          expect(cellOrigin(l.weftColours, 0, row).y).toBeCloseTo(cellOrigin(l.drawdown, 0, row).y);
        }
        if (l.tieup) {
          expect(cellOrigin(l.tieup, 0, sh.shafts - 1).y).toBeCloseTo(cellOrigin(l.threading, 0, sh.shafts - 1).y);
          expect(cellOrigin(l.tieup, sh.pickColumns - 1, 0).x).toBeCloseTo(cellOrigin(l.treadling, sh.pickColumns - 1, 0).x);
        }
      }),
    );
  });
});

describe('planDraftPages', () => {
  it('keeps every block inside the page body, apart from the others, at a legible cell size', () => {
    fc.assert(
      fc.property(
        shape,
        arrangement,
        fc.constantFrom('a4' as const, 'letter' as const),
        fc.constantFrom('portrait' as const, 'landscape' as const),
        fc.boolean(),
        fc.integer({ min: 1, max: 40 }),
        (sh, arr, paper, orientation, layered, legendRows) => {
          const views: PrintView[] = layered ? ['structure', 'front', 'back', 'layers'] : ['structure'];
          const plan = planDraftPages({ page: pageSize(paper, orientation), shape: sh, arrangement: arr, views, legendRows });
          expect(plan.cell).toBeGreaterThanOrEqual(MIN_CELL_MM * PT_PER_MM - 1e-9);
          const ends = new Uint8Array(sh.ends);
          const picks = new Uint8Array(sh.picks);
          let legend = 0;
          const viewTiles = new Map<string, number>();
          for (const page of plan.pages) {
            const boxes = page.parts.map((p) => (p.kind === 'legend' ? p.box : p.layout.box));
            for (const b of boxes) expect(inside(b, plan.body)).toBe(true);
            for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) expect(overlaps(boxes[i], boxes[j])).toBe(false);
            for (const p of page.parts) {
              if (p.kind === 'draft') {
                for (let e = p.tile.cols.start; e < p.tile.cols.end; e++) ends[e] = 1;
                for (let q = p.tile.rows.start; q < p.tile.rows.end; q++) picks[q] = 1;
              } else if (p.kind === 'view') viewTiles.set(p.view, (viewTiles.get(p.view) ?? 0) + 1);
              else legend += p.count;
            }
          }
          expect(ends.every((v) => v === 1) && picks.every((v) => v === 1)).toBe(true);
          expect([...viewTiles.keys()]).toEqual(views);
          expect(legend).toBe(legendRows);
        },
      ),
      { numRuns: 60 },
    );
  });

  it('cuts a view that needs too many sheets to its first sheet, and still gives the draft every end and pick', () => {
    const big = fc.record({
      ends: fc.integer({ min: 1, max: 3000 }),
      picks: fc.integer({ min: 1, max: 3000 }),
      shafts: fc.integer({ min: 2, max: 16 }),
      liftPlan: fc.constant(false),
      pickColumns: fc.integer({ min: 2, max: 16 }),
    });
    fc.assert(
      fc.property(big, arrangement, fc.integer({ min: 1, max: 12 }), (sh, arr, maxViewSheets) => {
        const input = { page: pageSize('a4', 'portrait'), shape: sh, arrangement: arr, views: ['structure', 'front'] as PrintView[], legendRows: 3 };
        const cut = planDraftPages({ ...input, maxViewSheets });
        const parts = cut.pages.flatMap((page) => page.parts);
        // The draft sheets still carry every end and pick.
        const ends = new Uint8Array(sh.ends);
        const picks = new Uint8Array(sh.picks);
        for (const p of parts) {
          if (p.kind !== 'draft') continue;
          ends.fill(1, p.tile.cols.start, p.tile.cols.end);
          picks.fill(1, p.tile.rows.start, p.tile.rows.end);
        }
        expect(ends.every((v) => v === 1) && picks.every((v) => v === 1)).toBe(true);
        const views = parts.filter((p) => p.kind === 'view');
        if (!cut.viewCut) {
          expect(views.length).toBeLessThanOrEqual(2 * maxViewSheets);
          return;
        }
        expect(cut.viewCut.fullSheets).toBeGreaterThan(maxViewSheets);
        expect(views).toHaveLength(2);
        for (const v of views) {
          if (v.kind !== 'view') continue;
          expect(v.tile.cols).toEqual({ start: 0, end: cut.viewCut.ends.end });
          expect(v.tile.rows).toEqual({ start: 0, end: cut.viewCut.picks.end });
        }
      }),
      { numRuns: 40 },
    );
  });

  it('gives the cell centre of a known cell inside its cell', () => {
    const plan = planDraftPages({
      page: pageSize('a4', 'portrait'),
      shape: { ends: 4, picks: 4, shafts: 2, pickColumns: 2, liftPlan: false },
      arrangement: { threadingAbove: true, treadlingRight: true, shaftsFromBottom: true, endOneRight: true },
      views: ['structure'],
      legendRows: 2,
    });
    const part = plan.pages[0].parts[0];
    if (part.kind !== 'draft') throw new Error('the draft comes first');
    const o = cellOrigin(part.layout.drawdown, 2, 1);
    const c = cellCentre(part.layout.drawdown, 2, 1);
    expect(c.x - o.x).toBeCloseTo(plan.cell / 2);
    expect(c.y - o.y).toBeCloseTo(plan.cell / 2);
  });
});
