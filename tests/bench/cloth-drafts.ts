// Drafts for the cloth-view benchmark (tests/bench/cloth.bench.ts), built the same way in Node and
// in the browser page it loads.
import { doubleWeaveTableMat } from '../../server/db/seeders/demo-drafts';
import { threadSizesFor } from '../../shared/plan/thread-sizes';
import { computeDrawdown } from '../../shared/weave/drawdown';
import { simulateLayers } from '../../shared/weave/layers';
import { renderCells } from '../../shared/weave/picture';
import { expandProfile } from '../../shared/weave/profile';
import { renderThreads } from '../../shared/weave/threads';
import type { Draft } from '../../shared/weave/types';
import type { ClothRequest } from '../../src/features/editor/canvas/cloth-work';
import { paintFaceCells } from './cloth-page/flat-cells';
import { seededRandom } from './seeded-random';

export interface ClothBenchCase {
  label: string;
  ends: number;
  picks: number;
  /** Device pixels per end. */
  zoom: number;
  /** Milliseconds the cloth issue allows for one view at this size. */
  goal: number;
  /** Every pick lifts its own random shafts and carries a random colour: nothing repeats, the renderer's worst case. */
  random?: boolean;
  /** The draft, when it is not {@link benchDraft}'s. */
  draft?: () => Draft;
}

export const CLOTH_BENCH_CASES: readonly ClothBenchCase[] = [
  { label: 'the demo double-weave mat, 440 × 560 at 4 px per thread', ends: 440, picks: 560, zoom: 4, goal: 100, draft: doubleWeaveTableMat },
  { label: '440 × 560 at 4 px per thread', ends: 440, picks: 560, zoom: 4, goal: 100 },
  { label: '2000 × 2000 at 1 px per thread', ends: 2000, picks: 2000, zoom: 1, goal: 500 },
  { label: '440 × 560 at 4 px per thread, no repeats', ends: 440, picks: 560, zoom: 4, goal: 100, random: true },
  { label: '2000 × 2000 at 1 px per thread, no repeats', ends: 2000, picks: 2000, zoom: 1, goal: 500, random: true },
];

/**
 * A two-block double weave of `ends` × `picks` (8 shafts, 40 ends and picks per inch) with a
 * colour-and-weave order in layer 1 and named cotton yarns, so the thread sizes come from the yarn
 * counts and both faces differ block by block: the kind of draft the views are for.
 */
export function benchDraft(ends: number, picks: number, random = false): Draft {
  const endsPerUnit = ends % 16 === 0 && ends / 16 <= 200 ? 16 : 4;
  const picksPerUnit = picks % 16 === 0 && picks / 16 <= 200 ? 16 : 4;
  const columns = ends / endsPerUnit;
  const rows = picks / picksPerUnit;
  const draft = expandProfile(
    {
      name: `Bench ${ends} × ${picks}`,
      threading: Array.from({ length: columns }, (_, i) => (Math.floor(i / 5) % 2) + 1),
      treadling: Array.from({ length: rows }, (_, r) => [(Math.floor(r / 7) % 2) + 1]),
      endsPerUnit,
      picksPerUnit,
      palette: ['#22303c', '#efe6d2', '#9a3b2e'],
      warpColors: [[0, 1], [2]],
      weftColors: [[0, 1], [2]],
      sett: { warp: 40, weft: 40, unit: 'inch' },
    },
    'double-weave',
  );
  const next = seededRandom(ends * 7919 + picks);
  const noRepeats: Partial<Draft> = random
    ? {
        threading: draft.threading.map(() => [1 + Math.floor(next() * 8)]),
        liftplan: draft.liftplan.map(() => [1, 2, 3, 4, 5, 6, 7, 8].filter(() => next() < 0.5)),
        weftColors: draft.weftColors.map(() => Math.floor(next() * 3)),
      }
    : {};
  return {
    ...draft,
    ...noRepeats,
    yarns: [
      { id: 'charcoal', name: 'Charcoal 8/2 cotton', color: 0 },
      { id: 'oat', name: 'Oat 8/2 cotton', color: 1 },
      { id: 'rust', name: 'Rust 8/2 cotton', color: 2 },
    ],
  };
}

/** One view to time: its picture drawn both ways, and the worker request for it. */
export interface BenchView {
  case: ClothBenchCase;
  face: 'colour' | 'front';
  width: number;
  height: number;
  threads(): unknown;
  flat(): unknown;
  /** The worker's request for the whole picture, of draft revision `revision`, moved `x` pixels across. */
  request(id: number, revision: number, x: number): ClothRequest;
}

/** Every case's colour view and front, set up to time. */
export function benchViews(): BenchView[] {
  return CLOTH_BENCH_CASES.flatMap((c) => {
    const draft = c.draft ? c.draft() : benchDraft(c.ends, c.picks, c.random);
    const drawdown = computeDrawdown(draft);
    const layers = simulateLayers(draft, undefined, { drawdown });
    const sizes = threadSizesFor(draft);
    return (['colour', 'front'] as const).map((face): BenchView => {
      const threads = () => renderThreads({ draft, drawdown, layers: face === 'colour' ? undefined : layers, sizes }, { face, pixelsPerInch: c.zoom * sizes.endsPerInch });
      const { width, height } = threads();
      const cells = paintFaceCells(draft, drawdown, face === 'colour' ? null : layers);
      return {
        case: c,
        face,
        width,
        height,
        threads,
        flat: () => renderCells(cells, c.ends, c.picks, { cellSize: c.zoom, window: { x: 0, y: 0, width, height } }),
        request: (id, revision, x) => ({ id, draft, revision, views: [face], floatLimit: 7, tiles: 1, frames: { [face]: { zoom: c.zoom, x, y: 0, width, height } } }),
      };
    });
  });
}
