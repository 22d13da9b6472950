import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createDraft } from '../../../shared/weave/draft';
import { computeDrawdown } from '../../../shared/weave/drawdown';
import { simulateLayers, type LayerSimulation } from '../../../shared/weave/layers';
import { expandProfile } from '../../../shared/weave/profile';
import type { Draft } from '../../../shared/weave/types';
import { arbitraryDoubleWeaveProfile, doubleWeaveProfile } from '../../helpers/draft-fixtures';

/**
 * A slow, literal reading of the documented rule, cell by cell, to hold the fast version to:
 * votes from cross-layer crossings in the cell's area, pairwise majority, ties to the cell's own
 * crossing then the lower layer; top = above the most others; faces from the nearest threads.
 */
function reference(draft: Draft, radius: number) {
  const dd = computeDrawdown(draft);
  const W = dd.ends;
  const H = dd.picks;
  const wl = Array.from({ length: W }, (_, e) => draft.warpLayers[e] ?? 1);
  const pl = Array.from({ length: H }, (_, p) => draft.weftLayers[p] ?? 1);
  const present = [...new Set([...wl, ...pl])].sort((a, b) => a - b);
  const pairs: [number, number][] = [];
  for (const a of present) for (const b of present) if (a < b && ((wl.includes(a) && pl.includes(b)) || (wl.includes(b) && pl.includes(a)))) pairs.push([a, b]);
  const span = (links: number[] | undefined, n: number, i: number): [number, number] => {
    if (links && links.length === n && links.some((b) => b > 0)) {
      let lo = i;
      let hi = i;
      while (lo > 0 && links[lo - 1] === links[i]) lo--;
      while (hi < n - 1 && links[hi + 1] === links[i]) hi++;
      return [lo, hi];
    }
    return [Math.max(0, i - radius), Math.min(n - 1, i + radius)];
  };
  const top: number[][] = [];
  const bottom: number[][] = [];
  for (let p = 0; p < H; p++) {
    top.push([]);
    bottom.push([]);
    const [p0, p1] = span(draft.blocks?.weft, H, p);
    for (let e = 0; e < W; e++) {
      const [e0, e1] = span(draft.blocks?.warp, W, e);
      const score = new Map(present.map((l) => [l, 0]));
      for (const [a, b] of pairs) {
        let lowerAbove = 0;
        let higherAbove = 0;
        for (let y = p0; y <= p1; y++) {
          for (let x = e0; x <= e1; x++) {
            const pair = [wl[x], pl[y]].sort((m, n) => m - n);
            if (wl[x] === pl[y] || pair[0] !== a || pair[1] !== b) continue;
            // The end up puts its own layer above the pick's.
            const above = dd.isUp(x, y) ? wl[x] : pl[y];
            if (above === a) lowerAbove++;
            else higherAbove++;
          }
        }
        let aWins = lowerAbove > higherAbove;
        if (lowerAbove === higherAbove) {
          const own = [wl[e], pl[p]].sort((m, n) => m - n);
          aWins = wl[e] !== pl[p] && own[0] === a && own[1] === b ? (dd.isUp(e, p) ? wl[e] : pl[p]) === a : true;
        }
        const winner = aWins ? a : b;
        score.set(winner, score.get(winner)! + 1);
      }
      let t = present[0];
      let u = present[0];
      for (const l of present) {
        if (score.get(l)! > score.get(t)!) t = l;
        if (score.get(l)! <= score.get(u)!) u = l;
      }
      top[p].push(t);
      bottom[p].push(u);
    }
  }
  const nearest = (layers: number[], links: number[] | undefined, l: number, i: number) => {
    let best = -1;
    for (let j = 0; j < layers.length; j++) {
      if (layers[j] !== l) continue;
      const d = Math.abs(j - i);
      const bd = Math.abs(best - i);
      const sameBlock = (k: number) => links !== undefined && links.length === layers.length && links[k] === links[i];
      if (best < 0 || d < bd || (d === bd && sameBlock(j) && !sameBlock(best))) best = j;
    }
    return best;
  };
  const face = (layerAt: number[][], back: boolean) =>
    (x: number, y: number) => {
      const e = back ? W - 1 - x : x;
      const l = layerAt[y][e];
      let ne = nearest(wl, draft.blocks?.warp, l, e);
      let np = nearest(pl, draft.blocks?.weft, l, y);
      if (ne < 0) ne = e;
      if (np < 0) np = y;
      const up = dd.isUp(ne, np);
      return up !== back ? draft.warpColors[ne] : draft.weftColors[np];
    };
  return { top, front: face(top, false), back: face(bottom, true) };
}

