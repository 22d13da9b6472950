import { packedRgba } from './cloth';
import type { Drawdown } from './drawdown';
import type { LayerSimulation } from './layers';
import { boxAverage, type Window } from './picture';
import type { Draft } from './types';

/** Which side of the cloth to draw: the whole cloth in one plane, or a face of layered cloth. */
export type ThreadFace = 'colour' | 'front' | 'back';

/** How big each thread is and how closely they lie, all in inches. */
export interface ThreadSizes {
  endsPerInch: number;
  picksPerInch: number;
  /** Per end (0-based): the yarn's diameter in inches. */
  warpDiameters: ArrayLike<number>;
  /** Per pick (0-based): the yarn's diameter in inches. */
  weftDiameters: ArrayLike<number>;
}

export interface ThreadPictureInput {
  draft: Draft;
  drawdown: Drawdown;
  /** Needed for the front and back of layered cloth. */
  layers?: LayerSimulation;
  sizes: ThreadSizes;
}

export interface ThreadPictureOptions {
  face: ThreadFace;
  /** Picture pixels per inch of cloth. */
  pixelsPerInch: number;
  /** Repeats of the draft across and down. Default 1. */
  repeats?: number;
  /** The part of the picture to draw, in picture pixels; the whole picture by default. */
  window?: Window;
  /** What shows where no thread lies. Default a light grey. */
  background?: string;
  /** End 1 on the right of the front, as a weaver with the treadling on the right draws it; the back is the front's mirror either way. */
  endOneRight?: boolean;
}

export interface ThreadPicture {
  width: number;
  height: number;
  /** RGBA bytes, row by row (ready for ImageData). */
  rgba: Uint8ClampedArray<ArrayBuffer>;
}

/** Brightness across a thread: 1 on its crown, this much less at its edges, so each reads as round. */
const EDGE_DARKENING = 0.35;
/** A thread passing under its crossing thread is seen only beside it, in its shadow. */
const UNDER_SHADE = 0.78;
/** The other layer, seen through the gaps of the one on top, lies in the top layer's shadow. */
const LOWER_LAYER_SHADE = 0.6;
/** Shades are quantised into this many steps, so a shaded colour is one table look-up. */
const LEVELS = 64;
/** Largest picture drawn before averaging down a view finer than a pixel per thread. */
const MAX_SUPERSAMPLED_PIXELS = 24_000_000;

/** The whole picture's size in pixels at `pixelsPerInch`. */
export function threadPictureSize(sizes: ThreadSizes, ends: number, picks: number, pixelsPerInch: number, repeats = 1): { width: number; height: number } {
  return {
    width: Math.ceil((ends * repeats * pixelsPerInch) / sizes.endsPerInch),
    height: Math.ceil((picks * repeats * pixelsPerInch) / sizes.picksPerInch),
  };
}

/** Where each pixel column (or row) of the picture falls among the threads of one direction. */
interface Axis {
  /** The thread whose space holds the pixel's centre (0-based, before repeating); -1 off the cloth. */
  cell: Int32Array;
  /** The thread drawn in the pixel (the one covering most of it). */
  thread: Int32Array;
  /** How much of the pixel that thread (with its neighbour) covers, 0 to 1. */
  cover: Float32Array;
  /** Brightness across the thread at the pixel's centre. */
  shade: Float32Array;
  /**
   * Per layer l, at l * length + i: the threads of layer l before and after the pixel's centre
   * (-1 for none) and how far the pixel lies from the one to the other (0 to 1). A crossing
   * thread is lit where it lies over these and shaded where it passes under.
   */
  before: Int32Array;
  after: Int32Array;
  between: Float32Array;
}

/**
 * Lays threads `pitch` pixels apart, each as wide as its diameter (never wider than its space),
 * and finds for each of `length` pixels from `start` which thread it shows and how much of it.
 * `mirrored` reads the picture from its far edge (the back, turned over). `layerOf` gives each
 * thread's layer (all layer 1 when null), up to `layers`.
 */
