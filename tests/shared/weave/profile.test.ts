import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseDraft } from '../../../shared/weave/draft';
import { computeDrawdown, type Drawdown } from '../../../shared/weave/drawdown';
import { expandProfile, maxBlocks, PROFILE_UNITS, profileUnit, type Profile } from '../../../shared/weave/profile';
import type { ProfileUnitId } from '../../../shared/weave/types';
import { doubleWeaveProfile } from '../../helpers/draft-fixtures';

const PALETTE = ['#22303c', '#efe6d2', '#9a3b2e'];

function arbitraryProfile(unitId: ProfileUnitId): fc.Arbitrary<Profile> {
  const unit = profileUnit(unitId);
  return fc.integer({ min: 1, max: Math.min(6, maxBlocks(unit)) }).chain((blocks) =>
    fc.record({
      threading: fc.array(fc.integer({ min: 1, max: blocks }), { minLength: 1, maxLength: 12 }),
      treadling: fc.array(fc.subarray(Array.from({ length: blocks }, (_, i) => i + 1)), { minLength: 1, maxLength: 12 }),
      endsPerUnit: fc.constantFrom(unit.width, unit.width * 2),
      picksPerUnit: fc.constantFrom(unit.height, unit.height * 2),
      palette: fc.constant(PALETTE),
      warpColors: fc.constant(unit.warpSets.map((_, i) => [i % 3, (i + 1) % 3])),
      weftColors: fc.constant(unit.weftSets.map((_, i) => [(i + 2) % 3])),
    }),
  );
}

const bothUnits = fc.constantFrom<ProfileUnitId>('double-weave', 'summer-and-winter').chain((id) => fc.tuple(fc.constant(id), arbitraryProfile(id)));

function sameDrawdown(a: Drawdown, b: Drawdown): boolean {
  return a.ends === b.ends && a.picks === b.picks && a.bits.every((w, i) => w === b.bits[i]);
}

/** Longest run of equal cells along every row and column. */
function longestFloat(dd: Drawdown): number {
  let longest = 0;
  for (let p = 0; p < dd.picks; p++) {
    for (let e = 0, run = 0; e < dd.ends; e++) {
      run = e > 0 && dd.isUp(e, p) === dd.isUp(e - 1, p) ? run + 1 : 1;
      longest = Math.max(longest, run);
    }
  }
  for (let e = 0; e < dd.ends; e++) {
    for (let p = 0, run = 0; p < dd.picks; p++) {
      run = p > 0 && dd.isUp(e, p) === dd.isUp(e, p - 1) ? run + 1 : 1;
      longest = Math.max(longest, run);
    }
  }
  return longest;
}

describe('PROFILE_UNITS', () => {
  it('offers double weave and summer and winter, with their shaft needs', () => {
    expect(PROFILE_UNITS.map((u) => [u.id, u.shaftsPerBlock, u.sharedShafts])).toEqual([
      ['double-weave', 4, 0],
      ['summer-and-winter', 1, 2],
    ]);
    for (const u of PROFILE_UNITS) expect(u.description.length).toBeGreaterThan(40);
    expect(maxBlocks(profileUnit('double-weave'), 8)).toBe(2);
    expect(maxBlocks(profileUnit('summer-and-winter'), 8)).toBe(6);
  });
});

