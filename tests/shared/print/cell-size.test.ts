import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CELL_STEP_MM, chooseCellSize, MAX_CELL_MM, MIN_CELL_MM, PT_PER_MM } from '../../../shared/print/cell-size';

describe('chooseCellSize', () => {
  it('converts millimetres to points exactly (1 in = 25.4 mm = 72 pt)', () => {
    // Source: PDF 1.7 (ISO 32000-1) §8.3.2.3, default user space unit 1/72 inch; 1 in = 25.4 mm by definition (1959).
    expect(25.4 * PT_PER_MM).toBeCloseTo(72, 10);
  });

  it('gives a small draft the largest cell', () => {
    expect(chooseCellSize(() => 1)).toBeCloseTo(MAX_CELL_MM * PT_PER_MM, 9);
  });

  it('never goes below the legible minimum, even when every size needs many pages', () => {
    expect(chooseCellSize((c) => Math.ceil(1000 * c))).toBeCloseTo(MIN_CELL_MM * PT_PER_MM, 9);
  });

  it('picks the largest candidate that needs no more pages than the smallest cell', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: MIN_CELL_MM, max: MAX_CELL_MM + 1, noNaN: true }), { maxLength: 6 }), (thresholds) => {
        // Pages grow by one at each threshold (in mm): a monotone page count, as a real layout gives.
        const pagesAt = (cellPt: number) => 1 + thresholds.filter((t) => cellPt / PT_PER_MM > t).length;
        const cell = chooseCellSize(pagesAt);
        const mm = cell / PT_PER_MM;
        expect(mm).toBeGreaterThanOrEqual(MIN_CELL_MM - 1e-9);
        expect(mm).toBeLessThanOrEqual(MAX_CELL_MM + 1e-9);
        expect(pagesAt(cell)).toBe(pagesAt(MIN_CELL_MM * PT_PER_MM));
        const next = mm + CELL_STEP_MM;
        if (next <= MAX_CELL_MM + 1e-9) expect(pagesAt(next * PT_PER_MM)).toBeGreaterThan(pagesAt(cell));
      }),
    );
  });
});
