// The cloth the drafts load test and its profile save, shared so both measure the same documents.
import { createDraft, type Draft } from '../../shared/weave';
import { seededRandom } from './seeded-random';

/** An 8-shaft, 8-treadle draft, 400 ends × 400 picks, four colours. */
export function bigDraft(seed: number): Draft {
  const next = seededRandom(seed);
  const pick = (n: number) => 1 + Math.floor(next() * n);
  return createDraft({
    name: `Load test ${seed}`,
    shafts: 8,
    treadles: 8,
    threading: Array.from({ length: 400 }, () => [pick(8)]),
    tieup: Array.from({ length: 8 }, (_, t) => [1 + t, 1 + ((t + 1) % 8), 1 + ((t + 3) % 8)].sort((x, y) => x - y)),
    treadling: Array.from({ length: 400 }, () => [pick(8)]),
    palette: ['#2d3a4a', '#e8dcc0', '#9c4a2f', '#5f7f5a'],
    warpColors: Array.from({ length: 400 }, () => pick(4) - 1),
    weftColors: Array.from({ length: 400 }, () => pick(4) - 1),
  });
}
