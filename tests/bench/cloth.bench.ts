/*
 * Cloth-view benchmark: `npx tsx tests/bench/cloth.bench.ts [--runs 9] [--node-only]`.
 *
 * Goals (the cloth views' issue): one thread-by-thread view of 440 × 560 threads at 4 px per thread
 * in ≤ 100 ms in the worker, and of 2000 × 2000 at 1 px per thread in ≤ 500 ms; and, measured in
 * the same run, how the thread renderer's time compares with drawing the same view as flat cells
 * (one flat square per cell, the cloth views' old way) at the same size.
 *
 * Two places, same code:
 *   1. Node: the worker's own function (createClothWorker) and the two renderers called directly.
 *   2. Debian's Chromium: the editor's real cloth worker (a Web Worker, pictures handed back as
 *      ImageBitmaps through OffscreenCanvas), timed from postMessage to the answer on the page;
 *      and the two renderers on the page's thread for the ratio.
 * "view" times are a new window of a draft the worker already holds (pan or zoom: the picture
 * only); "new draft" times include the drawdown, layers, thread sizes and Checks worked out first.
 * Prints figures; it is not a pass/fail test.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { register } from 'node:module';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { build, preview } from 'vite';
import { benchViews } from './cloth-drafts';
import { timeRuns } from './timing';
import type { BenchRow } from './cloth-page/main';

const arg = (name: string, fallback: string) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : fallback;
};
const RUNS = Number(arg('runs', '9'));
const ms = (n: number) => `${n.toFixed(1)} ms`;

const timed = (run: () => unknown) => timeRuns(RUNS, run);

function printRows(place: string, rows: BenchRow[]): void {
  for (const r of rows) {
    const verdict = r.view <= r.goal ? 'within' : 'OVER';
    const cpu = (v: number | undefined) => (v === undefined ? '' : ` [CPU ${ms(v)}]`);
    console.log(
      `${place} | ${r.label}, ${r.face}: view ${ms(r.view)}${cpu(r.cpu?.view)} (goal ≤ ${r.goal} ms: ${verdict}), new draft ${ms(r.newDraft)}${cpu(r.cpu?.newDraft)}; ` +
        `renderThreads ${ms(r.threads)}${cpu(r.cpu?.threads)} vs flat cells ${ms(r.flat)}${cpu(r.cpu?.flat)} = ${(r.threads / r.flat).toFixed(1)} × (${r.width} × ${r.height} px)`,
    );
  }
}

// The worker's code reads the theme's colours with Vite's `?raw` imports: give Node the same.
register('./raw-import-hooks.mjs', import.meta.url);
const { createClothWorker } = await import('../../src/features/editor/canvas/cloth-work');

function nodeRows(): BenchRow[] {
  return benchViews().map((v) => {
    let id = 0;
    let revision = 0;
    const work = createClothWorker();
    const newDraft = timed(() => work(v.request(++id, ++revision, 0)));
    const view = timed(() => work(v.request(++id, revision, id % 2)));
    const threads = timed(v.threads);
    const flat = timed(v.flat);
    return {
      label: v.case.label,
      face: v.face,
      goal: v.case.goal,
      width: v.width,
      height: v.height,
      view: view.wall,
      newDraft: newDraft.wall,
      threads: threads.wall,
      flat: flat.wall,
      cpu: { view: view.cpu, newDraft: newDraft.cpu, threads: threads.cpu, flat: flat.cpu },
    };
  });
}

async function browserRows(): Promise<BenchRow[]> {
  const root = new URL('../..', import.meta.url).pathname;
  const outDir = mkdtempSync(join(tmpdir(), 'shedwright-cloth-bench-dist-'));
  const profile = mkdtempSync(join(tmpdir(), 'shedwright-cloth-bench-'));
  const input = join(root, 'tests/bench/cloth-page/index.html');
  await build({ root, configFile: join(root, 'vite.config.ts'), logLevel: 'warn', build: { outDir, emptyOutDir: true, rolldownOptions: { input } } });
  const server = await preview({ root, configFile: join(root, 'vite.config.ts'), logLevel: 'warn', build: { outDir }, preview: { port: 0, host: '127.0.0.1' } });
  const address = server.httpServer.address();
  const port = typeof address === 'object' && address ? address.port : 4173;
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    const page = context.pages()[0] ?? (await context.newPage());
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(`http://127.0.0.1:${port}/tests/bench/cloth-page/index.html`);
    await page.waitForFunction(() => 'runClothBench' in window, undefined, { timeout: 60_000 });
    const rows = await page.evaluate((runs) => (window as unknown as { runClothBench(runs: number): Promise<BenchRow[]> }).runClothBench(runs), RUNS);
    if (errors.length > 0) throw new Error(errors.join('\n'));
    return rows;
  } finally {
    await context.close();
    await server.close();
    rmSync(profile, { recursive: true, force: true });
    rmSync(outDir, { recursive: true, force: true });
  }
}

console.log(`load average ${loadavg().map((l) => l.toFixed(1)).join(' ')} on ${availableParallelism()} cores; medians of ${RUNS} runs`);
printRows('node    ', nodeRows());
if (!process.argv.includes('--node-only')) printRows('chromium', await browserRows());
