import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeDrawdown, type Drawdown } from '../../../shared/weave/drawdown';
import { simulateLayers } from '../../../shared/weave/layers';
import { balancedTwill, startingDraft, StartingDraftError, type StartingDraftOptions } from '../../../shared/weave/starting-draft';

const base: StartingDraftOptions = { name: 'Sampler', shafts: 4, treadles: 6, ends: 24, picks: 16, structure: 'empty' };
const up = (dd: Drawdown, e: number, p: number) => dd.isUp(e, p);
const refusal = (o: Partial<StartingDraftOptions>) => {
  try {
    startingDraft({ ...base, ...o });
  } catch (e) {
    return e instanceof StartingDraftError ? e.field : String(e);
  }
  return null;
};

describe('startingDraft', () => {
  it('makes plain weave a checkerboard, with treadles or a lift plan, on any number of shafts', () => {
    // Source: Watson, Textile Design and Colour (1912), plain weave — each end passes over one pick and
    // under the next, and neighbouring ends do the opposite: a checkerboard (Watson, Textile Design and Colour, 1907).
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 32 }), fc.constantFrom(0, 2, 10), fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 40 }),
        (shafts, treadles, ends, picks) => {
          const draft = startingDraft({ ...base, structure: 'plain', shafts, treadles, ends, picks });
          expect(draft.control).toBe(treadles > 0 ? 'treadling' : 'liftplan');
          const dd = computeDrawdown(draft);
          expect([dd.ends, dd.picks]).toEqual([ends, picks]);
          for (let e = 0; e < ends; e++) for (let p = 0; p < picks; p++) expect(up(dd, e, p)).toBe((e + p) % 2 === 0);
        }),
      { numRuns: 60 },
    );
  });

  it('makes a 2/2 straight twill on four shafts that steps one end per pick', () => {
    // Source: the textbook definition of a regular twill (e.g. Watson, Textile Design and Colour, 1907): on n shafts it repeats on n ends and
    // n picks; a 2/2 twill on a straight draw treadled 1-2-3-4 moves its line one end each pick.
    const dd = computeDrawdown(startingDraft({ ...base, structure: 'straight-twill' }));
    for (let p = 0; p < 16; p++) {
      const row = Array.from({ length: 24 }, (_, e) => up(dd, e, p));
      expect(row.filter(Boolean)).toHaveLength(12);
      for (let e = 0; e < 24; e++) {
        // One end along per pick, and the weave repeats on four ends and four picks.
        expect(up(dd, (e + 1) % 24, (p + 1) % 16)).toBe(up(dd, e, p));
        expect(up(dd, (e + 4) % 24, p)).toBe(up(dd, e, p));
      }
    }
    expect(balancedTwill(4)).toEqual([2, 2]);
    expect(balancedTwill(3)).toEqual([1, 2]);
  });

  it('makes a point twill symmetric about its turning end, as a point draw treadled the same way is', () => {
    // Source: point draw and point treadling give a diamond: the draft mirrors about the turning thread
    // (common practice; books on twills, e.g. Oelsner 1915 ch. on pointed twills).
    const draft = startingDraft({ ...base, shafts: 4, structure: 'point-twill', ends: 13, picks: 13 });
    expect(draft.threading.slice(0, 7).map((t) => t[0])).toEqual([1, 2, 3, 4, 3, 2, 1]);
    const dd = computeDrawdown(draft);
    for (let e = 0; e <= 6; e++) for (let p = 0; p < 13; p++) expect(up(dd, 6 - e, p)).toBe(up(dd, 6 + e, p));
  });

  it('starts empty with nothing drawn but the loom and sizes asked for', () => {
    const draft = startingDraft({ ...base, structure: 'empty', shafts: 12, treadles: 14, ends: 30, picks: 20 });
    expect([draft.shafts, draft.treadles, draft.threading.length, draft.treadling.length]).toEqual([12, 14, 30, 20]);
    expect(draft.threading.every((t) => t.length === 0)).toBe(true);
    const lift = startingDraft({ ...base, structure: 'empty', treadles: 0 });
    expect([lift.control, lift.liftplan.length]).toEqual(['liftplan', 16]);
  });

  it('starts a double-weave block design whose layers separate, linked block by block', () => {
    // Source: books on loom-controlled double weave: four shafts per block, two blocks on eight.
    const draft = startingDraft({ ...base, structure: 'block', unit: 'double-weave', shafts: 8, treadles: 0, ends: 64, picks: 64 });
    expect(draft.threading.length).toBe(64);
    expect(draft.liftplan.length).toBe(64);
    expect(draft.warpLayers.length).toBe(64);
    expect(draft.blocks?.warp.slice(0, 8)).toEqual([1, 1, 1, 1, 1, 1, 1, 1]);
    // The design is kept with the draft, so the block design opens on it with the unit chosen.
    expect(draft.profile?.unit).toBe('double-weave');
    expect(draft.profile?.threading).toHaveLength(16);
    const treadled = startingDraft({ ...base, structure: 'block', unit: 'double-weave', shafts: 8, treadles: 10, ends: 32, picks: 32 });
    expect(treadled.control).toBe('treadling');
    expect(simulateLayers(draft).problemCount).toBe(0);
  });

  it('names the field at fault when the loom cannot weave the choice', () => {
    expect(refusal({ shafts: 1 })).toBe('shafts');
    expect(refusal({ shafts: 33 })).toBe('shafts');
    expect(refusal({ ends: 0 })).toBe('ends');
    expect(refusal({ picks: 2.5 })).toBe('picks');
    expect(refusal({ treadles: 40 })).toBe('treadles');
    expect(refusal({ structure: 'straight-twill', shafts: 2 })).toBe('shafts');
    expect(refusal({ structure: 'straight-twill', shafts: 8, treadles: 4 })).toBe('treadles');
    expect(refusal({ structure: 'block', unit: 'double-weave', shafts: 4 })).toBe('shafts');
    expect(refusal({ structure: 'block' })).toBe('unit');
    expect(refusal({ structure: 'straight-twill', shafts: 8, treadles: 8 })).toBeNull();
  });
});
