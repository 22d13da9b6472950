import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computePlan } from '../../../shared/plan/compute-plan';
import { defaultPlan } from '../../../shared/plan/plan-schema';
import { convertPlanUnit, initialPlan, measuredChoice, mentionsWetWork, parseDenting } from '../../../src/features/plan/plan-form';
import { twoLayerDraft } from './fixtures';

describe('convertPlanUnit', () => {
  const plan = fc.record({
    finishedWidth: fc.double({ min: 1, max: 120, noNaN: true }),
    finishedLength: fc.double({ min: 1, max: 400, noNaN: true }),
    hems: fc.double({ min: 0, max: 10, noNaN: true }),
    sett: fc.option(fc.double({ min: 4, max: 80, noNaN: true }), { nil: undefined }),
    unit: fc.constantFrom('inch' as const, 'cm' as const),
  });

  it('goes there and back to the same plan', () => {
    fc.assert(
      fc.property(plan, (p) => {
        const doc = { ...defaultPlan(p.unit), ...p };
        const back = convertPlanUnit(convertPlanUnit(doc, p.unit === 'inch' ? 'cm' : 'inch'), p.unit);
        expect(back.unit).toBe(doc.unit);
        for (const key of ['finishedWidth', 'finishedLength', 'hems'] as const) expect(back[key]).toBeCloseTo(doc[key], 9);
        if (doc.sett === undefined) expect(back.sett).toBeUndefined();
        else expect(back.sett!).toBeCloseTo(doc.sett, 9);
      }),
    );
  });

  it('describes the same cloth: the same ends and the same warp in metres', () => {
    const draft = twoLayerDraft();
    fc.assert(
      fc.property(plan, (p) => {
        const doc = { ...defaultPlan(p.unit), ...p };
        const a = computePlan(draft, doc).warp;
        const b = computePlan(draft, convertPlanUnit(doc, p.unit === 'inch' ? 'cm' : 'inch')).warp;
        expect(b.ends.totalEnds).toBe(a.ends.totalEnds);
        expect(b.warpByColor.map((c) => c.metres)).toEqual(a.warpByColor.map((c) => expect.closeTo(c.metres, 6)));
      }),
    );
  });

  it('2.54 cm to the inch (exact by definition)', () => {
    expect(convertPlanUnit({ ...defaultPlan('inch'), finishedWidth: 10 }, 'cm').finishedWidth).toBeCloseTo(25.4, 12);
  });
});

describe('parseDenting', () => {
  it('reads the trade notation', () => {
    expect(parseDenting('2-2-1')).toEqual({ ok: true, pattern: [2, 2, 1] });
    expect(parseDenting(' 1 - 0 ')).toEqual({ ok: true, pattern: [1, 0] });
    expect(parseDenting('')).toEqual({ ok: true, pattern: undefined });
    expect(parseDenting('0-0').ok).toBe(false);
    expect(parseDenting('2,2').ok).toBe(false);
  });

  it('reads back what it would write', () => {
    fc.assert(
      fc.property(fc.array(fc.nat({ max: 6 }), { minLength: 1, maxLength: 6 }).filter((p) => p.some((n) => n > 0)), (p) => {
        expect(parseDenting(p.join('-'))).toEqual({ ok: true, pattern: p });
      }),
    );
  });
});

describe('cautions and defaults', () => {
  it('spots dyeing and wet finishing in notes, not other words', () => {
    expect(mentionsWetWork('Wet-finish in hot water')).toBe(true);
    expect(mentionsWetWork('', 'Dyed with madder')).toBe(true);
    expect(mentionsWetWork('Full the cloth: fulling by hand')).toBe(true);
    expect(mentionsWetWork('A tidy reed plan', 'Wonderful colours')).toBe(false);
  });

  it('starts a plan for a two-layer draft with two layers and the layer rule', () => {
    const plan = initialPlan(null, twoLayerDraft());
    expect(plan.layers).toBe(2);
    expect(plan.lists.layerRule).toBe(true);
    expect(plan.unit).toBe('inch');
  });

  it('prefers results with the same yarns, else all results', () => {
    const plan = { ...defaultPlan(), warpYarn: { text: '8/2 Cotton', byColor: {} }, weftYarn: { text: '8/2 cotton', byColor: {} } };
    const defaults = {
      overall: { allowances: { takeUp: 0.2 }, results: 4 },
      byYarn: [{ key: '8/2 cotton|8/2 cotton', warpYarn: '8/2 cotton', weftYarn: '8/2 cotton', allowances: { takeUp: 0.06 }, results: 1 }],
    };
    expect(measuredChoice(defaults, plan)).toEqual({ allowances: { takeUp: 0.06 }, results: 1, sameYarns: true });
    expect(measuredChoice(defaults, defaultPlan())).toEqual({ allowances: { takeUp: 0.2 }, results: 4, sameYarns: false });
    expect(measuredChoice({ overall: null, byYarn: [] }, plan)).toBeNull();
  });
});
