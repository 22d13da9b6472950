import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createDraft, parseDraft, type DraftError } from '../../../shared/weave/draft';
import { simulateLayers } from '../../../shared/weave/layers';
import { applyProfile, expandProfile, maxBlocks, profileUnit, toBlockLiftPlan, toBlockTreadling } from '../../../shared/weave/profile';
import { changedRun, repeatWithChange } from '../../../shared/weave/sequences';
import type { BlockDesign } from '../../../shared/weave/types';

const DARK = 0;
const LIGHT = 1;
const RUST = 2;
const PALETTE = ['#22303c', '#efe6d2', '#9a3b2e'];

/*
 * How the expansions below were worked out by hand. The double-weave unit (common practice, as in
 * books on loom-controlled double weave, from memory): four shafts per block, block b on shafts
 * 4b−3 … 4b; ends in the order layer-1 end on the block's 1st shaft, layer-2 end on its 3rd,
 * layer-1 on its 2nd, layer-2 on its 4th (A1 B1 A2 B2). Picks alternate layers the same way.
 * In a block where layer 1 is on top, a layer-1 pick lifts one layer-1 shaft (1st, then 2nd) and
 * a layer-2 pick lifts both layer-1 shafts and one layer-2 shaft (3rd, then 4th). Where layer 2
 * is on top the roles swap: a layer-1 pick lifts both layer-2 shafts and one layer-1 shaft, a
 * layer-2 pick one layer-2 shaft. A pick's lift is the union over the blocks.
 */
