// The cloth-view benchmark's page (tests/bench/cloth.bench.ts): the editor's real cloth worker,
// timed from postMessage to its answer, and the thread and flat-cell renderers on the page's thread.
import type { ClothRequest, ClothResult } from '../../../src/features/editor/canvas/cloth-work';
import { benchViews } from '../cloth-drafts';

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
  const ask = (request: ClothRequest) =>
    new Promise<ClothResult>((resolve) => {
      const mine = ++id;
      worker.onmessage = (e: MessageEvent<ClothResult>) => {
        if (e.data.id === mine) resolve(e.data);
      };
      worker.postMessage({ ...request, id: mine });
    });
  const rows: BenchRow[] = [];
  let revision = 0;
  for (const v of benchViews()) {
    const got = (await ask(v.request(0, ++revision, 0))).pictures[v.face];
    if (!got || got.width !== v.width || got.height !== v.height) throw new Error(`the worker drew ${got?.width} × ${got?.height}, not ${v.width} × ${v.height}`);
    const newDraft = await timed(runs, () => ask(v.request(0, ++revision, 0)));
    const view = await timed(runs, () => ask(v.request(0, revision, id % 2)));
    rows.push({ label: v.case.label, face: v.face, goal: v.case.goal, width: v.width, height: v.height, view, newDraft, threads: await timed(runs, v.threads), flat: await timed(runs, v.flat) });
  }
  worker.terminate();
  return rows;
}

(window as unknown as { runClothBench: typeof runClothBench }).runClothBench = runClothBench;
