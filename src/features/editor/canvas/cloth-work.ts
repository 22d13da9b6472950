import type { YarnSource } from '../../../../shared/plan';
import { arrangementOf, cellPictureSize, countByKind, findChecks, isLayered, renderCells, renderThreads, threadPictureSize, type CheckKind, type Draft } from '../../../../shared/weave';
import type { ClothView } from '../store/editor';
import { createDerived, type Derived } from './derived';
import { paintFloats, paintLayerMap, paintStructure } from './paint';

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
  /** The part of each view on screen; a view without one is drawn whole at a pixel per thread (up to MAX_UNFRAMED pixels a side). */
  frames?: Partial<Record<ClothView, ViewFrame>>;
}

/** How a view is shown: its zoom, and the window of the picture the panel shows, in device pixels. */
export interface ViewFrame {
  /**
   * Device pixels per end; 'fit' shows the whole picture; 'actual' shows the cloth at its real
   * size on this screen (the thread views; the others fit).
   */
  zoom: number | 'fit' | 'actual';
  /** Device pixels per inch of the screen, for 'actual': 96 CSS pixels per inch × devicePixelRatio. */
  screenPixelsPerInch?: number;
  /** Top-left of the window in picture pixels (kept within the picture). */
  x: number;
  y: number;
  width: number;
  height: number;
}

