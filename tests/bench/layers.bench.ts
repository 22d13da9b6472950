// Run: npx tsx tests/bench/layers.bench.ts
// Times simulateLayers on a 1024 × 1024 two-block-pattern double weave, with and without block links.
import { availableParallelism, loadavg } from 'node:os';
import { computeDrawdown } from '../../shared/weave/drawdown';
import { simulateLayers } from '../../shared/weave/layers';
import { expandProfile } from '../../shared/weave/profile';
import { timeRuns } from './timing';

const RUNS = 15;

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

function time(label: string, run: () => unknown, withDrawdown: boolean): void {
  const t = timeRuns(RUNS, run);
  const note = withDrawdown ? 'including computeDrawdown' : 'drawdown given';
  console.log(
    `${label} (${note}): median ${t.wall.toFixed(1)} ms wall, ${t.cpu.toFixed(1)} ms CPU over ${RUNS} runs ` +
      `(wall min ${t.wallMin.toFixed(1)}, max ${t.wallMax.toFixed(1)})`,
  );
}

console.log(`load average ${loadavg().map((l) => l.toFixed(1)).join(' ')} on ${availableParallelism()} cores`);
console.log(`double weave ${draft.threading.length} ends × ${draft.liftplan.length} picks, ${draft.shafts} shafts`);
const drawdown = computeDrawdown(draft);
time('simulateLayers, block areas', () => simulateLayers(draft), true);
time('simulateLayers, block areas', () => simulateLayers(draft, undefined, { drawdown }), false);
time('simulateLayers, 5 × 5 windows', () => simulateLayers(unlinked), true);
