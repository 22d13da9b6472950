import { createClothWorker, type ClothRequest, type ClothResult, type ViewFrame } from '../canvas/cloth-work';
import type { ClothView } from './editor';
import { createStore, type Store } from './create-store';

export interface ClothState {
  /** The latest answer, null until the first arrives. */
  result: ClothResult | null;
  /** A request is being worked out: the result shown may be for an earlier draft or setting. */
  working: boolean;
}

/** Where requests are worked out; it answers through `deliver`, and calls `fail` if it cannot work at all. */
export interface ClothRunner {
  run(request: ClothRequest): void;
  dispose(): void;
}
export type StartRunner = (deliver: (result: ClothResult) => void, fail: () => void) => ClothRunner;

/** Works requests out on the page, a task later, so callers see the same order of events as with a worker. */
export const pageRunner: StartRunner = (deliver) => {
  const work = createClothWorker();
  const timers = new Set<ReturnType<typeof setTimeout>>();
  return {
    run(request) {
      const timer = setTimeout(() => {
        timers.delete(timer);
        deliver(work(request));
      }, 0);
      timers.add(timer);
    },
    dispose() {
      for (const t of timers) clearTimeout(t);
      timers.clear();
    },
  };
};

/** A module worker (canvas/cloth.worker.ts), or null where there are no workers (a test's DOM). */
export const workerRunner: StartRunner | null =
  typeof Worker === 'undefined'
    ? null
    : (deliver, fail) => {
        const worker = new Worker(new URL('../canvas/cloth.worker.ts', import.meta.url), { type: 'module' });
        worker.onmessage = (event: MessageEvent<ClothResult>) => deliver(event.data);
        // The script did not load (offline before it was ever fetched) or broke: the page takes over.
        worker.onerror = (event) => {
          event.preventDefault();
          fail();
        };
        return { run: (request) => worker.postMessage(request), dispose: () => worker.terminate() };
      };

export type ViewFrames = Partial<Record<ClothView, ViewFrame>>;

export interface ClothResults extends Store<ClothState> {
  /** What part of each view its panel shows, at what zoom: set by the panels, sent with each request. */
  frames: Store<ViewFrames>;
  /** Asks for the views and checks of a draft; the newest request wins. */
  request(request: Omit<ClothRequest, 'id'>): void;
  /** Stops the worker and forgets unanswered requests; a later request starts it again. */
  dispose(): void;
}

/**
 * The cloth views' and Checks' results, worked out off the main thread when a worker is there.
 * One request is out at a time: requests made meanwhile replace each other and only the newest is
 * sent when the answer comes, so a weaver pausing often never queues up stale work.
 */
export function createClothResults(start: StartRunner | null = workerRunner): ClothResults {
  const state = createStore<ClothState>({ result: null, working: false });
  let nextId = 1;
  let inFlight: ClothRequest | null = null;
  let waiting: ClothRequest | null = null;
  let runner: ClothRunner | null = null;
  let onPage = start === null;

  const send = (request: ClothRequest) => {
    inFlight = request;
    if (!runner) runner = startRunner();
    runner.run(request);
  };
  const deliver = (result: ClothResult) => {
    if (result.id !== inFlight?.id) return;
    const next = waiting;
    inFlight = null;
    waiting = null;
    state.set({ result, working: next !== null });
    if (next) send(next);
  };
  const fail = () => {
    runner?.dispose();
    runner = null;
    onPage = true;
    if (inFlight) send(inFlight);
  };
  const startRunner = (): ClothRunner => {
    if (!onPage && start) {
      try {
        return start(deliver, fail);
      } catch {
        // Workers refused (a security policy, say): work on the page.
        onPage = true;
      }
    }
    return pageRunner(deliver, fail);
  };

  return {
    ...state,
    frames: createStore<ViewFrames>({}),
    request(partial) {
      const request = { ...partial, id: nextId++ };
      if (!state.get().working) state.set((s) => ({ ...s, working: true }));
      if (inFlight) waiting = request;
      else send(request);
    },
    dispose() {
      runner?.dispose();
      runner = null;
      inFlight = null;
      waiting = null;
      if (state.get().working) state.set((s) => ({ ...s, working: false }));
    },
  };
}
