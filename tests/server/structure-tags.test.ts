// The library's structure tags against a plain reading of the drawdown.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeDrawdown, createDraft, type Draft } from '../../shared/weave';
import { cropDraft, structureTags } from '../../server/services/draft-derived';

/**
 * Plain weave as weaving handbooks define it (from memory: every end goes over one pick and under the next, and each
 * pick does the opposite of the one before), read cell by cell over the same start of the cloth the
 * tags are judged on.
 */
function isPlainByCells(draft: Draft): boolean {
  const dd = computeDrawdown(cropDraft(draft, 256, 256));
  if (dd.ends < 2 || dd.picks < 2) return false;
  for (let p = 0; p < dd.picks; p++) {
    for (let e = 0; e < dd.ends; e++) {
      if (e + 1 < dd.ends && dd.isUp(e + 1, p) === dd.isUp(e, p)) return false;
      if (p + 1 < dd.picks && dd.isUp(e, p + 1) === dd.isUp(e, p)) return false;
    }
  }
  return true;
}

const shaftsOf = (mask: number) => [1, 2, 3, 4].filter((s) => mask & (1 << (s - 1)));

/** Plain weave on 4 shafts (two groups of shafts taking turns), then perhaps one end or pick changed. */
const nearlyPlain = fc.record({
  ends: fc.integer({ min: 1, max: 300 }),
  picks: fc.integer({ min: 1, max: 300 }),
  odd: fc.constantFrom(0b0101, 0b0001, 0b0100),
  spoil: fc.option(fc.record({ end: fc.boolean(), at: fc.nat(299), mask: fc.integer({ min: 1, max: 15 }) }), { nil: undefined }),
}).map(({ ends, picks, odd, spoil }) => {
  const even = 0b1010;
  const threading = Array.from({ length: ends }, (_, e) => [shaftsOf(e % 2 === 0 ? odd : even)[0]]);
  const liftplan = Array.from({ length: picks }, (_, p) => shaftsOf(p % 2 === 0 ? odd : even));
  if (spoil?.end && spoil.at < ends) threading[spoil.at] = [shaftsOf(spoil.mask)[0]];
  if (spoil && !spoil.end && spoil.at < picks) liftplan[spoil.at] = shaftsOf(spoil.mask);
  return createDraft({ shafts: 4, control: 'liftplan', threading, liftplan });
});

describe('structure tags', () => {
  it('call a draft plain weave exactly when its cells say so, including one spoilt end or pick', () => {
    let plain = 0;
    fc.assert(fc.property(nearlyPlain, (draft) => {
      const expected = isPlainByCells(draft);
      if (expected) plain += 1;
      expect(structureTags(draft).includes('plain weave')).toBe(expected);
    }), { numRuns: 400, seed: 1201 });
    // Both answers were really asked for.
    expect(plain).toBeGreaterThan(20);
    expect(plain).toBeLessThan(380);
  });
});
