import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkThreading, quickChecks } from '../../../shared/weave/check-threading';
import { createDraft } from '../../../shared/weave/draft';
import type { Draft } from '../../../shared/weave/types';

const arbitraryThreadedDraft: fc.Arbitrary<Draft> = fc
  .record({ shafts: fc.integer({ min: 1, max: 8 }), ends: fc.integer({ min: 0, max: 40 }) })
  .chain(({ shafts, ends }) =>
    fc.record({
      shafts: fc.constant(shafts),
      threading: fc.array(fc.uniqueArray(fc.integer({ min: 1, max: shafts }), { maxLength: 2 }), { minLength: ends, maxLength: ends }),
      warpColors: fc.array(fc.integer({ min: 0, max: 2 }), { minLength: ends, maxLength: ends }),
      warpLayers: fc.oneof(fc.constant<number[]>([]), fc.array(fc.integer({ min: 1, max: 3 }), { minLength: ends, maxLength: ends })),
    }),
  )
  .map((parts) => createDraft({ ...parts, palette: ['#101820', '#f0e6d0', '#a04030'] }));

describe('checkThreading', () => {
  it('counts every end on each of its shafts by colour and by layer', () => {
    fc.assert(
      fc.property(arbitraryThreadedDraft, (draft) => {
        const check = checkThreading(draft);
        expect(check.shafts).toHaveLength(draft.shafts);
        for (const c of check.shafts) {
          const onIt = draft.threading.flatMap((shafts, e) => (shafts.includes(c.shaft) ? [e] : []));
          expect(c.ends).toEqual(onIt);
          for (const t of c.colors) expect(t.count).toBe(onIt.filter((e) => draft.warpColors[e] === t.value).length);
          for (const t of c.layers) expect(t.count).toBe(onIt.filter((e) => (draft.warpLayers[e] ?? 1) === t.value).length);
          expect(c.colors.reduce((n, t) => n + t.count, 0)).toBe(onIt.length);
          expect(c.layers.reduce((n, t) => n + t.count, 0)).toBe(onIt.length);
        }
      }),
      { numRuns: 150 },
    );
  }, 60_000);

  it('flags exactly the ends whose layer is not the majority layer of their shaft', () => {
    fc.assert(
      fc.property(arbitraryThreadedDraft, (draft) => {
        const layerOf = (e: number) => draft.warpLayers[e] ?? 1;
        const expected: string[] = [];
        for (let s = 1; s <= draft.shafts; s++) {
          const onIt = draft.threading.flatMap((shafts, e) => (shafts.includes(s) ? [e] : []));
          for (const layer of [1, 2, 3]) {
            if (onIt.filter((e) => layerOf(e) === layer).length * 2 <= onIt.length) continue;
            for (const e of onIt) if (layerOf(e) !== layer) expected.push(`${e}@${s}`);
          }
        }
        const got = checkThreading(draft).problems.filter((p) => p.kind === 'layer').map((p) => `${p.end}@${p.shaft}`);
        expect(got.sort()).toEqual(expected.sort());
      }),
      { numRuns: 150 },
    );
  }, 60_000);

  it('flags an odd colour on a one-colour shaft, but not colour stripes spread over shafts', () => {
    const oneOdd = createDraft({
      shafts: 2,
      threading: [[1], [2], [1], [2], [1], [2], [1], [2]],
      palette: ['#101820', '#f0e6d0'],
      warpColors: [0, 0, 0, 0, 0, 0, 1, 0],
    });
    expect(checkThreading(oneOdd).problems).toEqual([
      { kind: 'colour', end: 6, shaft: 1, message: 'End 7 is colour 2 on shaft 1, where the other ends are colour 1.' },
    ]);
    const stripes = createDraft({ ...oneOdd, warpColors: [0, 0, 1, 1, 0, 0, 1, 1] });
    expect(checkThreading(stripes).problems).toEqual([]);
    expect(quickChecks(stripes)[0].instruction).toBe('Raise shaft 1 alone: its 4 ends are mixed: 2 of colour 1, 2 of colour 2.');
  });

  it('writes a quick check for each shaft with ends, naming the odd ends 1-based', () => {
    const draft = createDraft({
      shafts: 3,
      threading: [[1], [2], [1], [2], [1], [1]],
      palette: ['#101820', '#f0e6d0'],
      warpColors: [0, 1, 0, 1, 1, 0],
    });
    const checks = quickChecks(draft);
    expect(checks.map((c) => c.shaft)).toEqual([1, 2]);
    expect(checks[0]).toMatchObject({ color: 0, oddEnds: [4] });
    expect(checks[0].instruction).toBe('Raise shaft 1 alone: all 4 ends on it should be colour 1. As drawn, end 5 will not be.');
    expect(checks[1].instruction).toBe('Raise shaft 2 alone: both ends on it should be colour 2.');
  });

  it('names colours by the yarn shown in them, never by hex code', () => {
    const draft = createDraft({
      shafts: 2,
      threading: [[1], [2], [1], [2], [1], [2], [1], [2]],
      palette: ['#101820', '#f0e6d0'],
      warpColors: [0, 0, 0, 0, 0, 0, 1, 0],
      yarns: [{ id: 'dark', name: 'Dark wool', color: 0 }],
    });
    expect(checkThreading(draft).problems[0].message).toBe('End 7 is colour 2 on shaft 1, where the other ends are Dark wool.');
    expect(quickChecks(draft)[1].instruction).toBe('Raise shaft 2 alone: all 4 ends on it should be Dark wool.');
    for (const text of [...checkThreading(draft).problems.map((p) => p.message), ...quickChecks(draft).map((q) => q.instruction)]) expect(text).not.toMatch(/#/);
  });
});
