import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { splitGrid, splitSpan, type Span } from '../../../shared/print/page-split';

/** total ≥ 0, overlap ≥ 0, capacity > overlap: every input the splitter accepts. */
const splitArgs = fc
  .record({ total: fc.integer({ min: 0, max: 1200 }), overlap: fc.integer({ min: 0, max: 6 }), extra: fc.integer({ min: 1, max: 120 }) })
  .map(({ total, overlap, extra }) => ({ total, overlap, capacity: overlap + extra }));

function checkSpans(spans: Span[], total: number, capacity: number, overlap: number): void {
  expect(spans[0].start).toBe(0);
  expect(spans[spans.length - 1].end).toBe(total);
  const seen = new Uint8Array(total);
  for (const s of spans) {
    expect(s.end - s.start).toBeLessThanOrEqual(capacity);
    for (let i = s.start; i < s.end; i++) seen[i] = 1;
  }
  // No end or pick is lost.
  expect(seen.every((v) => v === 1)).toBe(true);
  for (let i = 1; i < spans.length; i++) {
    // Each page repeats exactly the declared overlap from the page before, and moves on.
    expect(spans[i - 1].end - spans[i].start).toBe(overlap);
    expect(spans[i].end).toBeGreaterThan(spans[i - 1].end);
  }
}

describe('splitSpan', () => {
  it('splits a known run with one cell repeated', () => {
    expect(splitSpan(10, 4, 1)).toEqual([
      { start: 0, end: 4 },
      { start: 3, end: 7 },
      { start: 6, end: 10 },
    ]);
  });

  it('keeps a run that fits on one page whole, and an empty run as one empty span', () => {
    expect(splitSpan(7, 7, 2)).toEqual([{ start: 0, end: 7 }]);
    expect(splitSpan(0, 5, 2)).toEqual([{ start: 0, end: 0 }]);
  });

  it('refuses a page that cannot hold more than the overlap', () => {
    expect(() => splitSpan(10, 2, 2)).toThrow(RangeError);
    expect(() => splitSpan(10, 3, -1)).toThrow(RangeError);
    expect(() => splitSpan(-1, 3, 1)).toThrow(RangeError);
  });

  it('loses no cell and repeats exactly the declared overlap', () => {
    fc.assert(
      fc.property(splitArgs, ({ total, capacity, overlap }) => {
        checkSpans(splitSpan(total, capacity, overlap), total, capacity, overlap);
      }),
    );
  });

  it('uses no more pages than needed: every page but the last is full', () => {
    fc.assert(
      fc.property(splitArgs, ({ total, capacity, overlap }) => {
        const spans = splitSpan(total, capacity, overlap);
        for (const s of spans.slice(0, -1)) expect(s.end - s.start).toBe(capacity);
      }),
    );
  });
});

describe('splitGrid', () => {
  it('covers every cell of any W × H grid, with the declared overlap between neighbours', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 120 }),
        fc.integer({ min: 0, max: 120 }),
        fc.integer({ min: 0, max: 4 }),
        fc.integer({ min: 1, max: 40 }),
        fc.integer({ min: 1, max: 40 }),
        (W, H, overlap, cx, cy) => {
          const split = splitGrid(W, H, overlap + cx, overlap + cy, overlap);
          expect(split.tiles).toHaveLength(split.across * split.down);
          const seen = new Uint8Array(W * H);
          const at = new Map(split.tiles.map((t) => [`${t.across},${t.down}`, t]));
          for (const t of split.tiles) {
            expect(t.index).toBe(t.down * split.across + t.across);
            for (let r = t.rows.start; r < t.rows.end; r++) for (let c = t.cols.start; c < t.cols.end; c++) seen[r * W + c] = 1;
            const right = at.get(`${t.across + 1},${t.down}`);
            if (right) expect(t.cols.end - right.cols.start).toBe(overlap);
            const below = at.get(`${t.across},${t.down + 1}`);
            if (below) expect(t.rows.end - below.rows.start).toBe(overlap);
          }
          expect(seen.every((v) => v === 1)).toBe(true);
        },
      ),
    );
  });
});
