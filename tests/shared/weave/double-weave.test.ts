import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkThreading, quickChecks } from '../../../shared/weave/check-threading';
import { simulateLayers } from '../../../shared/weave/layers';
import { expandProfile, type Profile } from '../../../shared/weave/profile';
import { arbitraryDoubleWeaveProfile, CREAM, doubleWeaveProfile, NAVY, RUST } from '../../helpers/draft-fixtures';

const LAYER_COLOURS: Record<number, number[]> = { 1: [NAVY], 2: [CREAM, RUST] };

/** Layer the profile puts on top at an end and pick: layer 1 where the row names the end's block. */
function profileTop(profile: Profile, end: number, pick: number): number {
  const epu = profile.endsPerUnit ?? 4;
  const ppu = profile.picksPerUnit ?? 4;
  const block = profile.threading[Math.floor(end / epu)];
  return profile.treadling[Math.floor(pick / ppu)].includes(block) ? 1 : 2;
}

describe('two-block double weave on 8 shafts', () => {
  // Source: books on loom-controlled double weave (common practice, from memory): two shafts per
  // plain-weave layer, four shafts per block, so 8 shafts give blocks A (1–4) and B (5–8); ends
  // alternate layers; on a lower-layer pick the whole upper layer of the block is lifted; the back
  // shows the other layer.
  const profile = doubleWeaveProfile();
  const draft = expandProfile(profile, 'double-weave');
  const sim = simulateLayers(draft);
  const W = draft.threading.length;

  it('threads block A on shafts 1–4 and block B on 5–8, ends alternating layers', () => {
    expect(draft.shafts).toBe(8);
    expect(draft.threading.slice(0, 4)).toEqual([[1], [3], [2], [4]]);
    expect(draft.threading.slice(8, 12)).toEqual([[5], [7], [6], [8]]);
    expect(draft.warpLayers.slice(0, 4)).toEqual([1, 2, 1, 2]);
    // One layer a single colour, the other two colours.
    expect(draft.warpColors.slice(0, 8)).toEqual([NAVY, CREAM, NAVY, RUST, NAVY, CREAM, NAVY, RUST]);
  });

  it('lifts the whole upper layer of a block on a lower-layer pick', () => {
    // Pick 2 is a layer-2 pick in a row where block A has layer 1 up and block B layer 2 up.
    expect(draft.weftLayers[1]).toBe(2);
    expect(draft.liftplan[1]).toEqual(expect.arrayContaining([1, 2]));
    expect(draft.liftplan[1]).not.toEqual(expect.arrayContaining([5, 6]));
    // Pick 1 (layer 1) in the same row: block B has layer 2 up, so shafts 7 and 8 rise.
    expect(draft.liftplan[0]).toEqual(expect.arrayContaining([7, 8]));
  });

  it('shows only one layer per block on the front and the other on the back, exchanging between rows', () => {
    for (let pick = 0; pick < draft.liftplan.length; pick++) {
      for (let end = 0; end < W; end++) {
        const top = profileTop(profile, end, pick);
        expect(sim.topLayerAt(end, pick)).toBe(top);
        expect(LAYER_COLOURS[top]).toContain(sim.front.colorAt(end, pick));
        expect(LAYER_COLOURS[3 - top]).toContain(sim.back.colorAt(W - 1 - end, pick));
      }
    }
    // Block A, first rows: navy only on the front; block B there: cream and rust only.
    expect(sim.front.colorAt(0, 0)).toBe(NAVY);
    expect(sim.front.colorAt(9, 0)).not.toBe(NAVY);
    // The two layers trade places in the next rows.
    expect(sim.front.colorAt(0, 8)).not.toBe(NAVY);
    expect(sim.front.colorAt(9, 8)).toBe(NAVY);
    expect(sim.problems).toEqual([]);
  });

  it('shows one colour per shaft when each shaft is raised alone', () => {
    const check = checkThreading(draft);
    expect(check.problems).toEqual([]);
    for (const shaft of check.shafts) {
      expect(shaft.colors).toHaveLength(1);
      expect(shaft.layer).toBe([1, 2, 5, 6].includes(shaft.shaft) ? 1 : 2);
    }
    expect(quickChecks(draft)[2].instruction).toBe('Raise shaft 3 alone: both ends on it (layer 2) should be colour 2.');
  });

  it('reports a navy end moved onto a shaft of the other layer, at that end', () => {
    const moved = structuredClone(draft);
    moved.threading[4] = [3]; // end 5: navy, layer 1, was on shaft 1
    const check = checkThreading(moved);
    expect(check.problems).toHaveLength(1);
    expect(check.problems[0]).toMatchObject({ kind: 'layer', end: 4, shaft: 3 });
    expect(check.problems[0].message).toMatch(/^End 5 \(layer 1, colour 1\) is on shaft 3/);
    const layers = simulateLayers(moved);
    expect(layers.problems.filter((p) => p.kind === 'crossed-end')).toEqual([
      expect.objectContaining({ end: 4, shaft: 3, message: expect.stringContaining('End 5') }),
    ]);
    expect(quickChecks(moved)[2].instruction).toContain('end 5 will not be');
  });
});

describe('double weave from any profile', () => {
  it('shows each area’s two layers once on the front and once on the back, as the profile says', () => {
    fc.assert(
      fc.property(arbitraryDoubleWeaveProfile(), (profile) => {
        const draft = expandProfile(profile, 'double-weave');
        const sim = simulateLayers(draft);
        const W = sim.ends;
        for (let pick = 0; pick < sim.picks; pick++) {
          for (let end = 0; end < W; end++) {
            const top = profileTop(profile, end, pick);
            if (sim.topLayerAt(end, pick) !== top) return false;
            if (!LAYER_COLOURS[top].includes(sim.front.colorAt(end, pick))) return false;
            if (!LAYER_COLOURS[3 - top].includes(sim.back.colorAt(W - 1 - end, pick))) return false;
          }
        }
        return sim.problems.length === 0;
      }),
      { numRuns: 60 },
    );
  }, 60_000);

  it('gives a clean threading check: one colour and one layer per shaft', () => {
    fc.assert(
      fc.property(arbitraryDoubleWeaveProfile(8), (profile) => {
        const check = checkThreading(expandProfile(profile, 'double-weave'));
        return check.problems.length === 0 && check.shafts.every((s) => s.ends.length === 0 || (s.colors.length === 1 && s.layers.length === 1));
      }),
      { numRuns: 60 },
    );
  }, 60_000);
});
