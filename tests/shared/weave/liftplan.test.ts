import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeDrawdown } from '../../../shared/weave/drawdown';
import { createDraft } from '../../../shared/weave/draft';
import { liftPlanOf, toLiftPlanDraft, toTreadlingDraft, treadlingFor } from '../../../shared/weave/liftplan';
import { draftArb } from './arbitraries';

const liftPlanDraft = (liftplan: number[][], shafts = 4) => createDraft({ shafts, threading: [[1], [2], [3], [4]].slice(0, shafts), control: 'liftplan', liftplan });

// 2/2 twill lifts plus the two tabby lifts on 4 shafts (common practice).
const TWILL_AND_TABBY = [[1, 2], [2, 3], [3, 4], [1, 4], [1, 3], [2, 4]];

describe('liftPlanOf', () => {
  it('gives per pick the union of the tie-ups of the treadles pressed', () => {
    const d = createDraft({ shafts: 4, treadles: 3, threading: [[1]], tieup: [[1], [2, 3], []], treadling: [[1, 2], [3], [], [2]] });
    expect(liftPlanOf(d)).toEqual([[1, 2, 3], [], [], [2, 3]]);
  });
});

describe('treadlingFor', () => {
  it('round-trips exactly whenever ok, and never uses more treadles or feet than asked', () => {
    const input = fc.record({
      draft: draftArb({ maxShafts: 10, maxPicks: 30, maxTreadles: 10 }),
      maxTreadles: fc.integer({ min: 0, max: 14 }),
      maxFeet: fc.integer({ min: 1, max: 3 }),
    });
    fc.assert(
      fc.property(input, ({ draft, maxTreadles, maxFeet }) => {
        const result = treadlingFor(draft, maxTreadles, { maxFeet });
        if (!result.ok) {
          expect(result.reason).toMatch(new RegExp(`^Cannot be done with ${maxTreadles} treadles: `));
          return;
        }
        expect(result.treadles).toBeLessThanOrEqual(maxTreadles);
        expect(result.tieup).toHaveLength(result.treadles);
        for (const pressed of result.treadling) {
          expect(pressed.length).toBeLessThanOrEqual(maxFeet);
          for (const t of pressed) expect(t >= 1 && t <= result.treadles).toBe(true);
        }
        expect(result.feet).toBeLessThanOrEqual(maxFeet);
        const converted = toTreadlingDraft(draft, maxTreadles, { maxFeet });
        if (!converted.ok) throw new Error('toTreadlingDraft disagrees with treadlingFor');
        expect(liftPlanOf(converted.draft)).toEqual(liftPlanOf(draft));
        expect(computeDrawdown(converted.draft).bits).toEqual(computeDrawdown(draft).bits);
      }),
      { numRuns: 150 },
    );
  }, 60_000);

  it('gives each different lift its own treadle when they fit', () => {
    const r = treadlingFor(liftPlanDraft([[1, 2], [2, 3], [1, 2], [], [3, 4]]), 6);
    expect(r).toEqual({ ok: true, tieup: [[1, 2], [2, 3], [3, 4]], treadling: [[1], [2], [1], [], [3]], treadles: 3, feet: 1 });
  });

  it('weaves twill and tabby on 4 treadles by pressing two at once', () => {
    const r = treadlingFor(liftPlanDraft(TWILL_AND_TABBY), 4);
    if (!r.ok) throw new Error(r.reason);
    expect(r.treadles).toBe(4);
    expect(r.feet).toBe(2);
    expect(r.tieup.every((t) => t.length === 1)).toBe(true);
  });

  it('says plainly when it cannot be done', () => {
    // Six two-shaft lifts from three treadles would need every treadle and every pair of them to be a
    // different lift, but two lifts of two shafts cannot join into a third: impossible.
    const three = treadlingFor(liftPlanDraft(TWILL_AND_TABBY), 3);
    expect(three.ok).toBe(false);
    if (!three.ok) expect(three.reason).toMatch(/^Cannot be done with 3 treadles: no tie-up was found .* the best found needs 4 treadles\./);
    // Eleven different lifts, four treadles, two feet: only 4 + 6 = 10 ways to press.
    const lifts = [[1], [2], [3], [4], [1, 2], [1, 3], [1, 4], [2, 3], [2, 4], [3, 4], [1, 2, 3]];
    const r = treadlingFor(liftPlanDraft(lifts), 4);
    expect(r).toEqual({
      ok: false,
      reason: 'Cannot be done with 4 treadles: the draft has 11 different lifts, and 4 treadles with at most 2 treadles pressed together give only 10 different presses.',
    });
    expect(treadlingFor(liftPlanDraft(lifts), 4, { maxFeet: 3 }).ok).toBe(true);
    expect(treadlingFor(liftPlanDraft(lifts), 33)).toEqual({ ok: false, reason: 'The number of treadles must be a whole number from 0 to 32.' });
  });

  it('answers quickly for a large 32-shaft lift plan', () => {
    let seed = 3;
    const next = () => (seed = (seed * 1103515245 + 12345) >>> 0) / 4294967296;
    const liftplan = Array.from({ length: 400 }, () => Array.from({ length: 32 }, (_, i) => i + 1).filter(() => next() < 0.3));
    const draft = createDraft({ shafts: 32, threading: [[1]], control: 'liftplan', liftplan });
    const t0 = performance.now();
    const r = treadlingFor(draft, 32, { maxFeet: 4 });
    // A bound that only a runaway search breaks, loose enough for a busy machine.
    expect(performance.now() - t0).toBeLessThan(15_000);
    if (r.ok) expect(liftPlanOf({ ...draft, control: 'treadling', tieup: r.tieup, treadling: r.treadling, treadles: r.treadles })).toEqual(liftPlanOf(draft));
  }, 30_000);
});

describe('control mode conversions', () => {
  it('toLiftPlanDraft keeps the cloth and returns a lift-plan draft unchanged', () => {
    fc.assert(
      fc.property(draftArb(), (d) => {
        const lp = toLiftPlanDraft(d);
        expect(lp.control).toBe('liftplan');
        expect(computeDrawdown(lp).bits).toEqual(computeDrawdown(d).bits);
        expect(toLiftPlanDraft(lp)).toBe(lp);
      }),
    );
  });
});
