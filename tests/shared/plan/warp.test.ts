// Check values come from the published sources named beside each one (a standard, a book or an article);
// a fact of the trade with no published source says "common practice".
// (the standards and articles themselves were not re-read for these tests).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  DEFAULT_ALLOWANCES,
  LOOM_WASTE_INCHES,
  beforeLoss,
  boutSizes,
  computeWarpPlan,
  defaultLoomWaste,
  endCount,
  expandWarp,
  packagesFor,
  type WarpPlanInput,
} from '../../../shared/plan/warp';
import { toMetresPerKg } from '../../../shared/plan/yarn';
import { convertLength } from '../../../shared/plan/units';
import { makeDraft } from './draft-fixtures';

const NO_LOSS = { takeUp: 0, drawIn: 0, lengthShrinkage: 0, widthShrinkage: 0 };
const YD_8400 = toMetresPerKg('ydPerLb', 8400);

function input(overrides: Partial<WarpPlanInput> = {}): WarpPlanInput {
  return {
    unit: 'inch',
    finishedWidth: 20,
    finishedLength: 72,
    pieces: 1,
    hems: 0,
    fringe: 0,
    samples: 0,
    allowances: DEFAULT_ALLOWANCES,
    loomWaste: 27,
    rounding: 'nearest',
    balanceEnds: 0,
    selvedgeEndsPerSide: 0,
    weftAllowance: 0.1,
    warpYarn: { metresPerKg: YD_8400 },
    weftYarn: { metresPerKg: YD_8400 },
    ...overrides,
  };
}

describe('allowances', () => {
  it('10" finished at 20 % shrinkage needs 12.5" woven', () => {
    // Source: weaving education articles on shrinkage — woven = finished ÷ (1 − rate).
    expect(beforeLoss(10, 0.2)).toBeCloseTo(12.5, 12);
  });

  it('refuses a loss of 100 % or more', () => {
    expect(() => beforeLoss(10, 1)).toThrow(RangeError);
    expect(() => beforeLoss(10, -0.1)).toThrow(RangeError);
  });

  it('defaults follow common practice', () => {
    // Source: common practice: take-up and shrinkage 10 % when unsure,
    // loom waste about 18" on a table loom and 24–36" on a floor loom (27" chosen).
    expect(DEFAULT_ALLOWANCES).toEqual({ takeUp: 0.1, drawIn: 0.1, lengthShrinkage: 0.1, widthShrinkage: 0.1 });
    expect(LOOM_WASTE_INCHES).toEqual({ table: 18, floor: 27 });
    expect(defaultLoomWaste('table', 'cm')).toBeCloseTo(45.72, 10);
  });
});

describe('the worked example', () => {
  // Source: a worked example of the kind published in weaving education articles:
  // 48" wide × 48 epi = 2304 ends; × 7.5 yd = 17 280 yd; at 8400 yd/lb = 2.06 lb; weft about the same.
  const plan = computeWarpPlan(
    makeDraft({ sett: { warp: 48, weft: 48, unit: 'inch' } }),
    input({ finishedWidth: 48, finishedLength: 7.5 * 36, allowances: NO_LOSS, loomWaste: 0, weftAllowance: 0 }),
  );

  it('has 2304 ends', () => {
    expect(plan.ends.totalEnds).toBe(2304);
  });

  it('needs 17 280 yd, 2.06 lb of 20/2 cotton for the warp', () => {
    expect(plan.warpByColor).toHaveLength(1);
    expect(plan.warpByColor[0].yards).toBeCloseTo(17280, 6);
    expect(plan.warpByColor[0].pounds?.toFixed(2)).toBe('2.06');
  });

  it('needs about the same for the weft', () => {
    expect(plan.weftByColor[0].yards).toBeCloseTo(17280, 6);
  });
});

describe('a plan with allowances', () => {
  const draft = makeDraft({ warpColors: [0, 0, 1, 2], liftplan: [[1, 3], [2, 4], [1, 3], [2, 4]], weftColors: [1, 1, 1, 2] });
  const plan = computeWarpPlan(
    draft,
    input({ finishedWidth: 18, finishedLength: 60, pieces: 2, hems: 3, fringe: 8, samples: 10, selvedgeEndsPerSide: 2, boutEnds: 100, packageSize: { length: 500, unit: 'yd' } }),
  );

  it('sets the reed wider and the warp longer than the finished cloth', () => {
    expect(plan.targetWidthInReed).toBeCloseTo(18 / 0.81, 10);
    expect(plan.wovenLengthPerPiece).toBeCloseTo(63 / 0.81, 10);
    expect(plan.warpLength).toBeCloseTo(2 * (63 / 0.81 + 8) + 10 + 27, 10);
  });

  it('balances the body to whole repeats and adds selvedges', () => {
    expect(plan.ends.bodyEnds % 4).toBe(0);
    expect(plan.ends.totalEnds).toBe(plan.ends.bodyEnds + 4);
    expect(plan.widthInReed).toBeCloseTo(plan.ends.totalEnds / 24, 12);
  });

  it('shares the yarn out by colour order', () => {
    const body = plan.ends.bodyEnds;
    const [c0, c1, c2] = plan.warpByColor;
    // Selvedges continue the colour order outwards: the two on the left are colours 1 and 2, the two on the right 0 and 0.
    expect([c0.threads, c1.threads, c2.threads]).toEqual([body / 2 + 2, body / 4 + 1, body / 4 + 1]);
    const weft = plan.weftByColor;
    expect(weft.map((w) => w.color)).toEqual([1, 2]);
    expect(weft[0].metres / weft[1].metres).toBeCloseTo(3, 10);
    expect(weft[0].packages).toBe(Math.ceil(weft[0].yards / 500));
  });

  it('winds the warp in bouts', () => {
    expect(plan.bouts?.reduce((a, b) => a + b, 0)).toBe(plan.ends.totalEnds);
  });
});

