import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { draftRepeat, hasRepeat, printWindow, repeatLength } from '../../../shared/print/print-range';
import { MIN_FIT_CELL_MM, planDraftPages } from '../../../shared/print/draft-pages';
import { PT_PER_MM } from '../../../shared/print/cell-size';
import { pageSize } from '../../../shared/print/types';
import { createDraft } from '../../../shared/weave';
import { doubleWeaveTableMat } from '../../../server/db/seeders/demo-drafts';

/** The slow oracle: the smallest p (up to half the length) with the list equal to itself shifted by p. */
function slowRepeat(list: readonly number[]): number {
  for (let p = 1; p * 2 <= list.length; p++) {
    if (list.slice(p).every((v, i) => v === list[i])) return p;
  }
  return list.length;
}

describe('repeatLength', () => {
  it('finding 2: finds the repeat of 20 000 ends with a few comparisons per end, even for 1 1 1 … 1 2', () => {
    for (const list of [[...Array.from({ length: 19_999 }, () => 1), 2], Array.from({ length: 20_000 }, (_, i) => i % 7), Array.from({ length: 20_000 }, (_, i) => i)]) {
      let comparisons = 0;
      const p = repeatLength(list.length, (i, j) => { comparisons++; return list[i] === list[j]; });
      expect(p).toBe(slowRepeat(list));
      // Trying every period would make about 200 million comparisons for the first list.
      expect(comparisons).toBeLessThanOrEqual(3 * list.length);
    }
  });

  it('finds the shortest run that repeats through the list, a last part-repeat allowed (property, against a slow oracle)', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 2 }), { maxLength: 40 }), (list) => {
        expect(repeatLength(list.length, (i, j) => list[i] === list[j])).toBe(slowRepeat(list));
      }),
    );
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 3 }), { minLength: 1, maxLength: 8 }), fc.integer({ min: 2, max: 6 }), fc.nat(7), (unit, times, extra) => {
        const list = [...Array.from({ length: times }, () => unit).flat(), ...unit.slice(0, extra % unit.length)];
        const p = repeatLength(list.length, (i, j) => list[i] === list[j]);
        // A repeated unit repeats at its own length or at a divisor of it, never longer.
        expect(unit.length % p === 0 || p <= unit.length).toBe(true);
        expect(p).toBeLessThanOrEqual(unit.length);
      }),
    );
  });
});

describe('draftRepeat and printWindow', () => {
  it('finds the 80 × 80 repeat of the demo table mat (two blocks of 40 each way) and prints it by default', () => {
    const mat = doubleWeaveTableMat('harbour');
    expect(draftRepeat(mat)).toEqual({ ends: 80, picks: 80 });
    expect(hasRepeat(mat)).toBe(true);
    expect(printWindow(mat)).toEqual({ part: 'repeat', ends: { start: 0, end: 80 }, picks: { start: 0, end: 80 } });
    expect(printWindow(mat, { part: 'whole' })).toEqual({ part: 'whole', ends: { start: 0, end: 440 }, picks: { start: 0, end: 560 } });
  });

  it('counts colours as part of the repeat, and prints a draft with no repeat whole', () => {
    const twill = createDraft({ shafts: 4, treadles: 4, threading: [[1], [2], [3], [4], [1], [2], [3], [4]], tieup: [[1, 2], [2, 3], [3, 4], [4, 1]], treadling: [[1], [2], [3], [4]] });
    expect(draftRepeat(twill)).toEqual({ ends: 4, picks: 4 });
    // The same threading with one end of another colour no longer repeats across the ends.
    const striped = { ...twill, palette: [...twill.palette, '#aa3322'], warpColors: [0, 0, 0, 0, 0, 0, 0, 2] };
    expect(draftRepeat(striped).ends).toBe(8);
    const once = createDraft({ shafts: 4, treadles: 4, threading: [[1], [2], [3], [4]], tieup: [[1], [2], [3], [4]], treadling: [[1], [2], [3]] });
    expect(hasRepeat(once)).toBe(false);
    expect(printWindow(once).part).toBe('whole');
  });

  it('prints the ends and picks named, and refuses a range past the draft saying what it has', () => {
    const mat = doubleWeaveTableMat('harbour');
    expect(printWindow(mat, { part: 'range', ends: { from: 41, to: 120 } })).toEqual({ part: 'range', ends: { start: 40, end: 120 }, picks: { start: 0, end: 560 } });
    expect(() => printWindow(mat, { part: 'range', picks: { from: 500, to: 600 } })).toThrow('the draft has 560 picks, so picks 500–600 cannot be printed');
    expect(() => printWindow(mat, { part: 'range', ends: { from: 9, to: 3 } })).toThrow(/is not a range/);
  });
});

describe('planDraftPages with a window and fit to width', () => {
  const page = pageSize('a4', 'portrait');
  const arrangement = { threadingAbove: true, treadlingRight: true, shaftsFromBottom: true, endOneRight: true };
  const shape = { ends: 440, picks: 560, shafts: 8, pickColumns: 8, liftPlan: true };

  it('lays out only the window, numbered as in the draft', () => {
    const laid = planDraftPages({ page, shape, arrangement, views: ['structure'], legendRows: 3, window: { ends: { start: 40, end: 120 }, picks: { start: 80, end: 160 } } });
    const drafts = laid.pages.flatMap((p) => p.parts).filter((p) => p.kind === 'draft');
    expect(Math.min(...drafts.map((d) => d.tile.cols.start))).toBe(40);
    expect(Math.max(...drafts.map((d) => d.tile.cols.end))).toBe(120);
    expect(Math.min(...drafts.map((d) => d.tile.rows.start))).toBe(80);
    expect(Math.max(...drafts.map((d) => d.tile.rows.end))).toBe(160);
  });

  it('puts every end of the window across one sheet when asked, and says how many fit when they cannot', () => {
    // 440 ends at 0.5 mm need 220 mm: the width of A4 turned to landscape.
    const laid = planDraftPages({ page: pageSize('a4', 'landscape'), shape, arrangement, views: ['structure', 'front'], legendRows: 3, fitWidth: true });
    const parts = laid.pages.flatMap((p) => p.parts).filter((p) => p.kind !== 'legend');
    for (const p of parts) expect(p.across).toBe(1);
    expect(laid.cell).toBeGreaterThanOrEqual(MIN_FIT_CELL_MM * PT_PER_MM);
    expect(() => planDraftPages({ page, shape: { ...shape, ends: 5000 }, arrangement, views: [], legendRows: 0, fitWidth: true }))
      .toThrow(/5000 ends do not fit across one page \(at most \d+ on this paper\)/);
  });
});