function axis(count: number, repeats: number, pitch: number, widthOf: (i: number) => number, start: number, length: number, mirrored: boolean, layerOf: Uint8Array | null, layers: number): Axis {
  const out: Axis = {
    cell: new Int32Array(length),
    thread: new Int32Array(length),
    cover: new Float32Array(length),
    shade: new Float32Array(length),
    before: new Int32Array((layers + 1) * length).fill(-1),
    after: new Int32Array((layers + 1) * length).fill(-1),
    between: new Float32Array((layers + 1) * length),
  };
  const n = count * repeats;
  const total = n * pitch;
  const half = (k: number) => Math.min(widthOf(k % count), pitch) / 2;
  const overlap = (k: number, a: number) => {
    if (k < 0 || k >= n) return 0;
    const c = (k + 0.5) * pitch;
    const h = half(k);
    return Math.max(0, Math.min(a + 1, c + h) - Math.max(a, c - h));
  };
  const layer = (k: number) => (layerOf ? layerOf[k % count] : 1);
  // The nearest thread of each layer at or before, and at or after, each thread of the window.
  const first = Math.max(0, Math.floor((mirrored ? total - start - length : start) / pitch) - 1);
  const last = Math.min(n - 1, Math.floor((mirrored ? total - start : start + length) / pitch) + 1);
  const span = Math.max(0, last - first + 1);
  const prevOf = new Int32Array((layers + 1) * span).fill(-1);
  const nextOf = new Int32Array((layers + 1) * span).fill(-1);
  for (let l = 1; l <= layers; l++) {
    let seen = -1;
    for (let k = first - 1; k >= 0; k--) if (layer(k) === l) { seen = k; break; }
    for (let k = first; k <= last; k++) {
      if (layer(k) === l) seen = k;
      prevOf[l * span + k - first] = seen;
    }
    seen = -1;
    for (let k = last + 1; k < n; k++) if (layer(k) === l) { seen = k; break; }
    for (let k = last; k >= first; k--) {
      if (layer(k) === l) seen = k;
      nextOf[l * span + k - first] = seen;
    }
  }
  for (let i = 0; i < length; i++) {
    const a = mirrored ? total - (start + i) - 1 : start + i;
    const centre = a + 0.5;
    const k = Math.floor(centre / pitch);
    if (k < 0 || k >= n) {
      out.cell[i] = out.thread[i] = -1;
      continue;
    }
    // A pixel straddling the edge of its thread's space may also catch the neighbour.
    const j = a < k * pitch ? k - 1 : a + 1 > (k + 1) * pitch ? k + 1 : -1;
    const own = overlap(k, a);
    const next = j >= 0 ? overlap(j, a) : 0;
    const t = next > own ? j : k;
    out.cell[i] = k % count;
    out.thread[i] = t % count;
    out.cover[i] = Math.min(1, own + next);
    const u = Math.max(-1, Math.min(1, (centre - (t + 0.5) * pitch) / half(t)));
    out.shade[i] = 1 - EDGE_DARKENING * u * u;
    const beforeCentre = centre < (k + 0.5) * pitch;
    for (let l = 1; l <= layers; l++) {
      const lo = beforeCentre ? (k > first ? prevOf[l * span + k - 1 - first] : -1) : prevOf[l * span + k - first];
      const hi = beforeCentre ? nextOf[l * span + k - first] : k < last ? nextOf[l * span + k + 1 - first] : -1;
      // Mirrored, the thread before in the picture is the one after on the cloth.
      const o = l * length + i;
      out.before[o] = (mirrored ? hi : lo) < 0 ? -1 : (mirrored ? hi : lo) % count;
      out.after[o] = (mirrored ? lo : hi) < 0 ? -1 : (mirrored ? lo : hi) % count;
      if (lo >= 0 && hi > lo) {
        const f = (centre - (lo + 0.5) * pitch) / ((hi - lo) * pitch);
        out.between[o] = mirrored ? 1 - f : f;
      }
    }
  }
  return out;
}

