// Run: npx tsx tests/bench/layers.bench.ts
// Times simulateLayers on a 1024 × 1024 two-block-pattern double weave, with and without block links.
import { availableParallelism, loadavg } from 'node:os';
import { computeDrawdown } from '../../shared/weave/drawdown';
import { simulateLayers } from '../../shared/weave/layers';
import { expandProfile } from '../../shared/weave/profile';

const RUNS = 15;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

// 256 profile columns and rows of 4-end, 4-pick units over 8 blocks (32 shafts): 1024 × 1024 cells.
const draft = expandProfile(
  {
    threading: Array.from({ length: 256 }, (_, i) => (Math.floor(i / 4) % 8) + 1),
    treadling: Array.from({ length: 256 }, (_, r) => [1, 2, 3, 4, 5, 6, 7, 8].filter((b) => (b + Math.floor(r / 4)) % 3 === 0)),
    palette: ['#2b2b33', '#f3efe6', '#b5523b'],
    warpColors: [[0], [1, 2]],
    weftColors: [[0], [1, 2]],
  },
  'double-weave',
);
const unlinked = { ...draft, blocks: undefined };

// CPU time is printed beside wall time because a busy machine stretches wall time, not CPU time.
function time(label: string, run: () => unknown, withDrawdown: boolean): void {
  run(); // warm up the JIT
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    run();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  const note = withDrawdown ? 'including computeDrawdown' : 'drawdown given';
  console.log(
    `${label} (${note}): median ${median(wall).toFixed(1)} ms wall, ${median(cpu).toFixed(1)} ms CPU over ${RUNS} runs ` +
      `(wall min ${Math.min(...wall).toFixed(1)}, max ${Math.max(...wall).toFixed(1)})`,
  );
}

console.log(`load average ${loadavg().map((l) => l.toFixed(1)).join(' ')} on ${availableParallelism()} cores`);
console.log(`double weave ${draft.threading.length} ends × ${draft.liftplan.length} picks, ${draft.shafts} shafts`);
const drawdown = computeDrawdown(draft);
time('simulateLayers, block areas', () => simulateLayers(draft), true);
time('simulateLayers, block areas', () => simulateLayers(draft, undefined, { drawdown }), false);
time('simulateLayers, 5 × 5 windows', () => simulateLayers(unlinked), true);
