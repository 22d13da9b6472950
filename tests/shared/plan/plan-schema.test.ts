// Check values come from the published sources named beside each one (a standard, a book or an article);
// a fact of the trade with no published source says "common practice".
// (the standards and articles themselves were not re-read for these tests).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computePlan, defaultPlan, planDocumentSchema, warpPlanInput, type PlanDocumentInput } from '../../../shared/plan';
import { makeDraft } from './draft-fixtures';

const minimal: PlanDocumentInput = { finishedWidth: 20, finishedLength: 60 };

/** Two-layer plain weave on four shafts: shafts 1 and 3 carry layer 1, 2 and 4 layer 2. */
function doubleWeave() {
  return makeDraft({
    threading: [[1], [2], [3], [4]],
    warpLayers: [1, 2, 1, 2],
    warpColors: [0, 1, 0, 1],
    // Layer 1 picks lift shaft 1 or 3; layer 2 picks lift all of layer 1 plus shaft 2 or 4.
    liftplan: [[1], [1, 3, 2], [3], [1, 3, 4]],
    weftLayers: [1, 2, 1, 2],
    weftColors: [0, 1, 0, 1],
    sett: { warp: 30, weft: 30, unit: 'inch' },
  });
}

describe('plan document', () => {
  it('fills common-practice defaults', () => {
    const doc = planDocumentSchema.parse(minimal);
    expect(doc).toMatchObject({
      schemaVersion: 1,
      unit: 'inch',
      loom: 'floor',
      pieces: 1,
      allowances: { takeUp: 0.1, drawIn: 0.1, lengthShrinkage: 0.1, widthShrinkage: 0.1 },
      weftAllowance: 0.1,
      reed: { dents: 12, per: 'inch' },
      lists: { side: 'front', direction: 'right-to-left', shaftNumbering: 'near', endOneAt: 'right', layerRule: false },
    });
    expect(defaultPlan('cm').unit).toBe('cm');
  });

  it('takes loom waste from the loom type and unit when not given', () => {
    // Source: common practice — about 18" on a table loom; 27" chosen for a floor loom.
    const draft = makeDraft();
    expect(warpPlanInput(planDocumentSchema.parse({ ...minimal, loom: 'table' }), draft).loomWaste).toBe(18);
    expect(warpPlanInput(planDocumentSchema.parse({ ...minimal, unit: 'cm' }), draft).loomWaste).toBeCloseTo(68.58, 10);
    expect(warpPlanInput(planDocumentSchema.parse({ ...minimal, loomWaste: 30 }), draft).loomWaste).toBe(30);
  });

  it.each([
    [{ ...minimal, warpYarn: { text: '8/2' } }, 'count system'],
    [{ ...minimal, warpYarn: { text: '12 wpi' } }, 'wraps'],
    [{ ...minimal, allowances: { takeUp: 1 } }, ''],
    [{ ...minimal, denting: [0, 0] }, 'at least one end'],
    [{ finishedWidth: 20 }, ''],
  ])('rejects a bad plan (%#)', (doc, message) => {
    const r = planDocumentSchema.safeParse(doc);
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues.map((i) => i.message).join(' ')).toContain(message);
  });

  it('survives a JSON round trip unchanged', () => {
    fc.assert(
      fc.property(
        fc.record({
          finishedWidth: fc.double({ min: 1, max: 100, noNaN: true }),
          finishedLength: fc.double({ min: 1, max: 1000, noNaN: true }),
          unit: fc.constantFrom('inch' as const, 'cm' as const),
          pieces: fc.integer({ min: 1, max: 10 }),
          denting: fc.option(fc.array(fc.integer({ min: 1, max: 4 }), { minLength: 1, maxLength: 4 }), { nil: undefined }),
          warpYarn: fc.record({ text: fc.constantFrom('8/2 cotton', '2/10 worsted', 'Nm 2/28', '30 tex') }),
        }),
        (partial) => {
          const doc = planDocumentSchema.parse(partial);
          expect(planDocumentSchema.parse(JSON.parse(JSON.stringify(doc)))).toEqual(doc);
        },
      ),
    );
  });
});

