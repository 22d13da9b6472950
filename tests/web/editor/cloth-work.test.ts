// The cloth views' and Checks' work as the worker does it: pictures against the engine's own
// answers, tiling, reuse of one revision's results, the message data surviving a structured clone
// (what postMessage does), and the page-side client that sends requests one at a time.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { threadSizesFor } from '../../../shared/plan';
import { computeDrawdown, expandProfile, findFloats, renderThreads, simulateLayers, type Draft } from '../../../shared/weave';
import { createClothWorker, MAX_UNFRAMED, transferablesOf, type ClothRequest, type ClothResult } from '../../../src/features/editor/canvas/cloth-work';
import { TONES } from '../../../src/features/editor/canvas/paint';
import { createClothResults, pageRunner, type ClothRunner, type StartRunner } from '../../../src/features/editor/store/cloth-results';
import { createDraftStore } from '../../../src/features/editor/store/draft-store';
import { setCell } from '../../../src/features/editor/store/edits';
import type { ClothView } from '../../../src/features/editor/store/editor';
import { arbitraryDoubleWeaveProfile, doubleWeaveProfile } from '../../helpers/draft-fixtures';
import { twill } from './fixtures';

const ALL_VIEWS: ClothView[] = ['structure', 'colour', 'floats', 'front', 'back', 'layers'];

const request = (draft: Draft, over: Partial<ClothRequest> = {}): ClothRequest => ({
  id: 1,
  draft,
  revision: 0,
  views: ALL_VIEWS,
  floatLimit: 5,
  tiles: 1,
  ...over,
});

/** A small draft of any threading, tie-up and treadling on 2–6 shafts. */
const arbitraryDraft = fc
  .record({ shafts: fc.integer({ min: 2, max: 6 }), ends: fc.integer({ min: 1, max: 14 }), picks: fc.integer({ min: 1, max: 14 }) })
  .chain(({ shafts, ends, picks }) =>
    fc.record({
      threading: fc.array(fc.integer({ min: 1, max: shafts }).map((s) => [s]), { minLength: ends, maxLength: ends }),
      tieup: fc.array(fc.uniqueArray(fc.integer({ min: 1, max: shafts }), { maxLength: shafts }), { minLength: 4, maxLength: 4 }),
      treadling: fc.array(fc.integer({ min: 1, max: 4 }).map((t) => [t]), { minLength: picks, maxLength: picks }),
      shafts: fc.constant(shafts),
    }),
  )
  .map((lists) => twill({ ...lists, warpColors: lists.threading.map((_, i) => i % 3), weftColors: lists.treadling.map((_, i) => (i + 1) % 3) }));

