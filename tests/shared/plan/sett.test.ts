// Check values come from the published sources named beside each one (a standard, a book or an article);
// a fact of the trade with no published source says "common practice".
// (the standards and articles themselves were not re-read for these tests).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeDrawdown } from '../../../shared/weave/drawdown';
import {
  WEAVES,
  diametersPerInch,
  interlacingFactor,
  interlacingFromDrawdown,
  layeredSett,
  maximumSett,
  settFromWraps,
  workingSettRange,
} from '../../../shared/plan/sett';
import { PLAIN_LIFTS, STRAIGHT_4, TWILL_22_LIFTS, makeDraft } from './draft-fixtures';

describe("Ashenhurst's rule", () => {
  // Source: Ashenhurst's rule (1880s treatise), as restated in weaving education articles —
  // Ashenhurst's rule (Ashenhurst, 1880s treatise), as restated in weaving education articles: 8/2 cotton D ≈ 52, plain weave max ≈ 26, 2/2 twill ≈ 34.
  const d = diametersPerInch(3360);

  it('8/2 cotton has about 52 diameters per inch', () => {
    expect(Math.round(d)).toBe(52);
  });

  it('plain weave maximum ≈ 26 epi', () => {
    expect(Math.round(maximumSett(d, WEAVES.plain))).toBe(26);
  });

  it('2/2 twill maximum ≈ 34 epi', () => {
    // The quoted 34 comes from D rounded to 52 and the result rounded down.
    expect(Math.floor(maximumSett(52, WEAVES.twill22))).toBe(34);
    expect(Math.abs(maximumSett(d, WEAVES.twill22) - 34)).toBeLessThan(1);
  });

  it('working sett is 75–80 % of the maximum', () => {
    // Source: weaving education articles on sett — working sett often 75–80 % of the maximum.
    expect(workingSettRange(40)).toEqual({ low: 30, high: 32 });
  });

  it('soft woollens use a smaller constant', () => {
    // Source: Ashenhurst's rule, as restated in weaving education articles — about 0.84 for soft woollens.
    expect(diametersPerInch(1600, 0.84)).toBeCloseTo(33.6, 10);
  });
});

describe('sett from wraps per inch', () => {
  it('plain weave is half the wraps, twill two thirds', () => {
    // Source: common practice: plain ≈ WPI/2, twill ≈ 2/3 WPI.
    expect(settFromWraps(12, WEAVES.plain)).toBe(6);
    expect(settFromWraps(12, WEAVES.twill22)).toBeCloseTo(8, 10);
  });

  it('double weave doubles the single-layer sett', () => {
    // Source: common practice and weaving education articles on double weave: two cloths share the reed.
    expect(layeredSett(15, 2)).toBe(30);
  });
});

describe('interlacing from a drawdown', () => {
  it('plain weave on four shafts gives the plain-weave factor', () => {
    const dd = computeDrawdown(makeDraft({ threading: STRAIGHT_4, liftplan: PLAIN_LIFTS }));
    const r = interlacingFromDrawdown(dd);
    expect(interlacingFactor(r.ends)).toBe(interlacingFactor(WEAVES.plain));
    expect(interlacingFactor(r.picks)).toBe(interlacingFactor(WEAVES.plain));
  });

  it('2/2 twill gives two thirds', () => {
    const dd = computeDrawdown(makeDraft({ threading: STRAIGHT_4, liftplan: TWILL_22_LIFTS }));
    const r = interlacingFromDrawdown(dd);
    expect(r.ends).toEqual({ threads: 4, intersections: 2 });
    expect(interlacingFactor(r.picks)).toBeCloseTo(2 / 3, 12);
  });

  const randomDraft = fc
    .record({
      threading: fc.array(fc.integer({ min: 1, max: 4 }).map((s) => [s]), { minLength: 1, maxLength: 12 }),
      liftplan: fc.array(fc.subarray([1, 2, 3, 4]), { minLength: 1, maxLength: 12 }),
    })
    .map((parts) => makeDraft(parts));

  it('the factor lies between plain weave (½) and no interlacing (1)', () => {
    fc.assert(
      fc.property(randomDraft, (draft) => {
        const r = interlacingFromDrawdown(computeDrawdown(draft));
        for (const rep of [r.ends, r.picks]) {
          const f = interlacingFactor(rep);
          expect(f).toBeGreaterThanOrEqual(0.5);
          expect(f).toBeLessThanOrEqual(1);
        }
      }),
    );
  });

  it('a sinking shed or a doubled repeat does not change the result', () => {
    fc.assert(
      fc.property(randomDraft, (draft) => {
        const base = interlacingFromDrawdown(computeDrawdown(draft));
        const sinking = interlacingFromDrawdown(computeDrawdown({ ...draft, shed: 'sinking' }));
        expect(sinking).toEqual(base);
        const doubled = interlacingFromDrawdown(
          computeDrawdown({ ...draft, threading: [...draft.threading, ...draft.threading] }),
        );
        expect(interlacingFactor(doubled.ends)).toBeCloseTo(interlacingFactor(base.ends), 12);
        expect(interlacingFactor(doubled.picks)).toBeCloseTo(interlacingFactor(base.picks), 12);
      }),
    );
  });
});
