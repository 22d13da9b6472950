import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultPlan } from '../../../shared/plan/plan-schema';
import { afterStep, BREAK_AFTER_MS, BREAK_AFTER_STEPS, breakDue, REST_GAP_MS, restedActivity } from '../../../src/features/loom/break-reminder';
import { endRange, loomOutputs, pickAt, stepCount, threadingGroupCheck } from '../../../src/features/loom/loom-steps';
import { newerPlace } from '../../../src/features/loom/use-place';
import { twoLayerDraft } from '../plan/fixtures';

const draft = twoLayerDraft();
const plan = { ...defaultPlan('inch'), sett: 24, layers: 2 };
const order = fc.record({
  side: fc.constantFrom('front' as const, 'back' as const),
  direction: fc.constantFrom('right-to-left' as const, 'left-to-right' as const),
  shaftNumbering: fc.constantFrom('near' as const, 'far' as const),
});

describe('pickAt', () => {
  it('walks every pick of the cloth through the draft in order, repeat by repeat', () => {
    const out = loomOutputs(draft, plan, { side: 'front', direction: 'right-to-left', shaftNumbering: 'near' });
    const total = stepCount(out, 'weaving');
    fc.assert(
      fc.property(fc.nat({ max: total - 1 }), (i) => {
        const step = pickAt(out.weaving, total, i)!;
        expect(step.pick).toBe(i + 1);
        expect((step.repeat - 1) * 4 + step.pickInDraft).toBe(i + 1);
        expect(step.row.fromPick <= step.pickInDraft && step.pickInDraft <= step.row.toPick).toBe(true);
      }),
    );
    expect(pickAt(out.weaving, total, total)).toBeNull();
    expect(pickAt(out.weaving, total, -1)).toBeNull();
  });
});

describe('threadingGroupCheck', () => {
  it('for any working order, names each shaft the group used, with the colour every end on it shows', () => {
    fc.assert(
      fc.property(order, fc.nat({ max: 12 }), (o, g) => {
        const out = loomOutputs(draft, plan, o);
        const group = out.threading[g];
        const checks = threadingGroupCheck(draft, group, o);
        expect(checks.flatMap((c) => c.ends).sort((a, b) => a - b)).toEqual(group.items.map((s) => s.end).sort((a, b) => a - b));
        for (const c of checks) {
          // The draft is threaded cleanly, so nothing is odd and every end on the shaft has its colour.
          expect(c.odd).toEqual([]);
          for (const e of c.ends) expect(group.items.find((s) => s.end === e)!.color).toBe(c.color);
        }
      }),
    );
  });
});

describe('endRange', () => {
  it('writes runs as a range either way round, and anything else as a list', () => {
    expect(endRange([1, 2, 3])).toBe('1–3');
    expect(endRange([296, 295, 294])).toBe('296–294');
    expect(endRange([1, 3])).toBe('1, 3');
    expect(endRange([7])).toBe('7');
  });
});

describe('break reminder', () => {
  it('comes after half an hour of steady work or many steps, and a long pause counts as a rest', () => {
    fc.assert(
      fc.property(fc.array(fc.nat({ max: REST_GAP_MS * 2 }), { maxLength: 80 }), (gaps) => {
        let a = restedActivity;
        let t = 0;
        let sinceRest = 0;
        let steps = 0;
        for (const gap of gaps) {
          t += gap;
          const rest = a.lastAt === null || gap >= REST_GAP_MS;
          sinceRest = rest ? 0 : sinceRest + gap;
          steps = rest ? 1 : steps + 1;
          a = afterStep(a, t);
          expect(a.activeMs).toBe(sinceRest);
          expect(breakDue(a)).toBe(sinceRest >= BREAK_AFTER_MS || steps >= BREAK_AFTER_STEPS);
        }
      }),
    );
  });
});

describe('newerPlace', () => {
  it('keeps the place moved last', () => {
    const at = (iso: string, position: number) => ({ list: 'threading' as const, positions: { threading: position }, settings: { side: 'front' as const, direction: 'right-to-left' as const, shaftNumbering: 'near' as const }, movedAt: iso });
    const old = at('2025-01-01T00:00:00Z', 3);
    const recent = at('2025-01-02T00:00:00Z', 9);
    expect(newerPlace(old, recent)).toBe(recent);
    expect(newerPlace(recent, old)).toBe(recent);
    expect(newerPlace(undefined, old)).toBe(old);
    expect(newerPlace(null, null)).toBeNull();
  });
});
