// Check values come from the published sources named beside each one (a standard, a book or an article);
// a fact of the trade with no published source says "common practice".
// (the standards and articles themselves were not re-read for these tests).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { allowancesForNextPlan, lossRate, measuredAllowances } from '../../../shared/plan/results';
import { DEFAULT_ALLOWANCES, widthInReedFor, wovenLengthFor } from '../../../shared/plan/warp';

describe('measured allowances', () => {
  it('follows the stated formulas', () => {
    const m = { widthInReed: 20, lengthOnLoom: 100, widthOffLoom: 18, lengthOffLoom: 90, widthFinished: 16.2, lengthFinished: 81 };
    const a = measuredAllowances(m);
    expect(a.takeUp).toBeCloseTo(0.1, 12);
    expect(a.drawIn).toBeCloseTo(0.1, 12);
    expect(a.lengthShrinkage).toBeCloseTo(0.1, 12);
    expect(a.widthShrinkage).toBeCloseTo(0.1, 12);
  });

  it('12.5" woven finishing at 10" is 20 % shrinkage', () => {
    // Source: weaving education articles on shrinkage (finished = woven × (1 − rate)) — 10" finished at 20 % needs 12.5" woven.
    expect(lossRate(12.5, 10)).toBeCloseTo(0.2, 12);
  });

  it('keeps the current shrinkage until the cloth is finished', () => {
    const next = allowancesForNextPlan(DEFAULT_ALLOWANCES, { widthInReed: 20, lengthOnLoom: 100, widthOffLoom: 19, lengthOffLoom: 92 });
    expect(next.lengthShrinkage).toBe(DEFAULT_ALLOWANCES.lengthShrinkage);
    expect(next.takeUp).toBeCloseTo(0.08, 12);
    expect(next.drawIn).toBeCloseTo(0.05, 12);
  });

  it('refuses a zero size before', () => {
    expect(() => lossRate(0, 1)).toThrow(RangeError);
  });
});

describe('properties', () => {
  const rate = fc.double({ min: 0, max: 0.45, noNaN: true });
  it("measuring the plan's own sizes gives back the plan's allowances", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 100, noNaN: true }),
        fc.double({ min: 1, max: 500, noNaN: true }),
        rate,
        rate,
        rate,
        rate,
        (width, length, takeUp, drawIn, lengthShrinkage, widthShrinkage) => {
          const planned = { takeUp, drawIn, lengthShrinkage, widthShrinkage };
          const widthInReed = widthInReedFor(width, planned);
          const lengthOnLoom = wovenLengthFor(length, planned);
          const m = {
            widthInReed,
            lengthOnLoom,
            widthOffLoom: widthInReed * (1 - drawIn),
            lengthOffLoom: lengthOnLoom * (1 - takeUp),
            widthFinished: width,
            lengthFinished: length,
          };
          const measured = measuredAllowances(m);
          for (const k of ['takeUp', 'drawIn', 'lengthShrinkage', 'widthShrinkage'] as const) {
            expect(measured[k]).toBeCloseTo(planned[k], 9);
          }
        },
      ),
    );
  });
});