describe('expandProfile', () => {
  it('keeps the block link of every end and pick; ends and picks are the sums of unit sizes', () => {
    fc.assert(
      fc.property(bothUnits, ([unitId, profile]) => {
        const unit = profileUnit(unitId);
        const draft = expandProfile(profile, unitId);
        const epu = profile.endsPerUnit ?? unit.width;
        const ppu = profile.picksPerUnit ?? unit.height;
        expect(draft.threading).toHaveLength(profile.threading.length * epu);
        expect(draft.liftplan).toHaveLength(profile.treadling.length * ppu);
        expect(draft.blocks?.warp).toEqual(profile.threading.flatMap((b) => new Array<number>(epu).fill(b)));
        expect(draft.blocks?.weft).toEqual(profile.treadling.flatMap((_, r) => new Array<number>(ppu).fill(r + 1)));
        draft.threading.forEach(([shaft], e) => {
          const block = draft.blocks!.warp[e];
          const own = unit.sharedShafts + (block - 1) * unit.shaftsPerBlock;
          const isOwn = shaft > own && shaft <= own + unit.shaftsPerBlock;
          expect(isOwn || shaft <= unit.sharedShafts).toBe(true);
        });
        // The result is a valid draft document.
        expect(parseDraft(JSON.parse(JSON.stringify(draft)))).toEqual(draft);
      }),
      { numRuns: 80 },
    );
  }, 60_000);

  it('gives a tie-up and treadling weaving the same cloth when the distinct lifts fit the treadles', () => {
    fc.assert(
      fc.property(bothUnits, fc.integer({ min: 1, max: 32 }), ([unitId, profile], treadles) => {
        const lifted = expandProfile(profile, unitId);
        const distinct = new Set(lifted.liftplan.map((l) => l.join(','))).size;
        const treadled = expandProfile(profile, unitId, { treadles });
        if (distinct > treadles) return treadled.control === 'liftplan' && treadled.treadles === 0;
        return (
          treadled.control === 'treadling' &&
          treadled.treadles === treadles &&
          treadled.treadling.every((t) => t.length === 1) &&
          sameDrawdown(computeDrawdown(treadled), computeDrawdown(lifted))
        );
      }),
      { numRuns: 80 },
    );
  }, 60_000);

  it('refuses profiles that do not fit the unit, saying why', () => {
    expect(() => expandProfile(doubleWeaveProfile({ threading: [1, 0] }), 'double-weave')).toThrow(/profile column 2: 0 is not a block number/);
    expect(() => expandProfile(doubleWeaveProfile({ threading: [1, 9] }), 'double-weave')).toThrow(/9 blocks need 36 shafts/);
    expect(() => expandProfile(doubleWeaveProfile({ endsPerUnit: 6 }), 'double-weave')).toThrow(/whole multiple of 4/);
    expect(() => expandProfile(doubleWeaveProfile({ warpColors: [[0], [7]] }), 'double-weave')).toThrow(/colour 7 is not in the palette/);
    expect(() => expandProfile(doubleWeaveProfile({ weftColors: [[0]] }), 'double-weave')).toThrow(/give a colour order for "Layer 2"/);
  });
});

describe('summer and winter unit', () => {
  // Source: the summer-and-winter unit as defined in standard weaving textbooks, e.g. Donna Sullivan,
  // "Summer and Winter: A Weave for All Seasons" (1991) (from memory, not re-read): tie-down shafts 1
  // and 2, one pattern shaft per block, unit 1-p-2-p; "singles" treadling alternates pattern picks on
  // tie-down 1 and 2 with plain-weave picks (1+2, then all pattern shafts); floats never pass 3.
  const profile: Profile = {
    threading: [1, 2, 2, 3],
    treadling: [[1], [2, 3], [3]],
    palette: PALETTE,
    warpColors: [[1]],
    weftColors: [[2], [1]],
  };
  const draft = expandProfile(profile, 'summer-and-winter');
  const dd = computeDrawdown(draft);

  it('threads each block 1-p-2-p on two tie-down shafts plus one shaft per block', () => {
    expect(draft.shafts).toBe(5); // 3 blocks + 2 tie-downs
    expect(draft.threading.slice(0, 8)).toEqual([[1], [3], [2], [3], [1], [4], [2], [4]]);
    expect(draft.threading.slice(12, 16)).toEqual([[1], [5], [2], [5]]);
  });

  it('alternates pattern picks with plain-weave picks that form plain weave', () => {
    expect(draft.liftplan.slice(0, 4)).toEqual([[1, 4, 5], [1, 2], [2, 4, 5], [3, 4, 5]]);
    for (let p = 1; p + 2 < dd.picks; p += 2) {
      for (let e = 0; e < dd.ends; e++) expect(dd.isUp(e, p)).not.toBe(dd.isUp(e, p + 2));
    }
    expect(draft.weftColors.slice(0, 4)).toEqual([2, 1, 2, 1]);
  });

  it('floats the pattern weft over three ends of each unit on the front in pattern blocks, on the back elsewhere', () => {
    // Rising shed: a cell not up shows the weft on the front.
    const weftOverPerUnit = (unit: number, pick: number) => [0, 1, 2, 3].filter((i) => !dd.isUp(unit * 4 + i, pick)).length;
    for (const pick of [0, 2]) {
      expect(weftOverPerUnit(0, pick)).toBe(3); // block 1 shows in row 1
      expect(weftOverPerUnit(1, pick)).toBe(1); // block 2 does not: the float is on the back
      expect(weftOverPerUnit(3, pick)).toBe(1);
    }
    expect(weftOverPerUnit(1, 4)).toBe(3);
    expect(weftOverPerUnit(3, 4)).toBe(3);
    expect(weftOverPerUnit(0, 4)).toBe(1);
  });

  it('never floats more than three threads, whatever the profile', () => {
    fc.assert(
      fc.property(arbitraryProfile('summer-and-winter'), (p) => longestFloat(computeDrawdown(expandProfile(p, 'summer-and-winter'))) <= 3),
      { numRuns: 60 },
    );
  }, 60_000);
});
