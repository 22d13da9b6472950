import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeDrawdown } from '../../../shared/weave/drawdown';
import { createDraft } from '../../../shared/weave/draft';
import { findFloats } from '../../../shared/weave/floats';
import { asLists, repeat, straightDraw, twillTieup } from '../../../shared/weave/sequences';
import type { Draft } from '../../../shared/weave/types';
import { draftArb } from './arbitraries';

/** Straightforward reference: every maximal run along each thread, same layer only, no wrapping. */
function allRuns(draft: Draft): { kind: 'warp' | 'weft'; thread: number; length: number; layer: number }[] {
  const dd = computeDrawdown(draft);
  const layerOfEnd = (e: number) => draft.warpLayers[e] ?? 1;
  const layerOfPick = (p: number) => draft.weftLayers[p] ?? 1;
  const runs: { kind: 'warp' | 'weft'; thread: number; length: number; layer: number }[] = [];
  const walk = (kind: 'warp' | 'weft', thread: number, layer: number, values: boolean[]) => {
    let length = 0;
    values.forEach((v, i) => {
      length = i > 0 && v === values[i - 1] ? length + 1 : 1;
      if (i === values.length - 1 || values[i + 1] !== v) runs.push({ kind, thread, length, layer });
    });
  };
  for (let e = 0; e < dd.ends; e++) {
    const picks = [...Array(dd.picks).keys()].filter((p) => layerOfPick(p) === layerOfEnd(e));
    walk('warp', e, layerOfEnd(e), picks.map((p) => dd.isUp(e, p)));
  }
  for (let p = 0; p < dd.picks; p++) {
    const ends = [...Array(dd.ends).keys()].filter((e) => layerOfEnd(e) === layerOfPick(p));
    walk('weft', p, layerOfPick(p), ends.map((e) => dd.isUp(e, p)));
  }
  return runs;
}

const longest = (runs: { length: number }[]) => runs.reduce((m, r) => Math.max(m, r.length), 0);

describe('findFloats', () => {
  it('finds the longest warp and weft floats, per layer and overall, and every float over the limit', () => {
    fc.assert(
      fc.property(draftArb({ maxEnds: 24, maxPicks: 24 }), fc.integer({ min: 1, max: 6 }), (draft, limit) => {
        const report = findFloats(draft, { limit });
        const runs = allRuns(draft);
        expect(report.warp?.length ?? 0).toBe(longest(runs.filter((r) => r.kind === 'warp')));
        expect(report.weft?.length ?? 0).toBe(longest(runs.filter((r) => r.kind === 'weft')));
        for (const l of report.layers) {
          expect(l.warp?.length ?? 0).toBe(longest(runs.filter((r) => r.kind === 'warp' && r.layer === l.layer)));
          expect(l.weft?.length ?? 0).toBe(longest(runs.filter((r) => r.kind === 'weft' && r.layer === l.layer)));
        }
        expect(report.overLimit.map((f) => [f.kind, f.thread, f.length])).toEqual(
          runs.filter((r) => r.length > limit).map((r) => [r.kind, r.thread, r.length]),
        );
      }),
    );
  });

  it('reports where a float lies and on which side', () => {
    // Picks lift shaft 1, 1, 2, 1, 1, 1: end 1 (shaft 1) is up on picks 4–6 (0-based 3–5), the first
    // float of 3; end 2 is down there, equally long but found later.
    const d = createDraft({ shafts: 2, threading: [[1], [2]], control: 'liftplan', liftplan: [[1], [1], [2], [1], [1], [1]] });
    const { warp } = findFloats(d);
    expect(warp).toEqual({ kind: 'warp', thread: 0, start: 3, last: 5, length: 3, side: 'over', layer: 1 });
    // Treated as a repeat, that float over picks 4–6 joins picks 1–2 of the next repeat.
    expect(findFloats(d, { wrap: true }).warp).toEqual({ kind: 'warp', thread: 0, start: 3, last: 1, length: 5, side: 'over', layer: 1 });
    expect(findFloats(d, { limit: 2 }).overLimit.map((f) => [f.kind, f.thread, f.side, f.length])).toEqual([
      ['warp', 0, 'over', 3],
      ['warp', 1, 'under', 3],
    ]);
  });

  it('finds floats of 1 in plain weave and 2 in 2/2 twill', () => {
    // Source: plain weave interlaces every crossing; 2/2 twill passes over two, under two [pub, textbook definitions].
    const plain = createDraft({ shafts: 2, treadles: 2, threading: asLists(repeat([1, 2], 4)), tieup: [[1], [2]], treadling: asLists(repeat([1, 2], 4)) });
    const plainReport = findFloats(plain, { limit: 1, wrap: true });
    expect([plainReport.warp?.length, plainReport.weft?.length, plainReport.overLimit]).toEqual([1, 1, []]);
    const twill = createDraft({ shafts: 4, treadles: 4, threading: asLists(straightDraw(4, 2)), tieup: twillTieup([2, 2]), treadling: asLists(straightDraw(4, 2)) });
    const twillReport = findFloats(twill, { wrap: true });
    expect([twillReport.warp?.length, twillReport.weft?.length]).toEqual([2, 2]);
  });

  it('measures a layer-1 end only across layer-1 picks', () => {
    // Double weave on 4 shafts (books on loom-controlled double weave [pub]): shafts 1–2 top layer,
    // 3–4 bottom; top picks lift 1 or 2; bottom picks lift both top shafts plus 3 or 4.
    const d = createDraft({
      shafts: 4,
      threading: asLists(repeat([1, 3, 2, 4], 2)),
      warpLayers: repeat([1, 2, 1, 2], 2),
      control: 'liftplan',
      liftplan: repeat([[1], [1, 2, 3], [2], [1, 2, 4]], 2),
      weftLayers: repeat([1, 2, 1, 2], 2),
    });
    const r = findFloats(d, { limit: 1 });
    // Within each layer the cloth is plain weave, so no float is longer than 1 crossing …
    expect(r.layers.map((l) => [l.layer, l.warp?.length, l.weft?.length])).toEqual([[1, 1, 1], [2, 1, 1]]);
    expect(r.overLimit).toEqual([]);
    // … although a top end, counted across all picks, stays up over 3 picks in a row.
    expect(computeDrawdown(d).isUp(0, 0) && computeDrawdown(d).isUp(0, 1) && !computeDrawdown(d).isUp(0, 2)).toBe(true);
  });
});
