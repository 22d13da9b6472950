import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkThreading } from '../../../shared/weave/check-threading';
import { countByKind, findChecks, foundProblems, groupChecks, type FoundProblem } from '../../../shared/weave/checks';
import { numberList } from '../../../shared/weave/words';
import { findFloats } from '../../../shared/weave/floats';
import { simulateLayers } from '../../../shared/weave/layers';
import { expandProfile } from '../../../shared/weave/profile';
import type { Draft } from '../../../shared/weave/types';
import { arbitraryDoubleWeaveProfile, doubleWeaveProfile } from '../../helpers/draft-fixtures';
import { draftArb } from './arbitraries';

/** Every problem the engine finds in a draft, nothing capped. */
function everything(draft: Draft, floatLimit = 5): FoundProblem[] {
  const layers = simulateLayers(draft, undefined, { maxProblems: Number.POSITIVE_INFINITY }).problems;
  return foundProblems(draft, { layers, floats: findFloats(draft, { limit: floatLimit }).overLimit });
}

/**
 * Two blocks of eight units each (32 ends per block), 50 profile rows alternating the blocks, so
 * 200 picks. The case to catch: one end moved to a shaft of the other block.
 */
const twoBlocks = expandProfile(
  doubleWeaveProfile({ threading: [...new Array<number>(8).fill(1), ...new Array<number>(8).fill(2)], treadling: Array.from({ length: 50 }, (_, r) => (r % 2 === 0 ? [2] : [1])) }),
  'double-weave',
);

describe('findChecks', () => {
  it('lists an end moved to another block’s shaft once, with every pick it ties the layers on', () => {
    // End 2 is layer 2 of block 1 (on shaft 3); moved to shaft 8, layer 2 of block 2. Worked by hand
    // from the unit (common practice for double weave, see double-weave.test.ts): in rows where
    // block 2 has layer 1 up and block 1 layer 2, a layer-1 pick lifts block 1's layer-2 shafts but
    // leaves shaft 8 down, so the pick passes over end 2; in the other rows the pick is under the
    // raised shafts 7–8 of block 2 while block 1 keeps layer 1 on top. Every layer-1 pick (the odd
    // picks 1 … 199) crosses end 2 against the order; layer-2 picks are its own layer.
    const moved = structuredClone(twoBlocks);
    moved.threading[1] = [8];
    const problems = everything(moved);
    expect(problems.length).toBeGreaterThan(100); // 100 stitches and a colour slip before grouping
    const checks = groupChecks(moved, problems, 5);
    expect(checks).toHaveLength(1);
    expect(checks[0]).toMatchObject({ axis: 'ends', index: 1, kind: 'threading' });
    expect(checks[0].extent).toEqual(Array.from({ length: 100 }, (_, i) => 2 * i));
    expect(checks[0].message).toBe(
      'End 2 (layer 2) is on shaft 8, a block-2 shaft among block-1 ends: it ties the layers on 100 picks (1, 3, 5 … 199); ' +
        'it is colour 2 on shaft 8, where the other ends are colour 3.',
    );
  });

  it('lists an end crossed onto the other layer’s shaft once, though both the threading and the layer checks find it', () => {
    const moved = structuredClone(twoBlocks);
    moved.threading[1] = [1]; // layer 2 end on shaft 1, a layer-1 shaft of its own block
    expect(checkThreading(moved).problems).toHaveLength(1);
    expect(simulateLayers(moved).problems.filter((p) => p.kind === 'crossed-end')).toHaveLength(1);
    const checks = findChecks(moved, { layers: simulateLayers(moved, undefined, { maxProblems: Infinity }).problems });
    expect(checks).toHaveLength(1);
    expect(checks[0].message).toMatch(/^End 2 \(layer 2\) is on shaft 1, a layer-1 shaft: it ties the layers on \d+ picks/);
  });

  it('lists a pick that lifts a wrong shaft once, with the ends it ties', () => {
    const wrong = structuredClone(twoBlocks);
    // Pick 5 is a layer-1 pick in a row where block 1 has layer 1 on top: raising shaft 3 (block 1,
    // layer 2) lifts the eight layer-2 ends on it (ends 2, 6 … 30) over the pick.
    wrong.liftplan[4] = [...wrong.liftplan[4], 3].sort((a, b) => a - b);
    const checks = findChecks(wrong, { layers: simulateLayers(wrong).problems });
    expect(checks).toHaveLength(1);
    expect(checks[0]).toMatchObject({ axis: 'picks', index: 4, kind: 'layers', extent: [1, 5, 9, 13, 17, 21, 25, 29] });
    expect(checks[0].message).toBe('Pick 5 (layer 1) raises shaft 3 against the layer order: it ties the layers on 8 ends (2, 6, 10 … 30).');
  });

  it('names colours by yarn name', () => {
    const odd = structuredClone(twoBlocks);
    odd.warpColors[0] = 2;
    odd.yarns = [{ id: 'navy', name: 'Navy wool', color: 0 }, { id: 'rust', name: 'Rust wool', color: 2 }];
    const [check] = findChecks(odd);
    expect(check.message).toBe('End 1 (layer 1) is Rust wool on shaft 1, where the other ends are Navy wool.');
  });

  it('counts items by kind', () => {
    const both = structuredClone(twoBlocks);
    both.threading[1] = [8];
    both.liftplan[4] = [...both.liftplan[4], 3].sort((a, b) => a - b);
    const counts = countByKind(findChecks(both, { layers: simulateLayers(both, undefined, { maxProblems: Infinity }).problems }));
    expect(counts.map((c) => c.count)).toEqual([1, 1, 0]);
  });

  it('writes long lists as the first three and the last', () => {
    expect(numberList([0, 2, 4])).toBe('1, 3, 5');
    expect(numberList([0, 2, 4, 6, 8])).toBe('1, 3, 5, 7, 9');
    expect(numberList([0, 2, 4, 6, 8, 10])).toBe('1, 3, 5 … 11');
  });
});