describe('expanding block designs (worked by hand)', () => {
  it('expands a 3-block double weave on 12 shafts', () => {
    expect(maxBlocks(profileUnit('double-weave'), 12)).toBe(3); // shafts ÷ 4
    expect(maxBlocks(profileUnit('double-weave'), 32)).toBe(8);
    const draft = expandProfile(
      { threading: [1, 2, 3], treadling: [[1], [2, 3]], palette: PALETTE, warpColors: [[DARK], [LIGHT]], weftColors: [[DARK], [LIGHT]] },
      'double-weave',
    );
    expect(draft.shafts).toBe(12);
    // Block 1: shafts 1, 3, 2, 4; block 2: 5, 7, 6, 8; block 3: 9, 11, 10, 12.
    expect(draft.threading).toEqual([[1], [3], [2], [4], [5], [7], [6], [8], [9], [11], [10], [12]]);
    expect(draft.warpLayers).toEqual([1, 2, 1, 2, 1, 2, 1, 2, 1, 2, 1, 2]);
    expect(draft.weftLayers).toEqual([1, 2, 1, 2, 1, 2, 1, 2]);
    expect(draft.warpColors).toEqual([DARK, LIGHT, DARK, LIGHT, DARK, LIGHT, DARK, LIGHT, DARK, LIGHT, DARK, LIGHT]);
    expect(draft.weftColors).toEqual([DARK, LIGHT, DARK, LIGHT, DARK, LIGHT, DARK, LIGHT]);
    expect(draft.liftplan).toEqual([
      // Row 1: layer 1 up in block 1; layer 2 up in blocks 2 and 3.
      [1, 5, 7, 8, 9, 11, 12], // pick 1 (layer 1): shaft 1 | 7, 8 + 5 | 11, 12 + 9
      [1, 2, 3, 7, 11], // pick 2 (layer 2): 1, 2 + 3 | 7 | 11
      [2, 6, 7, 8, 10, 11, 12], // pick 3 (layer 1): 2 | 7, 8 + 6 | 11, 12 + 10
      [1, 2, 4, 8, 12], // pick 4 (layer 2): 1, 2 + 4 | 8 | 12
      // Row 2: layer 2 up in block 1; layer 1 up in blocks 2 and 3.
      [1, 3, 4, 5, 9],
      [3, 5, 6, 7, 9, 10, 11],
      [2, 3, 4, 6, 10],
      [4, 5, 6, 8, 9, 10, 12],
    ]);
    // Faces: the top layer's colour in each block, the other layer's on the back (mirrored).
    const sim = simulateLayers(draft);
    const W = draft.threading.length;
    for (let pick = 0; pick < 8; pick++) {
      for (let end = 0; end < W; end++) {
        const block = Math.floor(end / 4) + 1;
        const layerOneUp = pick < 4 ? block === 1 : block !== 1;
        expect(sim.front.colorAt(end, pick)).toBe(layerOneUp ? DARK : LIGHT);
        expect(sim.back.colorAt(W - 1 - end, pick)).toBe(layerOneUp ? LIGHT : DARK);
      }
    }
  });

  it('expands a two-block double weave with a 4-end colour unit: two colours in layer 1, one in layer 2', () => {
    const design: BlockDesign = {
      unit: 'double-weave',
      threading: [1, 2],
      treadling: [[1], [2]],
      warpColors: [[DARK, LIGHT], [RUST]],
      weftColors: [[DARK, LIGHT], [RUST]],
    };
    const draft = expandProfile({ ...design, palette: PALETTE }, 'double-weave');
    expect(draft.threading).toEqual([[1], [3], [2], [4], [5], [7], [6], [8]]);
    // Layer-1 ends take dark, light, dark, light in turn; layer-2 ends are all rust.
    expect(draft.warpColors).toEqual([DARK, RUST, LIGHT, RUST, DARK, RUST, LIGHT, RUST]);
    expect(draft.weftColors).toEqual([DARK, RUST, LIGHT, RUST, DARK, RUST, LIGHT, RUST]);
    expect(draft.warpLayers).toEqual([1, 2, 1, 2, 1, 2, 1, 2]);
    expect(draft.liftplan).toEqual([
      [1, 5, 7, 8],
      [1, 2, 3, 7],
      [2, 6, 7, 8],
      [1, 2, 4, 8],
      [1, 3, 4, 5],
      [3, 5, 6, 7],
      [2, 3, 4, 6],
      [4, 5, 6, 8],
    ]);
    // The face of a layer-1 block is layer 1's own plain weave of 1 dark 1 light in warp and weft.
    // Hairlines (common practice, edu: "the phase decides whether the lines run warp-wise or
    // weft-wise"): on pick 1 (dark) end 1 (dark) is up and end 3 (light) down, showing the dark
    // pick; on pick 3 (light) end 3 (light) is up and end 1 down under the light pick: so every
    // pick shows one colour, lines running across. Each cell shows its nearest layer-1 end and pick.
    const sim = simulateLayers(draft);
    const rows = (firstEnd: number, firstPick: number) =>
      [0, 1, 2, 3].map((y) => [0, 1, 2, 3].map((x) => sim.front.colorAt(firstEnd + x, firstPick + y)));
    const lines = [
      [DARK, DARK, DARK, DARK],
      [DARK, DARK, DARK, DARK],
      [LIGHT, LIGHT, LIGHT, LIGHT],
      [LIGHT, LIGHT, LIGHT, LIGHT],
    ];
    const rust = new Array(4).fill([RUST, RUST, RUST, RUST]);
    expect(rows(0, 0)).toEqual(lines); // block 1, row 1: layer 1 up
    expect(rows(4, 0)).toEqual(rust); // block 2, row 1: layer 2 up
    expect(rows(0, 4)).toEqual(rust);
    expect(rows(4, 4)).toEqual(lines);
  });

  it('gives a block its own colour orders where the design says', () => {
    const draft = expandProfile(
      { threading: [1, 2, 1], treadling: [[1]], palette: PALETTE, warpColors: [[DARK], [LIGHT]], weftColors: [[DARK], [LIGHT]], blockWarpColors: [[], [[RUST], [LIGHT]]] },
      'double-weave',
    );
    expect(draft.warpColors).toEqual([DARK, LIGHT, DARK, LIGHT, RUST, LIGHT, RUST, LIGHT, DARK, LIGHT, DARK, LIGHT]);
  });

  it('gives the picks of a weft block their own colour orders where the design says', () => {
    // Rows 1 and 3 show block 1 (weft block 1), row 2 shows block 2 (weft block 2): weft block 2's
    // picks take rust in layer 1 and light in layer 2; the others the design's own dark and light.
    const draft = expandProfile(
      { threading: [1, 2], treadling: [[1], [2], [1]], palette: PALETTE, warpColors: [[DARK], [LIGHT]], weftColors: [[DARK], [LIGHT]], blockWeftColors: [[], [[RUST], [LIGHT]]] },
      'double-weave',
    );
    expect(draft.weftColors).toEqual([DARK, LIGHT, DARK, LIGHT, RUST, LIGHT, RUST, LIGHT, DARK, LIGHT, DARK, LIGHT]);
    // So block 2 of row 2 (layer 1 up there) shows rust picks beside its dark ends on the front.
    const sim = simulateLayers(draft);
    const frontOfBlock2Row2 = new Set<number>();
    for (let pick = 4; pick < 8; pick++) for (let end = 4; end < 8; end++) frontOfBlock2Row2.add(sim.front.colorAt(end, pick));
    expect([...frontOfBlock2Row2].sort()).toEqual([DARK, RUST]);
  });

  it('weaves a block treadling through a block tie-up as the block lift plan it stands for', () => {
    // Block treadle 1 shows block 1, treadle 2 shows block 2, treadle 3 both: rows press 1, 2, 3, 1,
    // so the lift plan they stand for is [1], [2], [1, 2], [1].
    const colours = { palette: PALETTE, warpColors: [[DARK], [LIGHT]], weftColors: [[DARK], [LIGHT]] };
    const treadled: BlockDesign = { unit: 'double-weave', threading: [1, 2, 2, 1], tieup: [[1], [2], [1, 2]], treadling: [[1], [2], [3], [1]], ...colours };
    const lifted: BlockDesign = { unit: 'double-weave', threading: [1, 2, 2, 1], treadling: [[1], [2], [1, 2], [1]], ...colours };
    expect(expandProfile({ ...treadled, palette: PALETTE }, 'double-weave')).toEqual(expandProfile({ ...lifted, palette: PALETTE }, 'double-weave'));
    expect(toBlockLiftPlan(treadled)).toEqual(lifted);
    // And back: one block treadle per different row, in order of first use.
    expect(toBlockTreadling(lifted)).toEqual(treadled);
    expect(toBlockLiftPlan(toBlockTreadling({ ...lifted, treadling: [[2], [], [1, 2], [2]] }))).toEqual({ ...lifted, treadling: [[2], [], [1, 2], [2]] });
    // A row pressing a treadle the tie-up does not have is refused, naming it.
    expect(() => expandProfile({ ...treadled, treadling: [[4]], palette: PALETTE }, 'double-weave')).toThrow(/profile row 1: 4 is not one of the 3 block treadles/);
    // Under a tie-up a row's weft block is its treadle: treadle 3's picks take their own colours.
    const own = expandProfile({ ...treadled, palette: PALETTE, blockWeftColors: [[], [], [[RUST], [RUST]]] }, 'double-weave');
    expect(own.weftColors).toEqual([...[DARK, LIGHT, DARK, LIGHT], ...[DARK, LIGHT, DARK, LIGHT], ...[RUST, RUST, RUST, RUST], ...[DARK, LIGHT, DARK, LIGHT]]);
  });

  it('refuses more than 200 profile columns or rows', () => {
    const profile = { palette: PALETTE, warpColors: [[0], [1]], weftColors: [[0], [1]] };
    expect(() => expandProfile({ ...profile, threading: new Array(200).fill(1), treadling: new Array(200).fill([1]) }, 'double-weave')).not.toThrow();
    expect(() => expandProfile({ ...profile, threading: new Array(201).fill(1), treadling: [[1]] }, 'double-weave')).toThrow(/201 profile columns is more than 200/);
    expect(() => expandProfile({ ...profile, threading: [1], treadling: new Array(201).fill([1]) }, 'double-weave')).toThrow(/201 profile rows is more than 200/);
  });
});