const arbitraryLayeredDraft: fc.Arbitrary<Draft> = fc
  .record({
    shafts: fc.integer({ min: 2, max: 6 }),
    ends: fc.integer({ min: 1, max: 14 }),
    picks: fc.integer({ min: 1, max: 14 }),
    layers: fc.integer({ min: 1, max: 3 }),
    linked: fc.boolean(),
  })
  .chain(({ shafts, ends, picks, layers, linked }) =>
    fc.record({
      shafts: fc.constant(shafts),
      control: fc.constant('liftplan' as const),
      shed: fc.constantFrom('rising' as const, 'sinking' as const),
      threading: fc.array(fc.uniqueArray(fc.integer({ min: 1, max: shafts }), { maxLength: 2 }), { minLength: ends, maxLength: ends }),
      liftplan: fc.array(fc.uniqueArray(fc.integer({ min: 1, max: shafts }), { maxLength: shafts }), { minLength: picks, maxLength: picks }),
      palette: fc.constant<string[]>(['#000000', '#555555', '#aaaaaa', '#ffffff']),
      warpColors: fc.array(fc.integer({ min: 0, max: 3 }), { minLength: ends, maxLength: ends }),
      weftColors: fc.array(fc.integer({ min: 0, max: 3 }), { minLength: picks, maxLength: picks }),
      warpLayers: fc.array(fc.integer({ min: 1, max: layers }), { minLength: ends, maxLength: ends }),
      weftLayers: fc.array(fc.integer({ min: 1, max: layers }), { minLength: picks, maxLength: picks }),
      blocks: linked
        ? fc.record({
            warp: fc.array(fc.integer({ min: 1, max: 3 }), { minLength: ends, maxLength: ends }),
            weft: fc.array(fc.integer({ min: 1, max: 3 }), { minLength: picks, maxLength: picks }),
          })
        : fc.constant(undefined),
    }),
  )
  .map((parts) => createDraft(parts));

function regionsCoverOnce(sim: LayerSimulation): boolean {
  const seen = new Uint8Array(sim.ends * sim.picks);
  for (const r of sim.regions) {
    for (let y = r.firstPick; y <= r.lastPick; y++) {
      for (let x = r.firstEnd; x <= r.lastEnd; x++) {
        if (seen[y * sim.ends + x] || sim.topLayerAt(x, y) !== r.top) return false;
        seen[y * sim.ends + x] = 1;
      }
    }
  }
  return seen.every((v) => v === 1);
}

