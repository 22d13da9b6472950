// The cloth-view benchmark's page (tests/bench/cloth.bench.ts): the editor's real cloth worker,
// timed from postMessage to its answer, and the thread and flat-cell renderers on the page's thread.
import { threadSizesFor } from '../../../shared/plan/thread-sizes';
import { computeDrawdown } from '../../../shared/weave/drawdown';
import { simulateLayers } from '../../../shared/weave/layers';
import { renderCells } from '../../../shared/weave/picture';
import { renderThreads } from '../../../shared/weave/threads';
import type { ClothRequest, ClothResult } from '../../../src/features/editor/canvas/cloth-work';
import { benchDraft, CLOTH_BENCH_CASES } from '../cloth-drafts';
import { paintFaceCells } from './flat-cells';

/** One line of the benchmark's figures (milliseconds, medians). */
export interface BenchRow {
  label: string;
  face: 'colour' | 'front';
  goal: number;
  width: number;
  height: number;
  /** A new window of a draft the worker holds: the picture only. */
  view: number;
  /** A draft the worker has not seen: drawdown, layers, sizes and Checks too. */
  newDraft: number;
  threads: number;
  flat: number;
  /** The same as CPU time, where it can be measured (Node). */
  cpu?: { view: number; newDraft: number; threads: number; flat: number };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function timed(runs: number, run: () => unknown): Promise<number> {
  await run();
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await run();
    out.push(performance.now() - t0);
  }
  return median(out);
}

async function runClothBench(runs: number): Promise<BenchRow[]> {
  const worker = new Worker(new URL('../../../src/features/editor/canvas/cloth.worker.ts', import.meta.url), { type: 'module' });
  let id = 0;
  const ask = (request: Omit<ClothRequest, 'id'>) =>
    new Promise<ClothResult>((resolve) => {
      const mine = ++id;
      worker.onmessage = (e: MessageEvent<ClothResult>) => {
        if (e.data.id === mine) resolve(e.data);
      };
      worker.postMessage({ ...request, id: mine });
    });
  const rows: BenchRow[] = [];
  let revision = 0;
  for (const c of CLOTH_BENCH_CASES) {
    const draft = benchDraft(c.ends, c.picks);
    const drawdown = computeDrawdown(draft);
    const layers = simulateLayers(draft, undefined, { drawdown });
    const sizes = threadSizesFor(draft);
    for (const face of ['colour', 'front'] as const) {
      const threadsPic = () => renderThreads({ draft, drawdown, layers: face === 'colour' ? undefined : layers, sizes }, { face, pixelsPerInch: c.zoom * sizes.endsPerInch });
      const { width, height } = threadsPic();
      const cells = paintFaceCells(draft, drawdown, face === 'colour' ? null : layers);
      const flat = () => renderCells(cells, c.ends, c.picks, { cellSize: c.zoom, window: { x: 0, y: 0, width, height } });
      const request = (rev: number, x: number) => ({ draft, revision: rev, views: [face], floatLimit: 7, tiles: 1, frames: { [face]: { zoom: c.zoom, x, y: 0, width, height } } });
      const check = await ask(request(++revision, 0));
      const got = check.pictures[face];
      if (!got || got.width !== width || got.height !== height) throw new Error(`the worker drew ${got?.width} × ${got?.height}, not ${width} × ${height}`);
      const newDraft = await timed(runs, () => ask(request(++revision, 0)));
      const view = await timed(runs, () => ask(request(revision, id % 2)));
      rows.push({ label: c.label, face, goal: c.goal, width, height, view, newDraft, threads: await timed(runs, threadsPic), flat: await timed(runs, flat) });
    }
  }
  worker.terminate();
  return rows;
}

(window as unknown as { runClothBench: typeof runClothBench }).runClothBench = runClothBench;
