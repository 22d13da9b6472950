import { countByKind, findChecks, isLayered, type CheckKind, type Draft } from '../../../../shared/weave';
import type { ClothView } from '../store/editor';
import { createDerived, type Derived } from './derived';
import { paintCloth, paintFace, paintFloats, paintLayerMap, paintStructure, tile } from './paint';

/**
 * The heavy work behind the cloth views and Checks, as plain data in and out so it can run in a
 * Web Worker (canvas/cloth.worker.ts) and, where there is no worker, on the page.
 */
export interface ClothRequest {
  /** Goes up with every request; a result answers the request with the same id. */
  id: number;
  draft: Draft;
  /** The draft store's revision: the same revision is the same draft, so earlier results can be reused. */
  revision: number;
  views: readonly ClothView[];
  floatLimit: number;
  /** Repeats of the draft wanted across and down. */
  tiles: number;
}

/** One cloth view as pixels, a cell each (pixel words as `ImageData` wants them). */
export interface ViewPicture {
  width: number;
  height: number;
  /** Repeats shown across and down: fewer than asked for when the draft is large. */
  repeats: number;
  pixels: Uint32Array<ArrayBuffer>;
}

/** One item of Checks: one cause, jumping to its end or pick. */
export interface CheckItem {
  key: string;
  kind: CheckKind;
  axis: 'ends' | 'picks';
  index: number;
  message: string;
}

export interface ClothResult {
  id: number;
  /** Every view asked for; null when the draft has no layers for that view to show. */
  pictures: Partial<Record<ClothView, ViewPicture | null>>;
  /** Floats over the limit, all of them (the floats view's caption). */
  floatsOverLimit: number;
  /** The first {@link MAX_CHECKS} items, one per cause. */
  checks: CheckItem[];
  /** How many items there are in all. */
  checkCount: number;
  /** Items by kind, counting those left out of `checks`. */
  checkKinds: { kind: CheckKind; label: string; count: number }[];
}

/** Items sent back at most; Checks says how many more there are. */
export const MAX_CHECKS = 100;
/** Cells a tiled view may hold; past this, fewer repeats are shown (the view is 300 px wide anyway). */
export const MAX_TILED_CELLS = 1_500_000;

/** One repeat of a view as pixels, or null when the draft has no layers to show. */
function paintView(view: ClothView, draft: Draft, derived: Derived, floatLimit: number): { width: number; height: number; fill: (out: Uint32Array) => void } | null {
  const dd = derived.drawdown(draft);
  const size = { width: dd.ends, height: dd.picks };
  switch (view) {
    case 'structure':
      return { ...size, fill: (out) => paintStructure(out, dd) };
    case 'colour':
      return { ...size, fill: (out) => paintCloth(out, derived.cloth(draft)) };
    case 'floats':
      return { ...size, fill: (out) => paintFloats(out, dd, derived.floats(draft, floatLimit).overLimit) };
    case 'front':
    case 'back':
    case 'layers': {
      if (!isLayered(draft)) return null;
      const sim = derived.layers(draft);
      if (view === 'layers') return { ...size, fill: (out) => paintLayerMap(out, sim.top, dd.ends) };
      const face = view === 'front' ? sim.front : sim.back;
      return { width: face.width, height: face.height, fill: (out) => paintFace(out, face, draft.palette) };
    }
  }
}

/** A view tiled `tiles` × `tiles` times (fewer on a large draft). */
function picture(view: ClothView, draft: Draft, derived: Derived, floatLimit: number, tiles: number): ViewPicture | null {
  const one = paintView(view, draft, derived, floatLimit);
  if (!one || one.width === 0 || one.height === 0) return null;
  const n = Math.max(1, Math.min(tiles, Math.floor(Math.sqrt(MAX_TILED_CELLS / (one.width * one.height)))));
  const repeat = new Uint32Array(one.width * one.height);
  one.fill(repeat);
  if (n === 1) return { width: one.width, height: one.height, repeats: 1, pixels: repeat };
  const pixels = new Uint32Array(repeat.length * n * n);
  tile(pixels, repeat, one.width, one.height, n, n);
  return { width: one.width * n, height: one.height * n, repeats: n, pixels };
}

/** What the engine finds wrong (threading, layers, floats over the limit), one item per cause. */
function checkItems(draft: Draft, derived: Derived, floatLimit: number) {
  const groups = findChecks(draft, {
    layers: isLayered(draft) ? derived.layers(draft).problems : [],
    floats: derived.floats(draft, floatLimit).overLimit,
    floatLimit,
  });
  const items = groups.map(({ key, kind, axis, index, message }): CheckItem => ({ key, kind, axis, index, message }));
  return { items, kinds: countByKind(groups) };
}

/**
 * Works out requests one after another, keeping the last draft: a request for the same revision
 * (a view opened, the float limit changed) reuses the drawdown, cloth and layers already worked out.
 */
export function createClothWorker(): (request: ClothRequest) => ClothResult {
  let derived = createDerived();
  let last: { revision: number; draft: Draft } | null = null;
  return (request) => {
    if (!last || last.revision !== request.revision) {
      // A new draft: drop the old results instead of holding them until they are replaced.
      derived = createDerived();
      last = { revision: request.revision, draft: request.draft };
    }
    const { draft } = last;
    const pictures: ClothResult['pictures'] = {};
    for (const view of request.views) pictures[view] = picture(view, draft, derived, request.floatLimit, request.tiles);
    const checks = checkItems(draft, derived, request.floatLimit);
    return {
      id: request.id,
      pictures,
      floatsOverLimit: derived.floats(draft, request.floatLimit).overLimit.length,
      checks: checks.items.slice(0, MAX_CHECKS),
      checkCount: checks.items.length,
      checkKinds: checks.kinds,
    };
  };
}

/** The pixel buffers of a result, to hand over to the page instead of copying them. */
export function transferablesOf(result: ClothResult): ArrayBuffer[] {
  return Object.values(result.pictures).flatMap((p) => (p ? [p.pixels.buffer] : []));
}