describe('the block design in the draft document', () => {
  const design: BlockDesign = {
    unit: 'double-weave',
    threading: [1, 2, 2, 1],
    treadling: [[1], [2]],
    endsPerUnit: 8,
    warpColors: [[DARK, LIGHT, DARK, LIGHT], [RUST]],
    weftColors: [[DARK], [RUST]],
    blockWarpColors: [[], [[LIGHT], [RUST]]],
  };

  it('round-trips through JSON and parseDraft', () => {
    const draft = applyProfile(createDraft({ palette: PALETTE }), design).draft;
    expect(draft.profile).toEqual(design);
    expect(parseDraft(JSON.parse(JSON.stringify(draft)))).toEqual(draft);
    // A block treadling with its tie-up, and weft colours per block, round-trip too.
    const treadled: BlockDesign = { ...toBlockTreadling(design), blockWeftColors: [[[LIGHT], [DARK]]] };
    const again = applyProfile(createDraft({ palette: PALETTE }), treadled).draft;
    expect(again.profile).toEqual(treadled);
    expect(parseDraft(JSON.parse(JSON.stringify(again)))).toEqual(again);
    expect(again.liftplan).toEqual(applyProfile(createDraft({ palette: PALETTE }), { ...design, blockWeftColors: [[[LIGHT], [DARK]]] }).draft.liftplan);
  });

  it('loads the stored format-2 document with its block design', () => {
    const doc = JSON.parse(readFileSync(join(import.meta.dirname, 'fixtures', 'draft-v2-block-design.json'), 'utf8')) as Record<string, unknown>;
    const draft = parseDraft(doc);
    expect(draft.profile).toEqual(doc.profile);
    expect(applyProfile(draft, draft.profile!).draft.threading).toEqual(draft.threading);
  });

  it('reports block designs that do not fit the palette or the format', () => {
    const problems = (profile: unknown) => {
      try {
        parseDraft({ schemaVersion: 2, shafts: 8, threading: [], palette: PALETTE, profile });
        return [];
      } catch (e) {
        return (e as DraftError).problems.map((p) => p.message);
      }
    };
    expect(problems({ ...design, warpColors: [[0], [5]] })).toEqual(['block design: warp colour order 2: colour 5 is not in the palette (its colours are numbered 0 to 2)']);
    expect(problems({ ...design, unit: 'lace' })[0]).toMatch(/^block design unit: must be one of "double-weave", "summer-and-winter"/);
    expect(problems({ ...design, threading: new Array(201).fill(1) })[0]).toMatch(/has more than 200 columns/);
    expect(problems({ ...design, threading: [0] })[0]).toMatch(/0 is not a block number/);
  });
});