describe('simulateLayers', () => {
  it('agrees with a cell-by-cell reading of the rule on any draft, layers and block links', () => {
    fc.assert(
      fc.property(arbitraryLayeredDraft, fc.integer({ min: 0, max: 3 }), (draft, radius) => {
        const sim = simulateLayers(draft, undefined, { radius });
        const ref = reference(draft, radius);
        for (let y = 0; y < sim.picks; y++) {
          for (let x = 0; x < sim.ends; x++) {
            expect(sim.topLayerAt(x, y)).toBe(ref.top[y][x]);
            expect(sim.front.colorAt(x, y)).toBe(ref.front(x, y));
            expect(sim.back.colorAt(x, y)).toBe(ref.back(x, y));
          }
        }
        expect(regionsCoverOnce(sim)).toBe(true);
      }),
      { numRuns: 200 },
    );
  }, 60_000);

  it('shows a one-layer cloth as drawn on the front and reversed and mirrored on the back', () => {
    // Source: the drawdown colour rule of weaving textbooks (e.g. Watson, Textile Design and Colour, 1907): a cell shows the warp colour where the end is up.
    const draft = createDraft({
      shafts: 4,
      threading: [[1], [2], [3], [4], [1]],
      control: 'liftplan',
      liftplan: [[1, 2], [2, 3], [3, 4]],
      palette: ['#000000', '#ffffff', '#ff0000'],
      warpColors: [0, 0, 2, 0, 0],
      weftColors: [1, 1, 2],
    });
    const dd = computeDrawdown(draft);
    const sim = simulateLayers(draft);
    for (let y = 0; y < 3; y++) {
      for (let x = 0; x < 5; x++) {
        expect(sim.topLayerAt(x, y)).toBe(1);
        expect(sim.front.colorAt(x, y)).toBe(dd.isUp(x, y) ? draft.warpColors[x] : draft.weftColors[y]);
        expect(sim.back.colorAt(4 - x, y)).toBe(dd.isUp(x, y) ? draft.weftColors[y] : draft.warpColors[x]);
      }
    }
    expect(sim.problems).toEqual([]);
  });

  it('takes layers given by the caller over the draft’s own, repeating a shorter list', () => {
    const draft = expandProfile(doubleWeaveProfile(), 'double-weave');
    const own = simulateLayers(draft);
    const bare = { ...draft, warpLayers: [], weftLayers: [] };
    expect(simulateLayers(bare).top.every((t) => t === 1)).toBe(true);
    const given = simulateLayers(bare, { warp: [1, 2], weft: [1, 2] });
    expect(given.top).toEqual(own.top);
    expect(given.front.indices).toEqual(own.front.indices);
  });

  it('reports a single stitch at its end and pick, and nothing else', () => {
    fc.assert(
      fc.property(arbitraryDoubleWeaveProfile(2), fc.nat(), fc.nat(), (profile, endSeed, pickSeed) => {
        const draft = expandProfile(profile, 'double-weave');
        // Give one end a shaft of its own (9) that follows its old shaft, except on one crossing pick.
        const end = endSeed % draft.threading.length;
        const old = draft.threading[end][0];
        const crossing = draft.weftLayers.flatMap((l, p) => (l !== draft.warpLayers[end] ? [p] : []));
        const pick = crossing[pickSeed % crossing.length];
        const liftplan = draft.liftplan.map((lift, p) => {
          const follows = lift.includes(old) !== (p === pick);
          return follows ? [...lift, 9] : lift;
        });
        const threading = draft.threading.map((t, e) => (e === end ? [9] : t));
        const stitched = createDraft({ ...draft, shafts: 9, threading, liftplan });
        const sim = simulateLayers(stitched);
        expect(sim.problems).toEqual([expect.objectContaining({ kind: 'stitch', end, pick })]);
        expect(sim.problems[0].message).toMatch(new RegExp(`\\b[Ee]nd ${end + 1}\\b`));
        expect(sim.problems[0].message).toMatch(new RegExp(`\\b[Pp]ick ${pick + 1}\\b`));
      }),
      { numRuns: 80 },
    );
  }, 60_000);

  it('blames the lift when a pick raises or leaves down a whole shaft against the layer order', () => {
    const draft = expandProfile(doubleWeaveProfile(), 'double-weave');
    const liftplan = draft.liftplan.map((l) => [...l]);
    // Pick 2 (layer 2) must lift all of block A's layer 1 (shafts 1 and 2); drop shaft 2.
    liftplan[1] = liftplan[1].filter((s) => s !== 2);
    // Pick 1 (layer 1) in block A, where layer 1 is up, must leave layer 2's shaft 4 down; raise it.
    liftplan[0] = [...liftplan[0], 4];
    const sim = simulateLayers(createDraft({ ...draft, liftplan }));
    expect(sim.problems).toEqual([
      {
        kind: 'wrong-lift',
        pick: 0,
        shaft: 4,
        // Shaft 4 holds the layer-2 ends 4 and 8 of block A (unit order 1, 3, 2, 4).
        tied: [3, 7],
        raised: true,
        message: 'Pick 1 (layer 1) raises shaft 4, putting its 2 layer-2 ends over the pick where layer 1 should be on top: the layers are stitched together.',
      },
      {
        kind: 'wrong-lift',
        pick: 1,
        shaft: 2,
        tied: [2, 6],
        raised: false,
        message: 'Pick 2 (layer 2) leaves shaft 2 down, so the pick passes over its 2 layer-1 ends where layer 1 should be on top: the layers are stitched together.',
      },
    ]);
  });

  it('maps where each layer is up as rectangles following the blocks', () => {
    const sim = simulateLayers(expandProfile(doubleWeaveProfile(), 'double-weave'));
    expect(sim.regions).toEqual([
      { firstEnd: 0, lastEnd: 7, firstPick: 0, lastPick: 7, top: 1 },
      { firstEnd: 8, lastEnd: 15, firstPick: 0, lastPick: 7, top: 2 },
      { firstEnd: 0, lastEnd: 7, firstPick: 8, lastPick: 15, top: 2 },
      { firstEnd: 8, lastEnd: 15, firstPick: 8, lastPick: 15, top: 1 },
    ]);
  });

  it('caps the problems listed but counts them all', () => {
    const draft = expandProfile(doubleWeaveProfile({ threading: [1, 1, 1, 1], treadling: [[1], [1], [1], [1]] }), 'double-weave');
    // Raising both layer-2 shafts on a layer-1 pick where layer 1 is up: two wrong lifts, one listed.
    const liftplan = draft.liftplan.map((l, p) => (p === 4 ? [...l, 3, 4] : l));
    const sim = simulateLayers(createDraft({ ...draft, liftplan }), undefined, { maxProblems: 1 });
    expect(sim.problemCount).toBe(2);
    expect(sim.problems).toHaveLength(1);
  });
});