/** Each palette colour at LEVELS brightnesses, as pixel words. */
function shadedPalette(palette: readonly string[]): Uint32Array {
  const table = new Uint32Array(Math.max(1, palette.length) * LEVELS);
  palette.forEach((hex, c) => {
    const n = Number.parseInt(hex.slice(1, 7), 16);
    for (let l = 0; l < LEVELS; l++) {
      const f = l / (LEVELS - 1);
      const r = Math.round(((n >>> 16) & 255) * f);
      const g = Math.round(((n >>> 8) & 255) * f);
      const b = Math.round((n & 255) * f);
      table[c * LEVELS + l] = packedRgba(`#${((1 << 24) | (r << 16) | (g << 8) | b).toString(16).slice(1)}`);
    }
  });
  return table;
}

const level = (shade: number) => (shade * (LEVELS - 1) + 0.5) | 0;

/** A number per item, the same for items whose `values` are the same (a class of equal rows). */
function classesOf(count: number, values: (i: number) => Uint32Array | Uint8Array): Int32Array {
  // Rows are hashed, and a row whose hash was seen is compared in full with the rows seen under it.
  const byHash = new Map<number, number[]>();
  const out = new Int32Array(count);
  let classes = 0;
  for (let i = 0; i < count; i++) {
    const row = values(i);
    let h = 2166136261;
    for (let k = 0; k < row.length; k++) h = Math.imul(h ^ row[k], 16777619);
    const seen = byHash.get(h);
    const match = seen?.find((j) => sameValues(values(j), row));
    if (match !== undefined) {
      out[i] = out[match];
      continue;
    }
    out[i] = classes++;
    if (seen) seen.push(i);
    else byHash.set(h, [i]);
  }
  return out;
}

function sameValues(a: ArrayLike<number>, b: ArrayLike<number>): boolean {
  if (a.length !== b.length) return false;
  for (let k = 0; k < a.length; k++) if (a[k] !== b[k]) return false;
  return true;
}

/**
 * Draws the cloth thread by thread: each end and pick as wide as its yarn, spaced by the sett, so
 * an open sett shows gaps and a thick yarn a wider stripe. Each thread is shaded across its width
 * and darker where it passes under, so over and under read at a glance. A face of layered cloth
 * shows the threads of the layer on top there, and through its gaps the other layer, in shadow.
 * The back is drawn as the weaver sees it turned over (mirrored left to right). End 1 is on the
 * left of the front (on the right with `endOneRight`) and pick 1 at the top.
 *
 * A view finer than a pixel per thread is drawn larger and averaged down, so threads blend as the
 * eye sees them from a distance instead of dropping out.
 *
 * @example renderThreads({ draft, drawdown, sizes }, { face: 'colour', pixelsPerInch: 96 }) // the cloth at 96 pixels per inch
 */
export function renderThreads(input: ThreadPictureInput, options: ThreadPictureOptions): ThreadPicture {
  const { sizes, drawdown } = input;
  const repeats = Math.max(1, Math.floor(options.repeats ?? 1));
  const whole = threadPictureSize(sizes, drawdown.ends, drawdown.picks, options.pixelsPerInch, repeats);
  const win = options.window ?? { x: 0, y: 0, width: whole.width, height: whole.height };
  const pitchX = options.pixelsPerInch / sizes.endsPerInch;
  const pitchY = options.pixelsPerInch / sizes.picksPerInch;
  const finest = Math.min(pitchX, pitchY);
  let k = finest >= 1 ? 1 : Math.ceil(1 / finest);
  while (k > 1 && win.width * win.height * k * k > MAX_SUPERSAMPLED_PIXELS) k--;
  if (k === 1) return drawThreads(input, options, repeats, win);
  const big = drawThreads(input, { ...options, pixelsPerInch: options.pixelsPerInch * k }, repeats, {
    x: win.x * k,
    y: win.y * k,
    width: win.width * k,
    height: win.height * k,
  });
  return { width: win.width, height: win.height, rgba: boxAverage(big.rgba, big.width, big.height, k) };
}