describe('cloth work (what the worker runs)', () => {
  it('paints structure, colour and floats as the engine sees them, and counts floats over the limit', () => {
    fc.assert(
      fc.property(arbitraryDraft, fc.integer({ min: 1, max: 6 }), (draft, floatLimit) => {
        const result = createClothWorker()(request(draft, { floatLimit }));
        const dd = computeDrawdown(draft);
        const { structure, colour, floats } = result.pictures;
        for (const p of [structure, floats]) expect(p && [p.width, p.height, p.repeats, p.zoom]).toEqual([dd.ends, dd.picks, 1, 1]);
        for (let y = 0; y < dd.picks; y++) {
          for (let x = 0; x < dd.ends; x++) expect(structure!.pixels[y * dd.ends + x]).toBe(dd.isUp(x, y) ? TONES.warpUp : TONES.weftUp);
        }
        // The colour view is the cloth thread by thread, a pixel per end.
        const sizes = threadSizesFor(draft);
        const drawn = renderThreads({ draft, drawdown: dd, sizes }, { face: 'colour', pixelsPerInch: sizes.endsPerInch });
        expect([colour!.width, colour!.height, colour!.pixelsPerInch]).toEqual([drawn.width, drawn.height, sizes.endsPerInch]);
        expect([...colour!.pixels]).toEqual([...new Uint32Array(drawn.rgba.buffer)]);
        const overLimit = findFloats(draft, { limit: floatLimit }).overLimit;
        expect(result.floatsOverLimit).toBe(overLimit.length);
        // Every float over the limit is hatched where it starts; with none, the floats view is the dimmed structure.
        for (const f of overLimit) {
          const [x, y] = f.kind === 'warp' ? [f.thread, f.start] : [f.start, f.thread];
          expect([TONES.floatA, TONES.floatB]).toContain(floats!.pixels[y * dd.ends + x]);
        }
        if (overLimit.length === 0) expect(floats!.pixels.every((w) => w === TONES.dimUp || w === TONES.dimDown)).toBe(true);
        // One thread, one item: Checks lists each thread with floats over the limit once.
        for (const f of overLimit) {
          const axis = f.kind === 'warp' ? 'ends' : 'picks';
          const items = result.checks.filter((c) => c.axis === axis && c.index === f.thread).length;
          expect(items).toBe(result.checkCount > result.checks.length ? Math.min(items, 1) : 1);
        }
      }),
      { numRuns: 60 },
    );
  });

  it('shows both faces and the layer map of a double weave, and none for a single layer', () => {
    const layered = expandProfile(doubleWeaveProfile(), 'double-weave');
    const result = createClothWorker()(request(layered));
    const dd = computeDrawdown(layered);
    const layers = simulateLayers(layered);
    const sizes = threadSizesFor(layered);
    for (const face of ['front', 'back'] as const) {
      const drawn = renderThreads({ draft: layered, drawdown: dd, layers, sizes }, { face, pixelsPerInch: sizes.endsPerInch });
      const shown = result.pictures[face]!;
      expect([shown.width, shown.height]).toEqual([drawn.width, drawn.height]);
      expect([...shown.pixels]).toEqual([...new Uint32Array(drawn.rgba.buffer)]);
    }
    const map = result.pictures.layers!;
    for (let y = 0; y < dd.picks; y++) {
      for (let x = 0; x < dd.ends; x++) expect(map.pixels[y * dd.ends + x]).not.toBe(0);
    }

    const flat = createClothWorker()(request(twill()));
    expect([flat.pictures.front, flat.pictures.back, flat.pictures.layers]).toEqual([null, null, null]);
    expect(flat.pictures.structure).not.toBeNull();
  });

  it('tiles the repeat as asked and draws only the framed window of it', () => {
    fc.assert(
      fc.property(arbitraryDraft, fc.integer({ min: 1, max: 4 }), fc.integer({ min: 1, max: 3 }), (draft, tiles, zoom) => {
        const work = createClothWorker();
        const one = work(request(draft, { views: ['structure'], frames: { structure: { zoom, x: 0, y: 0, width: 4000, height: 4000 } } })).pictures.structure!;
        const tiled = work(request(draft, { views: ['structure'], tiles, id: 2, frames: { structure: { zoom, x: 0, y: 0, width: 4000, height: 4000 } } })).pictures.structure!;
        expect(tiled.repeats).toBe(tiles);
        expect([tiled.width, tiled.height]).toEqual([one.width * tiles, one.height * tiles]);
        const repeated = Array.from({ length: tiled.width * tiled.height }, (_, i) => one.pixels[(Math.floor(i / tiled.width) % one.height) * one.width + ((i % tiled.width) % one.width)]);
        expect([...tiled.pixels]).toEqual(repeated);
        // A window is the same pixels as that part of the whole.
        const win = { x: 3, y: 2, width: 7, height: 5 };
        const part = work(request(draft, { views: ['structure'], tiles, id: 3, frames: { structure: { zoom, ...win } } })).pictures.structure!;
        const cut = Array.from({ length: part.width * part.height }, (_, i) => tiled.pixels[(Math.floor(i / part.width) + part.y) * tiled.width + (i % part.width) + part.x]);
        expect([...part.pixels]).toEqual(cut);
      }),
      { numRuns: 25 },
    );
    // Unframed, a large draft is drawn up to MAX_UNFRAMED pixels a side.
    const big = twill({
      threading: Array.from({ length: 1000 }, (_, i) => [(i % 4) + 1]),
      treadling: Array.from({ length: 1000 }, (_, i) => [(i % 4) + 1]),
    });
    const picture = createClothWorker()(request(big, { views: ['structure'], tiles: 3 })).pictures.structure!;
    expect([picture.repeats, picture.width, picture.height, picture.wholeWidth]).toEqual([3, MAX_UNFRAMED, MAX_UNFRAMED, 3000]);
  });

  it('fits the whole picture in the frame, or shows the cloth at its actual size on the screen', () => {
    const draft = twill({ threading: Array.from({ length: 40 }, (_, i) => [(i % 4) + 1]), treadling: Array.from({ length: 20 }, (_, i) => [(i % 4) + 1]) });
    const frame = { x: 0, y: 0, width: 300, height: 300 };
    const sett = { ...draft, sett: { warp: 20, weft: 10, unit: 'inch' as const } };
    const fit = createClothWorker()(request(sett, { views: ['colour', 'structure'], frames: { colour: { zoom: 'fit', ...frame }, structure: { zoom: 'fit', ...frame } } }));
    // 40 ends at 20 per inch: 2 inches across; 20 picks at 10 per inch: 2 inches down. Both fit 300 pixels.
    expect([fit.pictures.colour!.wholeWidth, fit.pictures.colour!.wholeHeight]).toEqual([300, 300]);
    expect([fit.pictures.structure!.wholeWidth, fit.pictures.structure!.zoom]).toEqual([300, 7.5]);
    // Actual size at 192 device pixels per inch (96 CSS pixels per inch at a device pixel ratio of 2).
    const actual = createClothWorker()(request(sett, { views: ['colour'], frames: { colour: { zoom: 'actual', screenPixelsPerInch: 192, ...frame } } }));
    expect([actual.pictures.colour!.pixelsPerInch, actual.pictures.colour!.wholeWidth, actual.pictures.colour!.wholeHeight]).toEqual([192, 384, 384]);
    expect([actual.pictures.colour!.width, actual.pictures.colour!.height]).toEqual([300, 300]);
  });

  it('shows the Structure of a plain weave finer than a pixel as the mean of its two tones, with no moiré', () => {
    const n = 600;
    const plain = twill({ shafts: 2, treadles: 2, tieup: [[1], [2]], threading: Array.from({ length: n }, (_, i) => [(i % 2) + 1]), treadling: Array.from({ length: n }, (_, i) => [(i % 2) + 1]) });
    // 0.37 device pixels per end: no whole number of ends per pixel, where picking one cell per
    // pixel beats into a moiré of the two tones.
    const frame = { zoom: 0.37, x: 0, y: 0, width: 400, height: 400 };
    const picture = createClothWorker()(request(plain, { views: ['structure'], frames: { structure: frame } })).pictures.structure!;
    expect([picture.width, picture.height]).toEqual([222, 222]);
    const bytes = (word: number) => [word & 255, (word >>> 8) & 255, (word >>> 16) & 255];
    const [up, down] = [bytes(TONES.warpUp), bytes(TONES.weftUp)];
    const mean = up.map((u, c) => (u + down[c]) / 2);
    let worst = 0;
    // The last row and column are partly past the cloth (222 × 0.37 … ends), so they are left out.
    for (let y = 0; y < picture.height - 1; y++) {
      for (let x = 0; x < picture.width - 1; x++) {
        const px = bytes(picture.pixels[y * picture.width + x]);
        for (let c = 0; c < 3; c++) worst = Math.max(worst, Math.abs(px[c] - mean[c]));
      }
    }
    // A pixel covers 2.7 × 2.7 cells: its partial cells tip the balance by at most half a cell row
    // and column of 7.3 cells, about 8 % of the difference between the tones.
    expect(worst).toBeLessThanOrEqual(0.08 * Math.abs(down[0] - up[0]));
  });

  it('keeps working on the draft of a revision it has seen, and takes the new draft of a new revision', () => {
    const store = createDraftStore(twill());
    const first = store.get();
    store.apply(setCell, { grid: 'threading', index: 0, value: 2, on: true, single: true });
    const second = store.get();
    const work = createClothWorker();
    const structureOf = (r: ClothResult) => [...r.pictures.structure!.pixels];
    const a = structureOf(work(request(first.draft, { revision: first.revision, views: ['structure'] })));
    // The same revision sent again (as postMessage would, a copy): the first draft's results stand.
    const again = structureOf(work(request(second.draft, { revision: first.revision, views: ['structure'], id: 2 })));
    expect(again).toEqual(a);
    const b = structureOf(work(request(second.draft, { revision: second.revision, views: ['structure'], id: 3 })));
    expect(b).toEqual(structureOf(createClothWorker()(request(second.draft, { views: ['structure'] }))));
    expect(b).not.toEqual(a);
  });

  it('sends and answers in messages a structured clone keeps whole, handing each picture over once', () => {
    fc.assert(
      fc.property(arbitraryDoubleWeaveProfile(3), (profile) => {
        // The store freezes drafts (immer): a frozen draft must clone as well as a plain one.
        const draft = createDraftStore(expandProfile(profile, 'double-weave')).get().draft;
        const sent = structuredClone(request(draft));
        expect(sent).toEqual(request(draft));
        const result = createClothWorker()(sent);
        const expected = structuredClone(result);
        const buffers = transferablesOf(result);
        expect(new Set(buffers).size).toBe(buffers.length);
        expect(buffers.length).toBe(Object.values(result.pictures).filter(Boolean).length);
        const received = structuredClone(result, { transfer: buffers });
        expect(received).toEqual(expected);
        // Handed over, not copied: the worker's buffers are detached.
        expect(buffers.every((b) => (b as ArrayBuffer).byteLength === 0)).toBe(true);
      }),
      { numRuns: 15 },
    );
  });
});