describe('computing a saved plan', () => {
  it('suggests a double-weave sett from the yarn and from wraps', () => {
    // Source: Ashenhurst's rule (Ashenhurst, 1880s treatise), as restated in weaving education articles: 8/2 cotton plain weave max ≈ 26 epi;
    // double weave doubles it (common practice).
    const doc = planDocumentSchema.parse({ ...minimal, layers: 2, warpYarn: { text: '8/2 cotton' }, wrapsPerInch: 28 });
    const out = computePlan(doubleWeave(), doc);
    expect(Math.round(out.settGuide.maximum ?? 0)).toBe(52);
    expect(out.settGuide.working?.low).toBeCloseTo(0.75 * (out.settGuide.maximum ?? 0), 10);
    expect(out.settGuide.fromWraps).toBe(28); // plain weave WPI/2, two layers
    const cm = computePlan(doubleWeave(), { ...doc, unit: 'cm' });
    expect(cm.settGuide.maximum).toBeCloseTo((out.settGuide.maximum ?? 0) / 2.54, 10);
  });

  it('sleys a double weave with one end of each layer per dent', () => {
    const doc = planDocumentSchema.parse({ ...minimal, reed: { dents: 15, per: 'inch' }, lists: { layerRule: true, layerOrder: [1, 2] } });
    // End 1 on the right: working right to left from the front meets end 1 (layer 1) first.
    const out = computePlan({ ...doubleWeave(), arrangement: { endOne: 'right', threading: 'above', treadling: 'right', shaftOne: 'bottom' } }, doc);
    expect(out.denting.pattern).toEqual([2]);
    const dents = out.sleying.flatMap((g) => g.items);
    expect(dents.every((d) => d.ends.length === 2 && d.ends[0].layer === 1 && d.ends[1].layer === 2)).toBe(true);
  });

  it('weighs the yarn per colour and keeps a given denting', () => {
    const doc = planDocumentSchema.parse({
      ...minimal,
      warpYarn: { text: '10/2 cotton', byColor: { '1': '20/2 cotton' } },
      denting: [2, 3],
    });
    const out = computePlan(doubleWeave(), doc);
    const [dark, light] = out.warp.warpByColor;
    expect(dark.threads).toBe(light.threads);
    expect((dark.grams ?? 0) / (light.grams ?? 1)).toBeCloseTo(2, 10); // 10/2 is twice as heavy as 20/2
    expect(out.denting.sett).toBe(30);
    expect(out.denting.difference).toBeCloseTo(0, 10);
    expect(out.warp.weftByColor[0].grams).toBeUndefined(); // no weft yarn given
  });

  it('every list covers the whole warp in any orientation', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('front' as const, 'back' as const),
        fc.constantFrom('right-to-left' as const, 'left-to-right' as const),
        fc.integer({ min: 0, max: 4 }),
        fc.double({ min: 2, max: 30, noNaN: true }),
        (side, direction, selvedge, width) => {
          const doc = planDocumentSchema.parse({ ...minimal, finishedWidth: width, selvedgeEndsPerSide: selvedge, lists: { side, direction, layerRule: true } });
          const out = computePlan(doubleWeave(), doc);
          const total = out.warp.ends.totalEnds;
          const all = Array.from({ length: total }, (_, i) => i + 1);
          expect(out.threading.flatMap((g) => g.items.map((s) => s.end)).sort((a, b) => a - b)).toEqual(all);
          expect(out.sleying.flatMap((g) => g.items.flatMap((d) => d.ends.map((e) => e.end))).sort((a, b) => a - b)).toEqual(all);
          expect(out.tieOn.flatMap((g) => g.items).sort((a, b) => a - b)).toEqual(all);
        },
      ),
      { numRuns: 40 },
    );
  });
});

describe('units', () => {
  it('gives the denting in the plan’s unit', () => {
    // 12 dents per inch at 2 per dent = 24 epi = 24 / 2.54 ends per cm.
    const doc = planDocumentSchema.parse({ unit: 'cm', finishedWidth: 50, finishedLength: 150, sett: 24 / 2.54 });
    const out = computePlan(makeDraft(), doc);
    expect(out.denting.pattern).toEqual([2]);
    expect(out.denting.sett).toBeCloseTo(24 / 2.54, 10);
    expect(out.denting.difference).toBeCloseTo(0, 10);
  });
});
