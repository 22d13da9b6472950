/*
 * Engine benchmark: `npm run bench`.
 * Targets: computeDrawdown on 4096 ends × 4096 picks × 32 shafts in ≤ 25 ms (median), and
 * ≥ 20× faster than the mathjs matrix product on the same 1024 × 1024 draft.
 */
import { computeDrawdown } from '../../shared/weave/drawdown';
import { createDraft } from '../../shared/weave/draft';
import type { Draft } from '../../shared/weave/types';
import { mathjsDrawdown } from '../shared/weave/reference';
import { seededRandom } from './seeded-random';

function randomSubset(next: () => number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => i + 1).filter(() => next() < 0.5);
}

/**
 * A 32-shaft draft with every end on a random shaft. As a lift plan, every pick lifts a random half
 * of the shafts (so almost no two picks share a lift: the worst case); with treadles, 32 treadles
 * tied at random and one or two pressed per pick.
 */
function benchDraft(ends: number, picks: number, control: Draft['control'], seed: number): Draft {
  const next = seededRandom(seed);
  const shafts = 32;
  const threading = Array.from({ length: ends }, () => [1 + Math.floor(next() * shafts)]);
  if (control === 'liftplan') {
    return createDraft({ shafts, threading, control, liftplan: Array.from({ length: picks }, () => randomSubset(next, shafts)) });
  }
  const tieup = Array.from({ length: 32 }, () => randomSubset(next, shafts));
  const treadling = Array.from({ length: picks }, () => {
    const a = 1 + Math.floor(next() * 32);
    const b = 1 + Math.floor(next() * 32);
    return a === b ? [a] : [Math.min(a, b), Math.max(a, b)];
  });
  return createDraft({ shafts, treadles: 32, threading, tieup, treadling, control });
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

function time(run: () => unknown, runs: number, warmup = 10): number[] {
  for (let i = 0; i < warmup; i++) run();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    run();
    times.push(performance.now() - t0);
  }
  return times;
}

const ms = (n: number) => `${n.toFixed(2)} ms`;
let failed = false;

for (const control of ['liftplan', 'treadling'] as const) {
  const draft = benchDraft(4096, 4096, control, 42);
  const times = time(() => computeDrawdown(draft), 31);
  const m = median(times);
  const ok = m <= 25;
  failed ||= !ok;
  console.log(
    `computeDrawdown 4096 ends × 4096 picks × 32 shafts (${control}): median ${ms(m)} of ${times.length} runs ` +
      `(min ${ms(Math.min(...times))}, max ${ms(Math.max(...times))}); target ≤ 25 ms: ${ok ? 'met' : 'NOT met'}`,
  );
}

{
  const draft = benchDraft(1024, 1024, 'treadling', 7);
  const engine = median(time(() => computeDrawdown(draft), 31));
  const reference = median(time(() => mathjsDrawdown(draft), 3, 1));
  const ratio = reference / engine;
  const ok = ratio >= 20;
  failed ||= !ok;
  console.log(
    `1024 × 1024 × 32 shafts, 32 treadles: computeDrawdown ${ms(engine)}, mathjs matrix product ${ms(reference)}; ` +
      `${ratio.toFixed(0)}× faster; target ≥ 20×: ${ok ? 'met' : 'NOT met'}`,
  );
}

if (failed) process.exitCode = 1;