function drawThreads(input: ThreadPictureInput, options: ThreadPictureOptions, repeats: number, win: Window): ThreadPicture {
  const { draft, drawdown, sizes } = input;
  const { ends, picks, stride, bits } = drawdown;
  const W = Math.max(0, Math.floor(win.width));
  const H = Math.max(0, Math.floor(win.height));
  const rgba = new Uint8ClampedArray(W * H * 4);
  const words = new Uint32Array(rgba.buffer);
  const bgHex = options.background ?? '#e4e1da';
  const bg = packedRgba(bgHex);
  const bgN = Number.parseInt(bgHex.slice(1, 7), 16);
  const bgR = (bgN >>> 16) & 255;
  const bgG = (bgN >>> 8) & 255;
  const bgB = bgN & 255;
  words.fill(bg);
  if (ends === 0 || picks === 0 || W === 0 || H === 0) return { width: W, height: H, rgba };

  const back = options.face === 'back';
  const mirrored = back !== (options.endOneRight ?? false);
  const pitchX = options.pixelsPerInch / sizes.endsPerInch;
  const pitchY = options.pixelsPerInch / sizes.picksPerInch;
  const ppi = options.pixelsPerInch;
  const sim = options.face !== 'colour' ? input.layers : undefined;
  // Which layer faces the viewer at each cell, and which lies beneath it.
  const upper = sim ? (back ? sim.bottom : sim.top) : null;
  const lower = sim ? (back ? sim.top : sim.bottom) : null;
  const wl = sim ? sim.warpLayers : null;
  const pl = sim ? sim.weftLayers : null;
  let layers = 1;
  if (wl && pl) for (const l of [...wl, ...pl]) if (l > layers) layers = l;
  const xs = axis(ends, repeats, pitchX, (e) => sizes.warpDiameters[e] * ppi, Math.floor(win.x), W, mirrored, wl, layers);
  const ys = axis(picks, repeats, pitchY, (p) => sizes.weftDiameters[p] * ppi, Math.floor(win.y), H, false, pl, layers);

  const table = shadedPalette(draft.palette);
  // The same colours as bytes, for blending at thread edges.
  const bytes = new Uint8Array(table.buffer);
  const warpBase = Int32Array.from({ length: ends }, (_, e) => (draft.warpColors[e] ?? 0) * LEVELS);
  const weftBase = Int32Array.from({ length: picks }, (_, p) => (draft.weftColors[p] ?? 0) * LEVELS);
  const endLayer = wl ?? new Uint8Array(ends).fill(1);
  const flip = back ? 1 : 0;
  // Per row: each end's brightness along its length there, and how lit the row's pick is
  // where it meets each end (lit over an end, shaded under it).
  const warpAlong = new Float32Array(ends);
  const weftLit = new Float32Array(ends);
  // Cloth repeats: a picture row is drawn once and copied wherever the same rows of the drawdown
  // (its pick's and, per layer, the picks before and after it), the same layers on top and
  // beneath, the same weft and the same place across the pick come again.
  const interlacing = classesOf(picks, (p) => bits.subarray(p * stride, (p + 1) * stride));
  const above = upper ? classesOf(picks, (p) => upper.subarray(p * ends, (p + 1) * ends)) : null;
  const beneath = lower ? classesOf(picks, (p) => lower.subarray(p * ends, (p + 1) * ends)) : null;
  const drawnRows = new Map<string, number>();
  for (let y = 0; y < H; y++) {
    const pc = ys.cell[y];
    if (pc < 0) continue;
    const pt = ys.thread[y];
    const ay = ys.cover[y];
    const weftLayer = pl ? pl[pt] : 1;
    const weftShade = ys.shade[y];
    let key = `${ay},${weftShade},${weftBase[pt]},${weftLayer},${interlacing[pt]},${above ? above[pc] : 0},${beneath ? beneath[pc] : 0}`;
    for (let l = 1; l <= layers; l++) {
      const o = l * H + y;
      const p0 = ys.before[o];
      const p1 = ys.after[o];
      key += `;${p0 < 0 ? -1 : interlacing[p0]},${p1 < 0 ? -1 : interlacing[p1]},${ys.between[o]}`;
    }
    const same = drawnRows.get(key);
    if (same !== undefined) {
      words.copyWithin(y * W, same * W, (same + 1) * W);
      continue;
    }
    drawnRows.set(key, y);
    const row = pt * stride;
    // An end is lit over the picks of its own layer it lies over, graded between them.
    for (let e = 0; e < ends; e++) {
      const o = endLayer[e] * H + y;
      const p0 = ys.before[o];
      const p1 = ys.after[o];
      const s0 = p0 < 0 ? -1 : (((bits[p0 * stride + (e >>> 5)] >>> (e & 31)) & 1) ^ flip) === 1 ? 1 : UNDER_SHADE;
      const s1 = p1 < 0 ? s0 : (((bits[p1 * stride + (e >>> 5)] >>> (e & 31)) & 1) ^ flip) === 1 ? 1 : UNDER_SHADE;
      warpAlong[e] = s0 < 0 ? (p1 < 0 ? 1 : s1) : s0 + (s1 - s0) * ys.between[o];
      weftLit[e] = (((bits[row + (e >>> 5)] >>> (e & 31)) & 1) ^ flip) === 1 ? UNDER_SHADE : 1;
    }
    const wo = weftLayer * W;
    const cellRow = pc * ends;
    const out = y * W;
    for (let x = 0; x < W; x++) {
      const ec = xs.cell[x];
      if (ec < 0) continue;
      const et = xs.thread[x];
      const ax = xs.cover[x];
      const up = weftLit[et] !== 1;
      const top = upper ? upper[cellRow + ec] : 1;
      const axTop = endLayer[et] === top ? ax : 0;
      const ayTop = weftLayer === top ? ay : 0;
      const warp = warpBase[et] + level(xs.shade[x] * warpAlong[et]);
      // Most pixels lie wholly inside the end on top: one look-up.
      if (axTop === 1 && (up || ayTop === 0)) {
        words[out + x] = table[warp];
        continue;
      }
      const e0 = xs.before[wo + x];
      const e1 = xs.after[wo + x];
      const w0 = e0 < 0 ? 1 : weftLit[e0];
      const along = e1 < 0 ? w0 : e0 < 0 ? weftLit[e1] : w0 + (weftLit[e1] - w0) * xs.between[wo + x];
      const weft = weftBase[pt] + level(weftShade * along);
      if (ayTop === 1 && (!up || axTop === 0)) {
        words[out + x] = table[weft];
        continue;
      }
      // Edges and gaps: the background, then the layer beneath in its shadow, then the layer on
      // top, each laid over what is there by how much of the pixel it covers (the thread
      // underneath at a crossing first). Written out with plain numbers: this is the hottest loop.
      let r = bgR;
      let g = bgG;
      let b = bgB;
      const below = lower ? lower[cellRow + ec] : top;
      const axLow = below !== top && endLayer[et] === below ? ax : 0;
      const ayLow = below !== top && weftLayer === below ? ay : 0;
      for (let pass = axLow > 0 || ayLow > 0 ? 0 : 1; pass < 2; pass++) {
        const w = pass === 0 ? warpBase[et] + level(xs.shade[x] * warpAlong[et] * LOWER_LAYER_SHADE) : warp;
        const f = pass === 0 ? weftBase[pt] + level(weftShade * along * LOWER_LAYER_SHADE) : weft;
        const wa = pass === 0 ? axLow : axTop;
        const fa = pass === 0 ? ayLow : ayTop;
        const i1 = (up ? f : w) * 4;
        const a1 = up ? fa : wa;
        const i2 = (up ? w : f) * 4;
        const a2 = up ? wa : fa;
        if (a1 > 0) {
          r += (bytes[i1] - r) * a1;
          g += (bytes[i1 + 1] - g) * a1;
          b += (bytes[i1 + 2] - b) * a1;
        }
        if (a2 > 0) {
          r += (bytes[i2] - r) * a2;
          g += (bytes[i2 + 1] - g) * a2;
          b += (bytes[i2 + 2] - b) * a2;
        }
      }
      const i = (out + x) * 4;
      rgba[i] = r;
      rgba[i + 1] = g;
      rgba[i + 2] = b;
    }
  }
  return { width: W, height: H, rgba };
}

