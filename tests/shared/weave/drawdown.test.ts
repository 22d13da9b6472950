import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeDrawdown, type Drawdown } from '../../../shared/weave/drawdown';
import { createDraft, emptyDraft } from '../../../shared/weave/draft';
import { toLiftPlanDraft } from '../../../shared/weave/liftplan';
import { mirror, reverse } from '../../../shared/weave/sequences';
import type { Draft } from '../../../shared/weave/types';
import { draftArb } from './arbitraries';
import { mathjsDrawdown } from './reference';

/** ends × picks booleans read cell by cell through isUp. */
function cells(dd: Drawdown): boolean[][] {
  return Array.from({ length: dd.ends }, (_, e) => Array.from({ length: dd.picks }, (_, p) => dd.isUp(e, p)));
}

describe('computeDrawdown', () => {
  it('agrees with an independent reference on random drafts', () => {
    // Independent reference: mathjs matrix product (threading × tie-up × treadling, > 0 → up).
    fc.assert(
      fc.property(draftArb({ maxShafts: 32, maxTreadles: 12, maxEnds: 70, maxPicks: 40 }), (draft) => {
        expect(cells(computeDrawdown(draft))).toEqual(mathjsDrawdown(draft));
      }),
      { numRuns: 150 },
    );
  });

  it('gives the same drawdown from tie-up and treadling as from the lift plan derived from them', () => {
    fc.assert(
      fc.property(draftArb({ control: 'treadling', maxShafts: 16 }), (draft) => {
        const fromPlan = toLiftPlanDraft(draft);
        expect(fromPlan.control).toBe('liftplan');
        expect(computeDrawdown(fromPlan).bits).toEqual(computeDrawdown(draft).bits);
      }),
    );
  });

  it('makes the sinking shed the complement of the rising shed', () => {
    fc.assert(
      fc.property(draftArb({ maxShafts: 32 }), (draft) => {
        const rising = cells(computeDrawdown({ ...draft, shed: 'rising' }));
        const sinking = cells(computeDrawdown({ ...draft, shed: 'sinking' }));
        expect(sinking).toEqual(rising.map((col) => col.map((up) => !up)));
      }),
    );
  });

  it('keeps bits past the last end clear, so whole-word operations stay exact', () => {
    fc.assert(
      fc.property(draftArb({ maxShafts: 32, maxEnds: 70 }), (draft) => {
        const dd = computeDrawdown(draft);
        const tail = dd.ends % 32;
        if (tail === 0) return;
        for (let p = 0; p < dd.picks; p++) expect(dd.bits[p * dd.stride + dd.stride - 1] >>> tail).toBe(0);
      }),
    );
  });

  it('mirrors the drawdown when the threading is mirrored, and reverses it when reversed', () => {
    fc.assert(
      fc.property(draftArb({ maxEnds: 30 }), (draft) => {
        const original = cells(computeDrawdown(draft));
        const mirrored: Draft = { ...draft, threading: mirror(draft.threading, { shareCentre: false }), warpColors: mirror(draft.warpColors, { shareCentre: false }), warpLayers: [] };
        const reversed: Draft = { ...draft, threading: reverse(draft.threading), warpColors: reverse(draft.warpColors), warpLayers: [] };
        expect(cells(computeDrawdown(mirrored))).toEqual([...original, ...reverse(original)]);
        expect(cells(computeDrawdown(reversed))).toEqual(reverse(original));
      }),
    );
  });

  it('handles a draft with no ends or no picks', () => {
    const none = computeDrawdown(emptyDraft(4, 2));
    expect([none.ends, none.picks, none.bits.length, none.isUp(0, 0)]).toEqual([0, 0, 0, false]);
    const noPicks = computeDrawdown(createDraft({ shafts: 2, threading: [[1], [2]] }));
    expect([noPicks.ends, noPicks.picks, noPicks.stride, noPicks.bits.length]).toEqual([2, 0, 1, 0]);
  });
});