describe('parts', () => {
  it('counts whole skeins', () => {
    expect(packagesFor(1000, 5000, { length: 500, unit: 'm' })).toBe(2);
    expect(packagesFor(1001, 5000, { length: 500, unit: 'm' })).toBe(3);
    // 1000 m at 5000 m/kg = 200 g → two 100 g skeins
    expect(packagesFor(1000, 5000, { mass: 100, unit: 'g' })).toBe(2);
    expect(packagesFor(1000, 5000, { mass: 0.25, unit: 'lb' })).toBe(2);
  });

  it('splits a warp into bouts', () => {
    expect(boutSizes(250, 100)).toEqual([100, 100, 50]);
  });
});

describe('properties', () => {
  const layout = fc.record({
    widthInReed: fc.double({ min: 1, max: 120, noNaN: true }),
    sett: fc.double({ min: 4, max: 80, noNaN: true }),
    repeatEnds: fc.integer({ min: 1, max: 64 }),
    rounding: fc.constantFrom('nearest' as const, 'up' as const, 'down' as const),
    balanceEnds: fc.integer({ min: 0, max: 8 }),
    selvedgeEndsPerSide: fc.integer({ min: 0, max: 6 }),
  });

  it('the body is whole repeats plus balance, as near the width as the rounding allows', () => {
    fc.assert(
      fc.property(layout, (l) => {
        const r = endCount(l);
        expect(r.bodyEnds).toBe(r.repeats * l.repeatEnds + l.balanceEnds);
        expect(r.totalEnds).toBe(r.bodyEnds + 2 * l.selvedgeEndsPerSide);
        const wanted = (l.widthInReed * l.sett - l.balanceEnds) / l.repeatEnds;
        if (r.repeats > 1) {
          const slack = { nearest: 0.5, up: 1, down: 1 }[l.rounding];
          expect(Math.abs(r.repeats - wanted)).toBeLessThanOrEqual(slack + 1e-9);
          if (l.rounding === 'up') expect(r.repeats).toBeGreaterThanOrEqual(wanted - 1e-9);
          if (l.rounding === 'down') expect(r.repeats).toBeLessThanOrEqual(wanted + 1e-9);
        }
      }),
    );
  });

  const planCase = fc.record({
    threading: fc.array(fc.integer({ min: 1, max: 4 }).map((s) => [s]), { minLength: 1, maxLength: 16 }),
    colors: fc.array(fc.integer({ min: 0, max: 2 }), { minLength: 16, maxLength: 16 }),
    finishedWidth: fc.double({ min: 2, max: 60, noNaN: true }),
    finishedLength: fc.double({ min: 2, max: 400, noNaN: true }),
    pieces: fc.integer({ min: 1, max: 6 }),
    takeUp: fc.double({ min: 0, max: 0.3, noNaN: true }),
    shrinkage: fc.double({ min: 0, max: 0.3, noNaN: true }),
    selvedge: fc.integer({ min: 0, max: 4 }),
  });

  it('per-colour warp adds up to every end at the full warp length, in inches or cm alike', () => {
    fc.assert(
      fc.property(planCase, (c) => {
        const draft = makeDraft({ threading: c.threading, warpColors: c.threading.map((_, i) => c.colors[i]) });
        const allowances = { takeUp: c.takeUp, drawIn: c.takeUp, lengthShrinkage: c.shrinkage, widthShrinkage: c.shrinkage };
        const base = { finishedWidth: c.finishedWidth, finishedLength: c.finishedLength, pieces: c.pieces, allowances, selvedgeEndsPerSide: c.selvedge };
        const inch = computeWarpPlan(draft, input(base));
        const threads = inch.warpByColor.reduce((a, w) => a + w.threads, 0);
        expect(threads).toBe(inch.ends.totalEnds);
        const yards = inch.warpByColor.reduce((a, w) => a + w.yards, 0);
        expect(yards).toBeCloseTo((inch.ends.totalEnds * inch.warpLength) / 36, 6);

        const toCm = (v: number) => convertLength(v, 'inch', 'cm');
        const cm = computeWarpPlan(
          draft,
          input({ ...base, unit: 'cm', finishedWidth: toCm(c.finishedWidth), finishedLength: toCm(c.finishedLength), loomWaste: toCm(27) }),
        );
        expect(cm.ends).toEqual(inch.ends);
        expect(cm.warpLength).toBeCloseTo(toCm(inch.warpLength), 8);
        cm.warpByColor.forEach((w, i) => expect(w.metres).toBeCloseTo(inch.warpByColor[i].metres, 6));
        cm.weftByColor.forEach((w, i) => expect(w.grams).toBeCloseTo(inch.weftByColor[i].grams ?? NaN, 6));
      }),
    );
  });

  it('the expanded warp repeats the draft and marks the selvedges', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 10 }), fc.integer({ min: 0, max: 5 }), (n, repeats, sel) => {
        const draft = makeDraft({ threading: Array.from({ length: n }, (_, i) => [(i % 4) + 1]) });
        const ends = { repeats, bodyEnds: repeats * n, totalEnds: repeats * n + 2 * sel };
        const warp = expandWarp(draft, ends, sel);
        expect(warp.map((e) => e.end)).toEqual(warp.map((_, i) => i + 1));
        expect(warp.filter((e) => e.selvedge)).toHaveLength(2 * sel);
        warp.forEach((e, i) => expect(e.draftIndex).toBe((((i - sel) % n) + n) % n));
      }),
    );
  });
});