/** A runner the test answers by hand, recording what was sent. */
function manualRunner() {
  const sent: ClothRequest[] = [];
  const handlers: { deliver?: (r: ClothResult) => void; fail?: () => void } = {};
  let disposed = 0;
  const start: StartRunner = (deliver, fail) => {
    handlers.deliver = deliver;
    handlers.fail = fail;
    return { run: (r) => sent.push(r), dispose: () => disposed++ } satisfies ClothRunner;
  };
  const answer = (r: ClothRequest) => handlers.deliver!(createClothWorker()(r));
  return { start, sent, handlers, answer, disposed: () => disposed };
}

describe('cloth results (the page side)', () => {
  it('has one request out at a time and sends only the newest of those made meanwhile', () => {
    const step = fc.oneof(fc.constant('ask' as const), fc.constant('answer' as const), fc.constant('stale' as const));
    fc.assert(
      fc.property(fc.array(step, { maxLength: 30 }), (steps) => {
        const runner = manualRunner();
        const results = createClothResults(runner.start);
        let asked = 0;
        let answered = 0;
        for (const s of steps) {
          if (s === 'ask') {
            asked++;
            results.request({ draft: twill(), revision: asked, views: ['structure'], floatLimit: 5, tiles: 1 });
          } else if (answered < runner.sent.length) {
            const r = runner.sent[answered];
            // An answer to an earlier request (one already answered) is ignored.
            if (s === 'stale' && answered > 0) runner.answer(runner.sent[answered - 1]);
            runner.answer(r);
            answered++;
            expect(results.get().result?.id).toBe(r.id);
          }
          // Never more than one request out, and it is the newest asked when nothing waits.
          expect(runner.sent.length - answered).toBeLessThanOrEqual(1);
        }
        // Answer what is left: the last answer is for the last request made.
        while (answered < runner.sent.length) runner.answer(runner.sent[answered++]);
        if (asked > 0) {
          expect(runner.sent.at(-1)!.revision).toBe(asked);
          expect(results.get()).toMatchObject({ working: false, result: { id: runner.sent.at(-1)!.id } });
        }
        expect(runner.sent.map((r) => r.id)).toEqual([...runner.sent.map((r) => r.id)].sort((a, b) => a - b));
      }),
    );
  });

  it('works on the page, a task later, where there is no worker', async () => {
    const results = createClothResults(null);
    results.request({ draft: twill(), revision: 0, views: ['structure'], floatLimit: 5, tiles: 1 });
    expect(results.get()).toEqual({ result: null, working: true });
    await new Promise((r) => setTimeout(r, 10));
    expect(results.get().working).toBe(false);
    expect(results.get().result?.pictures.structure?.width).toBe(8);
  });

  it('falls back to the page when the worker fails to load or cannot start, resending what was out', async () => {
    const runner = manualRunner();
    const results = createClothResults(runner.start);
    results.request({ draft: twill(), revision: 0, views: ['floats'], floatLimit: 5, tiles: 1 });
    expect(runner.sent).toHaveLength(1);
    runner.handlers.fail!();
    expect(runner.disposed()).toBe(1);
    await new Promise((r) => setTimeout(r, 10));
    expect(results.get().result?.id).toBe(runner.sent[0].id);
    // Later requests stay on the page.
    results.request({ draft: twill(), revision: 1, views: ['floats'], floatLimit: 5, tiles: 1 });
    await new Promise((r) => setTimeout(r, 10));
    expect(runner.sent).toHaveLength(1);
    expect(results.get().result?.id).toBe(2);

    const refused = createClothResults(() => {
      throw new Error('workers are not allowed here');
    });
    refused.request({ draft: twill(), revision: 0, views: ['structure'], floatLimit: 5, tiles: 1 });
    await new Promise((r) => setTimeout(r, 10));
    expect(refused.get().result?.pictures.structure).toBeTruthy();
  });

  it('stops the runner on dispose, drops unanswered work, and starts again on the next request', () => {
    const runner = manualRunner();
    const results = createClothResults(runner.start);
    results.request({ draft: twill(), revision: 0, views: ['structure'], floatLimit: 5, tiles: 1 });
    results.dispose();
    expect(runner.disposed()).toBe(1);
    expect(results.get().working).toBe(false);
    runner.answer(runner.sent[0]);
    expect(results.get().result).toBeNull();
    results.request({ draft: twill(), revision: 0, views: ['structure'], floatLimit: 5, tiles: 1 });
    expect(runner.sent).toHaveLength(2);
    runner.answer(runner.sent[1]);
    expect(results.get().result?.id).toBe(runner.sent[1].id);
  });

  it('the page runner cancels its pending work when disposed', async () => {
    const delivered: ClothResult[] = [];
    const runner = pageRunner((r) => delivered.push(r), () => {});
    runner.run(request(twill()));
    runner.dispose();
    await new Promise((r) => setTimeout(r, 10));
    expect(delivered).toEqual([]);
  });
});
