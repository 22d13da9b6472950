// The cloth views' and Checks' work as the worker does it: pictures against the engine's own
// answers, tiling, reuse of one revision's results, the message data surviving a structured clone
// (what postMessage does), and the page-side client that sends requests one at a time.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeDrawdown, expandProfile, findFloats, renderCloth, simulateLayers, type Draft } from '../../../shared/weave';
import { pixel } from '../../../src/features/editor/canvas/bitmap';
import { createClothWorker, MAX_TILED_CELLS, transferablesOf, type ClothRequest, type ClothResult } from '../../../src/features/editor/canvas/cloth-work';
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
        const cloth = renderCloth(draft, dd);
        const { structure, colour, floats } = result.pictures;
        for (const p of [structure, colour, floats]) expect(p && [p.width, p.height, p.repeats]).toEqual([dd.ends, dd.picks, 1]);
        for (let y = 0; y < dd.picks; y++) {
          for (let x = 0; x < dd.ends; x++) {
            expect(structure!.pixels[y * dd.ends + x]).toBe(dd.isUp(x, y) ? TONES.warpUp : TONES.weftUp);
            expect(colour!.pixels[y * dd.ends + x]).toBe(pixel(cloth.colorAt(x, y)));
          }
        }
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
    const sim = simulateLayers(layered);
    const front = result.pictures.front!;
    expect([front.width, front.height]).toEqual([sim.front.width, sim.front.height]);
    for (let y = 0; y < front.height; y++) {
      for (let x = 0; x < front.width; x++) {
        expect(front.pixels[y * front.width + x]).toBe(pixel(layered.palette[sim.front.colorAt(x, y)]));
        expect(result.pictures.back!.pixels[y * front.width + x]).toBe(pixel(layered.palette[sim.back.colorAt(x, y)]));
      }
    }
    expect(result.pictures.layers).not.toBeNull();

    const flat = createClothWorker()(request(twill()));
    expect([flat.pictures.front, flat.pictures.back, flat.pictures.layers]).toEqual([null, null, null]);
    expect(flat.pictures.structure).not.toBeNull();
  });

  it('tiles the repeat as asked, fewer times when the picture would be too large', () => {
    fc.assert(
      fc.property(arbitraryDraft, fc.integer({ min: 1, max: 4 }), (draft, tiles) => {
        const work = createClothWorker();
        const one = work(request(draft, { views: ['colour'] })).pictures.colour!;
        const tiled = work(request(draft, { views: ['colour'], tiles, id: 2 })).pictures.colour!;
        expect(tiled.repeats).toBe(tiles);
        expect([tiled.width, tiled.height]).toEqual([one.width * tiles, one.height * tiles]);
        for (let y = 0; y < tiled.height; y++) {
          for (let x = 0; x < tiled.width; x++) expect(tiled.pixels[y * tiled.width + x]).toBe(one.pixels[(y % one.height) * one.width + (x % one.width)]);
        }
      }),
      { numRuns: 40 },
    );
    // 1000 × 1000 cells: a second repeat would pass the cap, so one is shown.
    const big = twill({
      threading: Array.from({ length: 1000 }, (_, i) => [(i % 4) + 1]),
      treadling: Array.from({ length: 1000 }, (_, i) => [(i % 4) + 1]),
    });
    const picture = createClothWorker()(request(big, { views: ['structure'], tiles: 2 })).pictures.structure!;
    expect(4 * 1000 * 1000).toBeGreaterThan(MAX_TILED_CELLS);
    expect([picture.repeats, picture.width, picture.height]).toEqual([1, 1000, 1000]);
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
        expect(buffers.every((b) => b.byteLength === 0)).toBe(true);
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
