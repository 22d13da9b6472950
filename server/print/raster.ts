import { threadSizesFor, type PlanDocument } from '../../shared/plan';
import { computeDrawdown, hexToRgb, isLayered, renderCloth, renderThreads, simulateLayers, type Draft, type Drawdown, type LayerSimulation, type ThreadFace, type ThreadSizes, type Window } from '../../shared/weave';
import type { Span } from '../../shared/print/page-split';

/** One pixel per cell: column = end, row = pick (both 0-based), 3 bytes (RGB) per pixel. */
export interface CellImage {
  width: number;
  height: number;
  rgb: Uint8Array;
}

/** Cloth views that are a picture of the cloth, one colour per cell. */
export type RasterView = 'structure' | 'colour' | 'front' | 'back' | 'layers';

/** Ink for a raised end and for the pick showing in the two-tone structure view. */
const STRUCTURE_UP = '#000000';
const STRUCTURE_DOWN = '#ffffff';

/**
 * Tints for the layer map, light to dark so they stay apart in grey too; the print also writes
 * each area's layer number, so colour is never the only sign.
 */
export const LAYER_TINTS: readonly string[] = ['#f1ece1', '#6f7f9e', '#d9a441', '#3f6b4f', '#b65c4a', '#9aa7b8', '#5a3d5c', '#c9c19b'];

/** The colour of layer `n` (1-based) in the layer map. */
export function layerTint(n: number): string {
  return LAYER_TINTS[(n - 1) % LAYER_TINTS.length];
}

/** What the cell images are made from, computed once per print. */
export interface ClothSources {
  draft: Draft;
  drawdown: Drawdown;
  /** Only for a layered draft. */
  layers?: LayerSimulation;
  /** Thread sizes and sett for the pictures drawn thread by thread. */
  sizes: ThreadSizes;
}

/** The drawdown, and for a layered draft the layer simulation, computed once; the plan's sett and yarns when there is one. */
export function clothSources(draft: Draft, plan?: PlanDocument): ClothSources {
  const drawdown = computeDrawdown(draft);
  return { draft, drawdown, sizes: threadSizesFor(draft, plan), ...(isLayered(draft) ? { layers: simulateLayers(draft, undefined, { drawdown }) } : {}) };
}

/** Picture pixels per end and per pick when ends are drawn `pixelsPerEnd` apart. */
export function threadPitch(src: ClothSources, pixelsPerEnd: number): { x: number; y: number } {
  return { x: pixelsPerEnd, y: (pixelsPerEnd * src.sizes.endsPerInch) / src.sizes.picksPerInch };
}

/**
 * The cloth drawn thread by thread (the engine's renderThreads) as an RGB image, ends
 * `pixelsPerEnd` apart; pick 1 at the top, end 1 on the left of the front (on the right with
 * `endOneRight`), the back mirrored from the front.
 * @throws Error for a face of a draft with one layer.
 */
export function threadImage(src: ClothSources, face: ThreadFace, pixelsPerEnd: number, options: { endOneRight?: boolean; window?: Window } = {}): CellImage {
  if (face !== 'colour' && !src.layers) throw new Error(`the ${face} view needs a draft with more than one layer`);
  const pic = renderThreads(
    { draft: src.draft, drawdown: src.drawdown, layers: src.layers, sizes: src.sizes },
    { face, pixelsPerInch: pixelsPerEnd * src.sizes.endsPerInch, endOneRight: options.endOneRight, window: options.window },
  );
  return { width: pic.width, height: pic.height, rgb: rgbOf(pic.rgba) };
}

/** RGBA bytes → RGB bytes. */
export function rgbOf(rgba: Uint8ClampedArray): Uint8Array {
  const rgb = new Uint8Array((rgba.length / 4) * 3);
  for (let i = 0, j = 0; i < rgba.length; i += 4, j += 3) {
    rgb[j] = rgba[i];
    rgb[j + 1] = rgba[i + 1];
    rgb[j + 2] = rgba[i + 2];
  }
  return rgb;
}

/** Fills an RGB image from a colour per cell given as an index into a list of '#rrggbb'. */
export function fromIndices(width: number, height: number, colours: readonly string[], indexAt: (end: number, pick: number) => number): CellImage {
  const table = colours.map(hexToRgb);
  const rgb = new Uint8Array(width * height * 3);
  for (let p = 0; p < height; p++) {
    for (let e = 0; e < width; e++) {
      const c = table[indexAt(e, p)] ?? [0, 0, 0];
      const j = (p * width + e) * 3;
      rgb[j] = c[0];
      rgb[j + 1] = c[1];
      rgb[j + 2] = c[2];
    }
  }
  return { width, height, rgb };
}

/**
 * The draft as a cell image in the chosen view, column = end as in the drawdown. The back is
 * given end for end too (not mirrored): the page or picture mirrors it when it lays it out.
 * @throws Error for a face or layer view of a draft with one layer.
 */
export function cellImage(src: ClothSources, view: RasterView): CellImage {
  const { draft, drawdown } = src;
  const { ends: width, picks: height } = drawdown;
  if (view === 'colour') {
    return { width, height, rgb: rgbOf(renderCloth(draft, drawdown).toRGBA()) };
  }
  if (view === 'structure') {
    return fromIndices(width, height, [STRUCTURE_DOWN, STRUCTURE_UP], (e, p) => (drawdown.isUp(e, p) ? 1 : 0));
  }
  const sim = src.layers;
  if (!sim) throw new Error(`the ${view} view needs a draft with more than one layer`);
  if (view === 'front') return fromIndices(width, height, draft.palette, (e, p) => sim.front.colorAt(e, p));
  // The engine's back is mirrored (x = 0 is the last end); undo that to keep column = end.
  if (view === 'back') return fromIndices(width, height, draft.palette, (e, p) => sim.back.colorAt(width - 1 - e, p));
  return fromIndices(width, height, ['#000000', ...LAYER_TINTS, ...LAYER_TINTS], (e, p) => sim.topLayerAt(e, p));
}

/**
 * Cuts the cells [cols] × [rows] out of a cell image and lays them out as they appear on the
 * page: `flipX` puts the first end on the right, `flipY` the first pick at the bottom. Each cell
 * becomes a `scale` × `scale` block of pixels.
 */
export function orientCells(
  img: CellImage,
  cols: Span,
  rows: Span,
  flipX: boolean,
  flipY: boolean,
  scale = 1,
): CellImage {
  const nc = cols.end - cols.start;
  const nr = rows.end - rows.start;
  const width = nc * scale;
  const height = nr * scale;
  const rgb = new Uint8Array(width * height * 3);
  const rowBytes = width * 3;
  for (let r = 0; r < nr; r++) {
    const pick = flipY ? rows.end - 1 - r : rows.start + r;
    const line = r * scale * rowBytes;
    for (let c = 0; c < nc; c++) {
      const end = flipX ? cols.end - 1 - c : cols.start + c;
      const src = (pick * img.width + end) * 3;
      for (let k = 0; k < scale; k++) {
        const dst = line + (c * scale + k) * 3;
        rgb[dst] = img.rgb[src];
        rgb[dst + 1] = img.rgb[src + 1];
        rgb[dst + 2] = img.rgb[src + 2];
      }
    }
    // The first pixel row of the cell is done; the rest of its rows are copies.
    for (let k = 1; k < scale; k++) rgb.copyWithin(line + k * rowBytes, line, line + rowBytes);
  }
  return { width, height, rgb };
}
