import { createDraft, type Draft } from '../../shared/weave';

/** Invented colours and yarn names for print tests. */
export const HARBOUR = '#1b4f8a';
export const MUSTARD = '#e8c547';

/**
 * Plain weave on two shafts with a blue warp and a yellow weft: its colour drawdown is a
 * checkerboard, blue where (end + pick) is even. Source: plain weave is a checkerboard
 * (Watson, Textile Design and Colour, 1907).
 */
export function checkerboard(ends: number, picks: number, overrides: Partial<Draft> = {}): Draft {
  return createDraft({
    name: 'Checkerboard',
    shafts: 2,
    treadles: 2,
    threading: Array.from({ length: ends }, (_, i) => [(i % 2) + 1]),
    tieup: [[1], [2]],
    treadling: Array.from({ length: picks }, (_, i) => [(i % 2) + 1]),
    palette: [HARBOUR, MUSTARD],
    warpColors: Array.from({ length: ends }, () => 0),
    weftColors: Array.from({ length: picks }, () => 1),
    yarns: [
      { id: 'w', name: 'Harbour blue 8/2 cotton', color: 0 },
      { id: 'f', name: 'Mustard 8/2 cotton', color: 1 },
    ],
    ...overrides,
  });
}

/** An invented 8-shaft point twill with colour stripes every 40 ends and picks, `n` ends and picks: the big print of the benchmark. */
export function bigPointTwill(n: number): Draft {
  const point = [1, 2, 3, 4, 5, 6, 7, 8, 7, 6, 5, 4, 3, 2];
  return createDraft({
    name: 'Big point twill',
    shafts: 8,
    treadles: 8,
    threading: Array.from({ length: n }, (_, i) => [point[i % point.length]]),
    // 2/2/1/3 style twill tie-up: each treadle lifts a run of shafts stepping by one.
    tieup: Array.from({ length: 8 }, (_, t) => [0, 1, 3, 4].map((k) => ((t + k) % 8) + 1)),
    treadling: Array.from({ length: n }, (_, i) => [point[i % point.length]]),
    palette: ['#2d3a5c', '#e9e2cf', '#a6452f'],
    warpColors: Array.from({ length: n }, (_, i) => (Math.floor(i / 40) % 2 === 0 ? 0 : 2)),
    weftColors: Array.from({ length: n }, (_, i) => (Math.floor(i / 40) % 2 === 0 ? 1 : 0)),
    yarns: [
      { id: 'a', name: 'Slate 8/2 cotton', color: 0 },
      { id: 'b', name: 'Linen white 16/2', color: 1 },
      { id: 'c', name: 'Brick 8/2 cotton', color: 2 },
    ],
  });
}

/**
 * The outside probe's draft: `ends` × `picks` on 32 shafts with a lift plan raising every other
 * shaft, stepping by one each pick. At 20 000 × 20 000 its WIF is about 1.3 MB, under the upload limit.
 */
export function probeLiftPlan(ends = 20_000, picks = 20_000): Draft {
  const shafts = 32;
  return createDraft({
    name: 'Probe lift plan',
    shafts,
    treadles: shafts,
    control: 'liftplan',
    threading: Array.from({ length: ends }, (_, i) => [(i % shafts) + 1]),
    liftplan: Array.from({ length: picks }, (_, i) => Array.from({ length: shafts / 2 }, (_, k) => ((i + 2 * k) % shafts) + 1)),
    palette: [HARBOUR, MUSTARD],
    warpColors: Array.from({ length: ends }, () => 0),
    weftColors: Array.from({ length: picks }, () => 1),
  });
}
