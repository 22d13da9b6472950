import { createDraft, type Draft } from '../../shared/weave';

/** Invented colours and yarn names for print tests. */
export const HARBOUR = '#1b4f8a';
export const MUSTARD = '#e8c547';

/**
 * Plain weave on two shafts with a blue warp and a yellow weft: its colour drawdown is a
 * checkerboard, blue where (end + pick) is even. Source: plain weave is a checkerboard
 * (Watson, Textile Design and Colour, 1907; REFERENCES.md).
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