/** The window of one view as pixels (pixel words as `ImageData` wants them). */
export interface ViewPicture {
  width: number;
  height: number;
  /** Where the window lies in the whole picture. */
  x: number;
  y: number;
  /** The whole picture's size at this zoom. */
  wholeWidth: number;
  wholeHeight: number;
  /** Device pixels per end. */
  zoom: number;
  /** Picture pixels per inch of cloth (the thread views), for a ruler; null for the cell views. */
  pixelsPerInch: number | null;
  /** Repeats shown across and down. */
  repeats: number;
  /** For the thread views: the sett drawn (per inch) and where the yarn sizes came from. */
  threads: { endsPerInch: number; picksPerInch: number; warpSource: YarnSource; weftSource: YarnSource } | null;
  /** Pixel words; empty when the worker sent the picture as `bitmap` instead. */
  pixels: Uint32Array<ArrayBuffer>;
  /** The picture made ready to draw off the page's thread, where the worker has OffscreenCanvas. */
  bitmap?: ImageBitmap;
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
/** Largest side of a view drawn without a frame. */
export const MAX_UNFRAMED = 2048;
/** Zoom limits, in device pixels per end. */
export const MAX_ZOOM = 64;

/** A view's picture: its size at a zoom, and a function drawing a window of it. */
interface ViewSource {
  size(zoom: number): { width: number; height: number };
  /** Zoom showing the whole picture in width × height. */
  fit(width: number, height: number): number;
  /** Picture pixels per inch at a zoom, for the thread views. */
  pixelsPerInch(zoom: number): number | null;
  threads: ViewPicture['threads'];
  draw(zoom: number, window: { x: number; y: number; width: number; height: number }): Uint32Array<ArrayBuffer>;
}

/** A view's source, or null when the draft has no layers for it to show. */
function viewSource(view: ClothView, draft: Draft, derived: Derived, floatLimit: number, repeats: number): ViewSource | null {
  const dd = derived.drawdown(draft);
  const { ends, picks } = dd;
  if (ends === 0 || picks === 0) return null;
  if ((view === 'front' || view === 'back' || view === 'layers') && !isLayered(draft)) return null;
  // The cloth seen as the draft is laid out: end 1 on the side its arrangement names.
  const endOneRight = arrangementOf(draft).endOne === 'right';
  if (view === 'colour' || view === 'front' || view === 'back') {
    const sizes = derived.sizes(draft);
    const face = view;
    const layers = view === 'colour' ? undefined : derived.layers(draft);
    return {
      size: (zoom) => threadPictureSize(sizes, ends, picks, zoom * sizes.endsPerInch, repeats),
      fit: (w, h) => Math.min(w / (ends * repeats), (h * sizes.picksPerInch) / (picks * repeats * sizes.endsPerInch)),
      pixelsPerInch: (zoom) => zoom * sizes.endsPerInch,
      threads: { endsPerInch: sizes.endsPerInch, picksPerInch: sizes.picksPerInch, warpSource: sizes.warpSource, weftSource: sizes.weftSource },
      draw: (zoom, window) =>
        words(renderThreads({ draft, drawdown: dd, layers, sizes }, { face, pixelsPerInch: zoom * sizes.endsPerInch, repeats, window, endOneRight }).rgba),
    };
  }
  const cells = new Uint32Array(ends * picks);
  if (view === 'structure') paintStructure(cells, dd);
  else if (view === 'floats') paintFloats(cells, dd, derived.floats(draft, floatLimit).overLimit);
  else paintLayerMap(cells, derived.layers(draft).top, ends);
  if (endOneRight) for (let p = 0; p < picks; p++) cells.subarray(p * ends, (p + 1) * ends).reverse();
  return {
    size: (zoom) => cellPictureSize(ends, picks, zoom, repeats),
    fit: (w, h) => Math.min(w / (ends * repeats), h / (picks * repeats)),
    pixelsPerInch: () => null,
    threads: null,
    draw: (zoom, window) => words(renderCells(cells, ends, picks, { cellSize: zoom, repeats, window }).rgba),
  };
}

const words = (rgba: Uint8ClampedArray<ArrayBuffer>) => new Uint32Array(rgba.buffer);

/** The window of a view a frame asks for, drawn; null when the draft has no layers for the view. */
function picture(source: ViewSource | null, frame: ViewFrame | undefined, repeats: number): ViewPicture | null {
  if (!source) return null;
  let zoom: number;
  if (!frame) zoom = 1;
  else if (frame.zoom === 'actual' && source.pixelsPerInch(1) !== null) zoom = (frame.screenPixelsPerInch ?? 96) / source.pixelsPerInch(1)!;
  else if (typeof frame.zoom === 'number') zoom = frame.zoom;
  else zoom = source.fit(frame.width, frame.height);
  zoom = Math.min(MAX_ZOOM, Math.max(1e-3, zoom));
  const whole = source.size(zoom);
  const width = Math.max(1, Math.min(frame?.width ?? MAX_UNFRAMED, whole.width));
  const height = Math.max(1, Math.min(frame?.height ?? MAX_UNFRAMED, whole.height));
  const x = Math.max(0, Math.min(Math.round(frame?.x ?? 0), whole.width - width));
  const y = Math.max(0, Math.min(Math.round(frame?.y ?? 0), whole.height - height));
  return {
    width,
    height,
    x,
    y,
    wholeWidth: whole.width,
    wholeHeight: whole.height,
    zoom,
    pixelsPerInch: source.pixelsPerInch(zoom),
    repeats,
    threads: source.threads,
    pixels: source.draw(zoom, { x, y, width, height }),
  };
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
    const repeats = Math.max(1, Math.floor(request.tiles));
    for (const view of request.views) {
      pictures[view] = picture(viewSource(view, draft, derived, request.floatLimit, repeats), request.frames?.[view], repeats);
    }
    const checks = derived.checks(request.floatLimit, () => checkItems(draft, derived, request.floatLimit));
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
export function transferablesOf(result: ClothResult): Transferable[] {
  return Object.values(result.pictures).flatMap((p) => (p ? [p.bitmap ?? p.pixels.buffer] : []));
}

/**
 * Turns each picture into an ImageBitmap through an OffscreenCanvas, so the page only draws it
 * (no pixel upload on the page's thread). Where there is no OffscreenCanvas the pixels go as they are.
 */
export function withBitmaps(result: ClothResult): ClothResult {
  if (typeof OffscreenCanvas === 'undefined') return result;
  for (const p of Object.values(result.pictures)) {
    if (!p || p.width === 0 || p.height === 0) continue;
    const canvas = new OffscreenCanvas(p.width, p.height);
    const ctx = canvas.getContext('2d');
    if (!ctx) return result;
    ctx.putImageData(new ImageData(new Uint8ClampedArray(p.pixels.buffer), p.width, p.height), 0, 0);
    p.bitmap = canvas.transferToImageBitmap();
    p.pixels = new Uint32Array(0);
  }
  return result;
}
