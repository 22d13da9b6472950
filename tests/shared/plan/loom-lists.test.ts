import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeDrawdown } from '../../../shared/weave/drawdown';
import {
  DEFAULT_ORIENTATION,
  groupInto,
  groupSizeForWidth,
  sleyingSteps,
  threadingSteps,
  tieOnGroups,
  weaverShaft,
  weavingList,
  workingOrder,
  type Orientation,
} from '../../../shared/plan/loom-lists';
import { expandWarp } from '../../../shared/plan/warp';
import { alternateLayers, layersByShaft } from '../../../shared/weave/layer-lists';
import { STRAIGHT_4, TWILL_22_LIFTS, makeDraft } from './draft-fixtures';

const orientation = fc.record({
  side: fc.constantFrom('front' as const, 'back' as const),
  direction: fc.constantFrom('right-to-left' as const, 'left-to-right' as const),
  shaftNumbering: fc.constantFrom('near' as const, 'far' as const),
  endOneAt: fc.constantFrom('right' as const, 'left' as const),
});

/** A draft whose whole threading is the warp (one repeat, no selvedges). */
function wholeWarp(draft = makeDraft()) {
  const n = draft.threading.length;
  return expandWarp(draft, { repeats: 1, bodyEnds: n, totalEnds: n }, 0);
}

describe('orientation', () => {
  it('from the front, right to left, with end 1 on the right, meets end 1 first', () => {
    expect(workingOrder(5, DEFAULT_ORIENTATION)).toEqual([0, 1, 2, 3, 4]);
  });

  it('from the back the same direction meets the ends the other way and numbers shafts from the back', () => {
    const back: Orientation = { ...DEFAULT_ORIENTATION, side: 'back' };
    expect(workingOrder(5, back)).toEqual([4, 3, 2, 1, 0]);
    expect(weaverShaft(1, 8, back)).toBe(8);
    expect(weaverShaft(1, 8, { ...back, shaftNumbering: 'far' })).toBe(1);
  });

  it('a threading list from the back, left to right, keeps end order but renumbers shafts', () => {
    const draft = makeDraft({ threading: STRAIGHT_4, warpColors: [0, 1, 0, 1] });
    const o: Orientation = { side: 'back', direction: 'left-to-right', shaftNumbering: 'near', endOneAt: 'right' };
    const [group] = threadingSteps(draft, wholeWarp(draft), o, 4);
    expect(group.items.map((s) => [s.end, s.shafts[0], s.colorHex])).toEqual([
      [1, 4, '#1f3a5f'],
      [2, 3, '#f2e8d5'],
      [3, 2, '#1f3a5f'],
      [4, 1, '#f2e8d5'],
    ]);
  });

  it('counts groups as the weaver reads them', () => {
    const groups = groupInto([1, 2, 3, 4, 5, 6, 7], 3);
    expect(groups.map((g) => `group ${g.index} of ${g.of}: ${g.items.join(' ')}`)).toEqual([
      'group 1 of 3: 1 2 3',
      'group 2 of 3: 4 5 6',
      'group 3 of 3: 7',
    ]);
    expect(groupSizeForWidth(24, 1)).toBe(24);
  });

  it('orderings are permutations; changing side, direction or end-1 side reverses them', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 200 }), orientation, (n, o) => {
        const order = workingOrder(n, o);
        expect([...order].sort((a, b) => a - b)).toEqual(Array.from({ length: n }, (_, i) => i));
        const reversed = [...order].reverse();
        expect(workingOrder(n, { ...o, side: o.side === 'front' ? 'back' : 'front' })).toEqual(reversed);
        expect(workingOrder(n, { ...o, direction: o.direction === 'right-to-left' ? 'left-to-right' : 'right-to-left' })).toEqual(reversed);
        expect(workingOrder(n, { ...o, endOneAt: o.endOneAt === 'right' ? 'left' : 'right' })).toEqual(reversed);
      }),
    );
  });

  it('shaft numbering is a one-to-one renumbering that walking round the loom flips', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 32 }), orientation, (shafts, o) => {
        const seen = Array.from({ length: shafts }, (_, i) => weaverShaft(i + 1, shafts, o));
        expect([...seen].sort((a, b) => a - b)).toEqual(Array.from({ length: shafts }, (_, i) => i + 1));
        const other = { ...o, side: o.side === 'front' ? ('back' as const) : ('front' as const) };
        seen.forEach((w, i) => expect(weaverShaft(i + 1, shafts, other)).toBe(shafts + 1 - w));
      }),
    );
  });
});

