// Check values come from the published sources named beside each one (a standard, a book or an article);
// a fact of the trade with no published source says "common practice".
// (the standards and articles themselves were not re-read for these tests).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  centredFirstDent,
  dentingLabel,
  dentsPerInch,
  evenDenting,
  planDenting,
  settFromDenting,
  sleyingList,
} from '../../../shared/plan/reed';

const twelve = { dents: 12, per: 'inch' } as const;

describe('denting for a sett', () => {
  // Source: common practice / weaving education articles on reed substitution.
  it('24 epi in a 12-dent reed is 2 per dent', () => {
    const plan = planDenting(24, twelve);
    expect(plan.pattern).toEqual([2]);
    expect(plan.sett).toBe(24);
  });

  it('20 epi in a 12-dent reed is 2-2-1', () => {
    const plan = planDenting(20, twelve);
    expect(dentingLabel(plan.pattern)).toBe('2-2-1');
    expect(plan.sett).toBeCloseTo(20, 12);
  });

  it('16 epi in a 12-dent reed is 2-1-1', () => {
    expect(dentingLabel(planDenting(16, twelve).pattern)).toBe('2-1-1');
  });

  it('30 epi in a 12-dent reed alternates 3 and 2', () => {
    expect(planDenting(30, twelve).pattern).toEqual([3, 2]);
    expect(settFromDenting(twelve, [2, 3, 2, 3])).toBe(30);
  });

  it('skips dents for a sett below the reed', () => {
    expect(planDenting(6, twelve).pattern).toEqual([1, 0]);
  });

  it('reports the sett it really gives when no short pattern is exact', () => {
    const plan = planDenting(18.5, twelve, 4);
    expect(plan.sett).toBeCloseTo(settFromDenting(twelve, plan.pattern), 12);
    expect(plan.difference).toBeCloseTo(plan.sett - 18.5, 12);
    expect(Math.abs(plan.difference)).toBeLessThanOrEqual(1.5);
  });

  it('converts metric reeds', () => {
    // 1 inch = 2.54 cm exactly.
    expect(dentsPerInch({ dents: 50, per: '10cm' })).toBeCloseTo(12.7, 12);
    expect(dentsPerInch({ dents: 5, per: 'cm' })).toBeCloseTo(12.7, 12);
  });

  it('centres the warp in the reed', () => {
    expect(centredFirstDent(480, 100)).toBe(191);
  });
});

describe('denting properties', () => {
  it('an even denting holds exactly the ends, each dent within one of the others', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 1, max: 12 }), (ends, dents) => {
        const p = evenDenting(ends, dents);
        expect(p.length).toBe(dents);
        expect(p.reduce((a, b) => a + b, 0)).toBe(ends);
        expect(Math.max(...p) - Math.min(...p)).toBeLessThanOrEqual(1);
      }),
    );
  });

  it('the planned denting is at least as close as any shorter exact ratio', () => {
    fc.assert(
      fc.property(fc.double({ min: 4, max: 80, noNaN: true }), fc.integer({ min: 6, max: 20 }), (sett, dpi) => {
        const reed = { dents: dpi, per: 'inch' as const };
        const plan = planDenting(sett, reed, 4);
        for (let dents = 1; dents <= 4; dents++) {
          for (let ends = 1; ends <= 4 * dents * 14; ends++) {
            expect(Math.abs(plan.difference)).toBeLessThanOrEqual(Math.abs((ends / dents) * dpi - sett) + 1e-9);
          }
        }
      }),
      { numRuns: 50 },
    );
  });
});

describe('sleying list', () => {
  it('lists 2-2-1 dents in order', () => {
    const dents = sleyingList([1, 2, 3, 4, 5, 6, 7], [2, 2, 1]);
    expect(dents.map((d) => d.ends)).toEqual([[1, 2], [3, 4], [5], [6, 7]]);
    expect(dents.map((d) => d.dent)).toEqual([1, 2, 3, 4]);
  });

  it('keeps two layers apart, one end of each per dent', () => {
    const ends = [1, 2, 3, 4, 5, 6];
    const dents = sleyingList(ends, [2], { layers: [1, 1, 2, 2, 1, 2] });
    expect(dents.map((d) => d.ends)).toEqual([[1], [2, 3], [4, 5], [6]]);
  });

  it('follows the chosen layer order and flips it', () => {
    const ends = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
    const layers = [1, 2, 1, 2, 1, 2, 1, 2, 1, 2];
    expect(sleyingList(ends, [2], { layers, layerOrder: [2, 1] }).map((d) => d.ends)[0]).toEqual([1]);
    const flipping = sleyingList(ends, [2], { layers, layerOrder: [1, 2], flipEvery: 2 });
    expect(flipping.map((d) => d.ends)).toEqual([[1, 2], [3, 4], [5], [6, 7], [8], [9, 10]]);
  });

  it('rejects a pattern with no ends', () => {
    expect(() => sleyingList([1], [0, 0])).toThrow();
  });

  const layered = fc
    .record({
      layers: fc.array(fc.integer({ min: 1, max: 3 }), { minLength: 0, maxLength: 60 }),
      pattern: fc.array(fc.integer({ min: 0, max: 4 }), { minLength: 1, maxLength: 5 }).filter((p) => p.some((n) => n > 0)),
      order: fc.constantFrom(undefined, [1, 2], [2, 1], [1, 2, 3], [3, 1]),
      flipEvery: fc.option(fc.integer({ min: 1, max: 4 }), { nil: undefined }),
      useLayers: fc.boolean(),
    })
    .map((r) => ({ ...r, ends: r.layers.map((_, i) => i + 1) }));

  it('covers every end exactly once, in order, within each dent’s planned count', () => {
    fc.assert(
      fc.property(layered, ({ ends, layers, pattern, order, flipEvery, useLayers }) => {
        const dents = sleyingList(ends, pattern, useLayers ? { layers, layerOrder: order, flipEvery } : {});
        expect(dents.flatMap((d) => d.ends)).toEqual(ends);
        dents.forEach((d, i) => {
          expect(d.planned).toBe(pattern[i % pattern.length]);
          expect(d.ends.length).toBeLessThanOrEqual(d.planned);
          if (!useLayers) expect(d.ends.length === d.planned || i === dents.length - 1).toBe(true);
        });
      }),
    );
  });

  it('never puts two ends of one layer in a dent under the layer rule', () => {
    fc.assert(
      fc.property(layered, ({ ends, layers, pattern, order, flipEvery }) => {
        for (const d of sleyingList(ends, pattern, { layers, layerOrder: order, flipEvery })) {
          const inDent = d.ends.map((e) => layers[e - 1]);
          expect(new Set(inDent).size).toBe(inDent.length);
        }
      }),
    );
  });
});