/** Expanded double weave with a few ends moved and a few lifts changed. */
const damagedDoubleWeave: fc.Arbitrary<Draft> = arbitraryDoubleWeaveProfile(4).chain((profile) => {
  const draft = expandProfile(profile, 'double-weave');
  const ends = draft.threading.length;
  const picks = draft.liftplan.length;
  return fc
    .record({
      moves: fc.array(fc.tuple(fc.nat(ends - 1), fc.integer({ min: 1, max: draft.shafts })), { maxLength: 4 }),
      lifts: fc.array(fc.tuple(fc.nat(picks - 1), fc.integer({ min: 1, max: draft.shafts })), { maxLength: 4 }),
    })
    .map(({ moves, lifts }) => {
      const d = structuredClone(draft);
      for (const [e, s] of moves) d.threading[e] = [s];
      for (const [p, s] of lifts) d.liftplan[p] = d.liftplan[p].includes(s) ? d.liftplan[p].filter((x) => x !== s) : [...d.liftplan[p], s].sort((a, b) => a - b);
      return d;
    });
});

describe('groupChecks (property)', () => {
  const holds = (draft: Draft) => {
    const problems = everything(draft, 3);
    const groups = groupChecks(draft, problems, 3);
    // Loses nothing: every problem is in exactly one group.
    const seen = new Map<FoundProblem, number>();
    for (const g of groups) for (const p of g.problems) seen.set(p, (seen.get(p) ?? 0) + 1);
    expect(seen.size).toBe(problems.length);
    for (const p of problems) expect(seen.get(p)).toBe(1);
    // Never a cause twice: one group per end or pick, and both checks' reports of one crossed end together.
    const causes = groups.map((g) => `${g.axis}:${g.index}`);
    expect(new Set(causes).size).toBe(causes.length);
    for (const g of groups) {
      expect(g.problems.length).toBeGreaterThan(0);
      expect(g.message).not.toMatch(/#[0-9a-f]{6}/i);
      for (const p of g.problems) {
        if (p.source === 'layers' && p.problem.kind === 'stitch') {
          const { end, pick } = p.problem;
          expect(g.axis === 'ends' ? end === g.index && g.extent.includes(pick!) : pick === g.index && g.extent.includes(end!)).toBe(true);
        }
      }
    }
    const crossedEnds = problems.flatMap((p) => (p.source === 'layers' && p.problem.kind === 'crossed-end' ? [p.problem.end] : []));
    for (const e of crossedEnds) expect(groups.filter((g) => g.problems.some((p) => (p.source === 'threading' || p.source === 'layers') && 'end' in p.problem && p.problem.end === e && p.problem.kind !== 'stitch'))).toHaveLength(1);
  };

  it('loses no problem and never lists a cause twice, on damaged double weave', () => {
    fc.assert(fc.property(damagedDoubleWeave, holds), { numRuns: 60 });
  }, 60_000);

  it('loses no problem and never lists a cause twice, on any draft', () => {
    fc.assert(fc.property(draftArb({ maxEnds: 24, maxPicks: 24 }), holds), { numRuns: 80 });
  }, 60_000);
});