describe('lists from a draft', () => {
  const randomDraft = fc
    .record({
      threading: fc.array(fc.integer({ min: 1, max: 8 }).map((s) => [s]), { minLength: 1, maxLength: 40 }),
      layers: fc.array(fc.integer({ min: 1, max: 2 }), { minLength: 40, maxLength: 40 }),
      liftplan: fc.array(fc.subarray([1, 2, 3, 4, 5, 6, 7, 8]), { minLength: 1, maxLength: 16 }),
      shed: fc.constantFrom('rising' as const, 'sinking' as const),
    })
    .map(({ threading, layers, liftplan, shed }) =>
      makeDraft({ shafts: 8, threading, liftplan, shed, warpLayers: threading.map((_, i) => layers[i]), warpColors: threading.map((_, i) => i % 3), weftColors: liftplan.map(() => 1) }),
    );

  it('threading groups list every end once with its draft shafts', () => {
    fc.assert(
      fc.property(randomDraft, orientation, fc.integer({ min: 1, max: 12 }), (draft, o, size) => {
        const warp = wholeWarp(draft);
        const groups = threadingSteps(draft, warp, o, size);
        const steps = groups.flatMap((g) => g.items);
        expect(steps.map((s) => s.end)).toEqual(workingOrder(warp.length, o).map((i) => i + 1));
        for (const s of steps) {
          const back = s.shafts.map((w) => weaverShaft(w, draft.shafts, o));
          expect(back.sort()).toEqual([...draft.threading[s.end - 1]].sort());
          expect(s.color).toBe(draft.warpColors[s.end - 1]);
        }
        groups.forEach((g) => expect(g.items.length).toBeLessThanOrEqual(size));
      }),
    );
  });

  it('sleying steps cover every end once in working order and keep layers apart', () => {
    fc.assert(
      fc.property(randomDraft, orientation, fc.constantFrom([2], [2, 2, 1], [3, 2]), (draft, o, pattern) => {
        const warp = wholeWarp(draft);
        const dents = sleyingSteps(warp, o, pattern, 5, { layerRule: true, layerOrder: [1, 2], flipEvery: 3 }).flatMap((g) => g.items);
        expect(dents.flatMap((d) => d.ends.map((e) => e.end))).toEqual(workingOrder(warp.length, o).map((i) => i + 1));
        for (const d of dents) expect(new Set(d.ends.map((e) => e.layer)).size).toBe(d.ends.length);
      }),
    );
  });

  it('lists and sleys ends and picks in the layers the layer rows give them', () => {
    // An 8-shaft double weave threaded straight: the layer rows' quick fills put the ends on shafts
    // 1-2 and 5-6 in layer 1 and the rest in layer 2 (by shaft), and the picks alternate 1-2.
    const threading = Array.from({ length: 16 }, (_, i) => [(i % 8) + 1]);
    const liftplan = Array.from({ length: 6 }, (_, i) => [(i % 8) + 1]);
    let warpLayers = layersByShaft([], threading, 1, 8, 2);
    warpLayers = layersByShaft(warpLayers, threading, 1, 2, 1);
    warpLayers = layersByShaft(warpLayers, threading, 5, 6, 1);
    const weftLayers = alternateLayers([], liftplan.length, 0, liftplan.length - 1);
    const draft = makeDraft({ shafts: 8, threading, liftplan, warpLayers, weftLayers });
    const expected = threading.map(([s]) => ([1, 2, 5, 6].includes(s) ? 1 : 2));
    expect(warpLayers).toEqual(expected);

    const warp = wholeWarp(draft);
    const listed = threadingSteps(draft, warp, DEFAULT_ORIENTATION, 4).flatMap((g) => g.items);
    expect(listed.map((step) => [step.end, step.layer]).sort((a, b) => a[0] - b[0])).toEqual(expected.map((l, i) => [i + 1, l]));
    // Two ends per dent under the layer rule: each dent takes one end of each layer, layer 1 first,
    // closing a dent early rather than take two of one layer.
    const dents = sleyingSteps(warp, DEFAULT_ORIENTATION, [2], 4, { layerRule: true, layerOrder: [1, 2] }).flatMap((g) => g.items);
    for (const d of dents) {
      expect(new Set(d.ends.map((e) => e.layer)).size).toBe(d.ends.length);
      d.ends.forEach((e) => expect(e.layer).toBe(expected[e.end - 1]));
    }
    // Ends 1, 2 (layer 1) then 3, 4 (layer 2): end 2 cannot join end 1, so dents close early.
    expect(dents.slice(0, 3).map((d) => d.ends.map((e) => e.end))).toEqual([[1], [2, 3], [4]]);
    expect(weavingList(draft, { totalPicks: 6 }).rows.map((r) => r.layer)).toEqual([1, 2, 1, 2, 1, 2]);
  });

  it('tie-on groups bundle every end once', () => {
    const groups = tieOnGroups(10, DEFAULT_ORIENTATION, 4);
    expect(groups.map((g) => g.items)).toEqual([[1, 2, 3, 4], [5, 6, 7, 8], [9, 10]]);
  });

  it('weaving rows raise exactly the shafts that bring the drawdown’s ends up', () => {
    fc.assert(
      fc.property(randomDraft, (draft) => {
        const list = weavingList(draft, { totalPicks: 100 });
        const dd = computeDrawdown(draft);
        expect(list.rows.reduce((a, r) => a + r.times, 0)).toBe(dd.picks);
        for (const row of list.rows) {
          expect(row.toPick - row.fromPick + 1).toBe(row.times);
          for (let p = row.fromPick - 1; p < row.toPick; p++) {
            for (let e = 0; e < dd.ends; e++) {
              const up = draft.threading[e].some((s) => row.raised.includes(s));
              expect(up).toBe(dd.isUp(e, p));
            }
          }
        }
        expect(list.repeats * list.picksInSequence + list.extraPicks).toBe(100);
      }),
    );
  });

  it('merges repeated picks and names treadles', () => {
    const draft = makeDraft({
      control: 'treadling',
      treadles: 4,
      tieup: TWILL_22_LIFTS,
      treadling: [[1], [1], [2], [3], [4]],
      liftplan: [],
      weftColors: [1, 1, 1, 1, 2],
      sett: { warp: 24, weft: 20, unit: 'inch' },
    });
    const list = weavingList(draft, { totalPicks: 12, shaftNumbering: 'far' });
    expect(list.rows.map((r) => [r.fromPick, r.times, r.treadles, r.raised, r.colorHex])).toEqual([
      [1, 2, [1], [3, 4], '#f2e8d5'],
      [3, 1, [2], [2, 3], '#f2e8d5'],
      [4, 1, [3], [1, 2], '#f2e8d5'],
      [5, 1, [4], [1, 4], '#b5482e'],
    ]);
    expect([list.repeats, list.extraPicks, list.picksPerUnit, list.unit]).toEqual([2, 2, 20, 'inch']);
  });
});