describe('applyProfile', () => {
  const base = createDraft({
    name: 'Table mat',
    palette: PALETTE,
    yarns: [
      { id: 'd', name: 'Charcoal cotton 8/2', color: DARK },
      { id: 'l', name: 'Oat linen 16/2', color: LIGHT },
    ],
    notes: 'Hem in plain weave.',
  });
  const design: BlockDesign = { unit: 'double-weave', threading: [1, 2], treadling: [[1], [2]], warpColors: [[DARK], [LIGHT]], weftColors: [[DARK], [LIGHT]] };

  it('keeps the palette, yarn names, name and notes', () => {
    const { draft, summary } = applyProfile(base, design);
    expect(draft).toMatchObject({ name: 'Table mat', palette: PALETTE, yarns: base.yarns, notes: 'Hem in plain weave.', profile: design });
    expect(summary).toBe('Expanded into 8 ends and 8 picks on 8 shafts. Yarns kept: Charcoal cotton 8/2, Oat linen 16/2.');
  });

  it('keeps ends and picks added around the design and says which hand edits it replaced', () => {
    const first = applyProfile(base, design).draft;
    // The weaver adds two border ends after the design and a pick before it, and recolours end 3.
    const edited = structuredClone(first);
    edited.threading.push([1], [2]);
    edited.warpColors.push(RUST, RUST);
    edited.warpLayers.push(1, 1);
    edited.blocks!.warp.push(0, 0);
    edited.liftplan.unshift([1, 2, 3, 4]);
    edited.weftColors.unshift(RUST);
    edited.weftLayers.unshift(1);
    edited.blocks!.weft.unshift(0);
    edited.warpColors[2] = RUST;
    const { draft, summary } = applyProfile(edited, { ...design, threading: [2, 1, 2] });
    expect(draft.threading).toEqual([[5], [7], [6], [8], [1], [3], [2], [4], [5], [7], [6], [8], [1], [2]]);
    expect(draft.warpColors.slice(-2)).toEqual([RUST, RUST]);
    expect(draft.liftplan[0]).toEqual([1, 2, 3, 4]);
    expect(draft.liftplan).toHaveLength(9);
    expect(draft.blocks!.warp).toEqual([2, 2, 2, 2, 1, 1, 1, 1, 2, 2, 2, 2, 0, 0]);
    expect(summary).toContain('Kept 2 ends and 1 pick drawn outside the block design.');
    expect(summary).toContain('Replaced your changes to end 3 inside the old design.');
  });

  it('stays treadled on a loom whose treadles suffice', () => {
    const treadled = createDraft({ ...base, shafts: 8, treadles: 8, tieup: new Array(8).fill([]) });
    expect(applyProfile(treadled, design).draft).toMatchObject({ control: 'treadling', treadles: 8 });
  });
});

describe('repeat with a change', () => {
  it('repeats a four-end colour unit 12 times, then its reverse 12 times', () => {
    // Log cabin (edu): A-B-A-B then B-A-B-A; where two like ends meet, the lines turn.
    const out = repeatWithChange(['A', 'B', 'A', 'B'], 12, 'reverse');
    expect(out).toHaveLength(96);
    expect(out.slice(44, 52).join('')).toBe('ABABBABA');
    expect(changedRun([1, 2, 3, 4], 'swap')).toEqual([2, 1, 3, 4]);
    expect(changedRun([1, 2, 1, 2], 'swap')).toEqual([2, 1, 2, 1]);
  });

  it('is K copies of the run and K of its change, per pair', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 4 }), { minLength: 1, maxLength: 6 }), fc.integer({ min: 1, max: 5 }), fc.integer({ min: 1, max: 3 }), fc.constantFrom('reverse' as const, 'swap' as const), (run, k, pairs, change) => {
        const out = repeatWithChange(run, k, change, pairs);
        const n = run.length;
        expect(out).toHaveLength(2 * k * n * pairs);
        for (let i = 0; i < out.length; i++) {
          const copy = Math.floor(i / n);
          expect(out[i]).toBe((copy % (2 * k) < k ? run : changedRun(run, change))[i % n]);
        }
        expect(changedRun(changedRun(run, change), change)).toEqual(run);
      }),
    );
  });
});
