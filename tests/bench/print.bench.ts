// Printing benchmark: `npx tsx tests/bench/print.bench.ts`. Times renderDraftPdf on a
// 2000-end × 2000-pick draft (budget 5 s), on two small demo-like drafts and on the demo seed's
// drafts, and reports the page counts and the longest stretch each print holds the event loop.
// Exits with 1 when the big draft misses its budget.
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { PDFParse } from 'pdf-parse';
import { createDraft, expandProfile, type Draft } from '../../shared/weave';
import { defaultPlan, type PlanDocument } from '../../shared/plan';
import type { PrintOptions } from '../../shared/print/types';
import { colourAndWeaveSampler, doubleWeaveTableMat, pointTwillScarf, straightTwillTrial } from '../../server/db/seeders/demo-drafts';
import { renderDraftPdf } from '../../server/print/draft-pdf';
import { doubleWeaveProfile } from '../helpers/draft-fixtures';
import { bigPointTwill } from '../helpers/print-fixtures';

const options: PrintOptions = { paper: 'a4', orientation: 'portrait', threadingAbove: true, treadlingRight: true, shaftsFromBottom: true, endOneRight: true, numberEvery: 8 };
const BUDGET_MS = 5000;

/** A 4-shaft 2/2 twill scarf on a point draw, 96 ends × 96 picks. */
function smallTwill(): Draft {
  const point = [1, 2, 3, 4, 3, 2];
  return createDraft({
    name: 'Point twill scarf',
    shafts: 4,
    treadles: 4,
    threading: Array.from({ length: 96 }, (_, i) => [point[i % point.length]]),
    tieup: [[1, 2], [2, 3], [3, 4], [4, 1]],
    treadling: Array.from({ length: 96 }, (_, i) => [point[i % point.length]]),
    palette: ['#3b2f4a', '#d9c6a5'],
    warpColors: Array.from({ length: 96 }, () => 0),
    weftColors: Array.from({ length: 96 }, () => 1),
    yarns: [
      { id: 'a', name: 'Plum 2/16 wool', color: 0 },
      { id: 'b', name: 'Fawn 2/16 wool', color: 1 },
    ],
  });
}

/** The two-block double-weave table mat on 8 shafts. */
function doubleWeave(): Draft {
  return {
    ...expandProfile(doubleWeaveProfile(), 'double-weave'),
    yarns: [
      { id: 'n', name: 'Navy 8/2 cotton', color: 0 },
      { id: 'c', name: 'Cream 8/2 cotton', color: 1 },
      { id: 'r', name: 'Rust 8/2 cotton', color: 2 },
    ],
  };
}

async function pageCount(pdf: Buffer): Promise<number> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getInfo()).total;
  } finally {
    await parser.destroy();
  }
}

async function time(name: string, draft: Draft, plan?: PlanDocument): Promise<number> {
  // How long the print holds the event loop at a stretch (the server's other requests wait that long).
  const blocked = monitorEventLoopDelay({ resolution: 5 });
  blocked.enable();
  const started = performance.now();
  const cpu = process.cpuUsage();
  const pdf = await renderDraftPdf({ draft, plan, meta: { title: name, author: 'Bench', studio: 'Bench studio', date: 'today', version: 1 }, options });
  const ms = performance.now() - started;
  const used = process.cpuUsage(cpu);
  blocked.disable();
  const pages = await pageCount(pdf);
  console.log(
    `${name.padEnd(34)} ${String(draft.threading.length).padStart(5)} ends × ${String(draft.treadling.length || draft.liftplan.length).padStart(5)} picks  ` +
      `${String(pages).padStart(5)} pages  ${ms.toFixed(0).padStart(6)} ms  (cpu ${((used.user + used.system) / 1000).toFixed(0)} ms, ` +
      `longest block ${(blocked.max / 1e6).toFixed(0)} ms)  ${(pdf.length / 1024).toFixed(0)} KiB`,
  );
  return ms;
}

const plan: PlanDocument = { ...defaultPlan('inch'), warpYarn: { text: '8/2 cotton', byColor: {} }, weftYarn: { text: '8/2 cotton', byColor: {} } };
// One small print first, so module loading and font parsing are not charged to the drafts below.
await time('warm-up (4-shaft twill)', smallTwill());
await time('4-shaft point twill, with plan', smallTwill(), plan);
await time('8-shaft double weave, with plan', doubleWeave(), plan);
// The demo seed's drafts, with a plan.
for (const draft of [pointTwillScarf(), colourAndWeaveSampler(), straightTwillTrial(), doubleWeaveTableMat('harbour'), doubleWeaveTableMat('meadow')]) {
  await time(`demo: ${draft.name}`.slice(0, 34), draft, plan);
}
const big = await time('2000 × 2000 8-shaft twill, no plan', bigPointTwill(2000));
console.log(big < BUDGET_MS ? `2000 × 2000 printed within the ${BUDGET_MS} ms budget` : `2000 × 2000 took ${big.toFixed(0)} ms, over the ${BUDGET_MS} ms budget`);
process.exitCode = big < BUDGET_MS ? 0 : 1;
