import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeDrawdown } from '../../../shared/weave/drawdown';
import { createDraft } from '../../../shared/weave/draft';
import {
  asLists,
  brokenDraw,
  mirror,
  pointDraw,
  repeat,
  reverse,
  straightDraw,
  straightRun,
  treadleAsDrawnIn,
  treadleDraftAsDrawnIn,
  twillTieup,
} from '../../../shared/weave/sequences';

describe('drafting sequences', () => {
  it('draws straight, point and broken runs', () => {
    expect(straightRun(4, 1)).toEqual([4, 3, 2, 1]);
    expect(straightDraw(4, 2)).toEqual([1, 2, 3, 4, 1, 2, 3, 4]);
    expect(pointDraw(4)).toEqual([1, 2, 3, 4, 3, 2]);
    expect(pointDraw(2, 2)).toEqual([1, 2, 1, 2]);
    // Common practice: the 4-shaft broken twill threading 1-2-4-3, and 1-2-3-4-2-1-4-3.
    expect(brokenDraw(4, 2)).toEqual([1, 2, 4, 3]);
    expect(brokenDraw(4, 4)).toEqual([1, 2, 3, 4, 2, 1, 4, 3]);
  });

  it('point draws turn without doubling an end, broken draws never form a point', () => {
    fc.assert(
      fc.property(fc.integer({ min: 4, max: 32 }), fc.integer({ min: 2, max: 6 }), (shafts, runLength) => {
        const point = repeat(pointDraw(shafts), 2);
        point.slice(1).forEach((s, i) => expect(Math.abs(s - point[i])).toBe(1));
        const broken = repeat(brokenDraw(shafts, Math.min(runLength, shafts), 4), 2);
        for (let i = 1; i + 1 < broken.length; i++) expect(broken[i - 1]).not.toBe(broken[i + 1]);
      }),
    );
  });

  it('mirrors, reverses and repeats', () => {
    expect(mirror([1, 2, 3])).toEqual([1, 2, 3, 2, 1]);
    expect(mirror([1, 2, 3], { shareCentre: false })).toEqual([1, 2, 3, 3, 2, 1]);
    fc.assert(
      fc.property(fc.array(fc.integer()), fc.integer({ min: 0, max: 4 }), (seq, n) => {
        expect(reverse(reverse(seq))).toEqual(seq);
        const m = mirror(seq);
        expect(m).toEqual(reverse(m));
        expect(repeat(seq, n)).toHaveLength(seq.length * n);
      }),
    );
  });

  it('builds twill tie-ups from an up/down pattern', () => {
    expect(twillTieup([2, 2])).toEqual([[1, 2], [2, 3], [3, 4], [1, 4]]);
    expect(twillTieup([1, 3])).toEqual([[1], [2], [3], [4]]);
  });

  it('treadles as drawn in: pick i follows end i, so the diagonal repeats the tie-up', () => {
    expect(treadleAsDrawnIn([[1], [3], []])).toEqual([[1], [3], []]);
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 4 }), { maxLength: 20 }), (seq) => {
        const draft = treadleDraftAsDrawnIn(createDraft({ shafts: 4, threading: asLists(seq) }), { tieup: twillTieup([2, 2]) });
        expect(draft.treadling).toEqual(asLists(seq));
        expect(draft.weftColors).toEqual(draft.warpColors);
        // Treadle t of the 2/2 tie-up lifts shafts t and t + 1, so end e is up on pick p exactly when
        // its shaft is the pick's shaft or the one after; on the diagonal (p = e) always (common practice:
        // woven as drawn in, the threading's figure appears along the diagonal).
        const dd = computeDrawdown(draft);
        for (let e = 0; e < seq.length; e++) {
          for (let p = 0; p < seq.length; p++) expect(dd.isUp(e, p)).toBe([0, 1].includes((seq[e] - seq[p] + 4) % 4));
          expect(dd.isUp(e, e)).toBe(true);
        }
      }),
    );
  });

  it('widens the tie-up so every shaft has a treadle', () => {
    const d = treadleDraftAsDrawnIn(createDraft({ shafts: 6, treadles: 2, threading: asLists([1, 6]) }));
    expect([d.treadles, d.tieup.length, d.control]).toEqual([6, 6, 'treadling']);
  });
});
