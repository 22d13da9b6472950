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

/** A number per row of `rows` (`count` rows of `length` values), the same for rows of the same values. */
function classesOf(rows: Uint32Array | Uint8Array, count: number, length: number): Int32Array {
  // Rows are hashed, and a row whose hash was seen is compared in full with the rows seen under it.
  const byHash = new Map<number, number[]>();
  const out = new Int32Array(count);
  let classes = 0;
  for (let i = 0; i < count; i++) {
    const at = i * length;
    let h = 2166136261;
    for (let k = 0; k < length; k++) h = Math.imul(h ^ rows[at + k], 16777619);
    const seen = byHash.get(h);
    let match = -1;
    if (seen) {
      for (const j of seen) {
        let k = 0;
        while (k < length && rows[j * length + k] === rows[at + k]) k++;
        if (k === length) {
          match = j;
          break;
        }
      }
    }
    if (match >= 0) {
      out[i] = out[match];
      continue;
    }
    out[i] = classes++;
    if (seen) seen.push(i);
    else byHash.set(h, [i]);
  }
  return out;
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

/**
 * The picture's columns cut into spans, one per thread space crossed (the pixels whose centres lie
 * in one end's space). A span's pixels are worked out from a few ends only, its `refs`: the end
 * drawn in each pixel and, per weft layer, the ends of that layer either side of it. Spans of the
 * same `shape` (the same widths, shading, colours and layers, reading their refs the same way) are
 * drawn alike in rows of the same kind wherever their refs lie the same way over and under, so
 * each such span is drawn once and copied. Per weft layer l, a span's shape and refs are at
 * l * count + span.
 */
interface Spans {
  count: number;
  start: Int32Array;
  length: Int32Array;
  cell: Int32Array;
  shape: Int32Array;
  refFrom: Int32Array;
  refTo: Int32Array;
  refs: Int32Array;
  /**
   * Per ref: the bits of its end's state the span reads, and how many: all 3 where the span draws
   * that end (its over and under along its length counts), bit 0 alone where only the weft's
   * crossing of it does.
   */
  refMask: Uint8Array;
  refBits: Uint8Array;
  /** Most bits any span's over-and-under state takes. */
  bits: number;
}

/** Float words as their bit patterns, to compare and hash them as integers. */
const bitsOf = (a: Float32Array) => new Uint32Array(a.buffer, a.byteOffset, a.length);

function spansOf(xs: Axis, width: number, layers: number, endLayer: Uint8Array, warpBase: Int32Array): Spans {
  const starts: number[] = [];
  const cells: number[] = [];
  const ends: number[] = [];
  for (let x = 0; x < width; ) {
    const c = xs.cell[x];
    let e = x + 1;
    while (e < width && xs.cell[e] === c) e++;
    if (c >= 0) {
      starts.push(x);
      ends.push(e);
      cells.push(c);
    }
    x = e;
  }
  const count = starts.length;
  const refFrom = new Int32Array((layers + 1) * count);
  const refTo = new Int32Array((layers + 1) * count);
  const refs: number[] = [];
  const wide: number[] = [];
  let widest = 0;
  for (let r = 0; r < count; r++) widest = Math.max(widest, ends[r] - starts[r]);
  // Each span's look: its width, then per pixel 8 numbers, then its refs' widths.
  const lookLength = 1 + 8 * widest + MAX_REFS;
  const looks = new Uint32Array((layers + 1) * count * lookLength);
  const cover = bitsOf(xs.cover);
  const shade = bitsOf(xs.shade);
  const between = bitsOf(xs.between);
  let most = 0;
  for (let l = 0; l <= layers; l++) {
    const wo = l * width;
    for (let r = 0; r < count; r++) {
      const from = refs.length;
      const refOf = (t: number, drawn: boolean) => {
        for (let q = from; q < refs.length; q++) {
          if (refs[q] !== t) continue;
          if (drawn) wide[q] = 1;
          return q - from;
        }
        refs.push(t);
        wide.push(drawn ? 1 : 0);
        return refs.length - 1 - from;
      };
      const x0 = starts[r];
      const n = ends[r] - x0;
      const look = (l * count + r) * lookLength;
      looks[look] = n;
      for (let i = 0; i < n; i++) {
        const x = x0 + i;
        const et = xs.thread[x];
        const e0 = xs.before[wo + x];
        const e1 = xs.after[wo + x];
        const o = look + 1 + 8 * i;
        looks[o] = cover[x];
        looks[o + 1] = shade[x];
        looks[o + 2] = refOf(et, true);
        looks[o + 3] = endLayer[et];
        looks[o + 4] = warpBase[et];
        looks[o + 5] = e0 < 0 ? -1 : refOf(e0, false);
        looks[o + 6] = e1 < 0 ? -1 : refOf(e1, false);
        looks[o + 7] = between[wo + x];
      }
      // The refs' widths, so spans of one shape number their states alike.
      let bits = 0;
      for (let q = from; q < refs.length; q++) {
        if (q - from < MAX_REFS) looks[look + 1 + 8 * widest + q - from] = 1 + wide[q];
        bits += wide[q] === 1 ? 3 : 1;
      }
      if (refs.length - from > MAX_REFS) bits = Infinity;
      most = Math.max(most, bits);
      refFrom[l * count + r] = from;
      refTo[l * count + r] = refs.length;
    }
  }
  return {
    count,
    start: Int32Array.from(starts),
    length: Int32Array.from(ends, (e, r) => e - starts[r]),
    cell: Int32Array.from(cells),
    shape: classesOf(looks, (layers + 1) * count, lookLength),
    refFrom,
    refTo,
    refs: Int32Array.from(refs),
    refMask: Uint8Array.from(wide, (w) => (w === 1 ? 7 : 1)),
    refBits: Uint8Array.from(wide, (w) => (w === 1 ? 3 : 1)),
    bits: most,
  };
}

/** Spans reading more ends than this are drawn pixel by pixel. */
const MAX_REFS = 8;
/** Spans whose state takes more bits than this are drawn pixel by pixel. */
const MAX_STATE_BITS = 20;
/** Largest table of drawn spans kept as a flat array; a larger one is a map. */
const MAX_SLOT_TABLE = 1 << 20;
/** Drawn spans remembered in a map at most (a picture whose spans seldom repeat stops remembering). */
const MAX_SLOT_MAP = 1 << 18;

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
  // Per row, each end's state there: bit 0 set where the row's pick passes under it, bits 1 and
  // 2 where it lies over the picks of its own layer before and after the row.
  const state = new Uint8Array(ends);
  // And, worked out from the state of an end only where a span is drawn (settle): its brightness
  // along its length there (lit over the picks of its layer, graded between them), and how lit
  // the row's pick is where it meets it (lit over an end, shaded under it).
  const warpAlong = new Float32Array(ends);
  const weftLit = new Float32Array(ends);
  // Per layer, for the row: the picks of that layer before and after it, where the row lies
  // between them, and where their rows of the drawdown start.
  const before = new Int32Array(layers + 1);
  const after = new Int32Array(layers + 1);
  const between = new Float32Array(layers + 1);
  const beforeRow = new Int32Array(layers + 1);
  const afterRow = new Int32Array(layers + 1);
  const known = new Uint8Array(layers + 1);
  const flips = back ? 7 : 0;
  const settle = (e: number) => {
    const l = endLayer[e];
    const c = state[e];
    const s0 = before[l] < 0 ? -1 : (c & 2) !== 0 ? 1 : UNDER_SHADE;
    const s1 = after[l] < 0 ? s0 : (c & 4) !== 0 ? 1 : UNDER_SHADE;
    warpAlong[e] = s0 < 0 ? (after[l] < 0 ? 1 : s1) : s0 + (s1 - s0) * between[l];
    weftLit[e] = (c & 1) === 1 ? UNDER_SHADE : 1;
  };
  // Kinds of row. Rows of one kind have the same weft colour, layer, coverage and shading, and lie
  // the same way between the picks of each layer. Rows of one kind that also cross the same rows
  // of the drawdown (their pick's and, per layer, the picks before and after), with the same layers
  // on top and beneath, are the same pixels: cloth repeats, and such a row is drawn once and copied.
  const interlacing = classesOf(bits, picks, stride);
  const above = upper ? classesOf(upper, picks, ends) : null;
  const beneath = lower ? classesOf(lower, picks, ends) : null;
  const kindLength = 3 + 3 * (layers + 1);
  const repeatLength = 4 + 2 * (layers + 1);
  const kindLooks = new Uint32Array(H * kindLength);
  const repeatLooks = new Uint32Array(H * repeatLength);
  const coverBits = bitsOf(ys.cover);
  const shadeBits = bitsOf(ys.shade);
  const betweenBits = bitsOf(ys.between);
  for (let y = 0; y < H; y++) {
    const pt = ys.thread[y];
    if (pt < 0) continue;
    const kind = y * kindLength;
    const repeat = y * repeatLength;
    kindLooks[kind] = weftBase[pt] * 256 + (pl ? pl[pt] : 1);
    kindLooks[kind + 1] = coverBits[y];
    kindLooks[kind + 2] = shadeBits[y];
    repeatLooks[repeat + 1] = interlacing[pt];
    repeatLooks[repeat + 2] = above ? above[ys.cell[y]] : 0;
    repeatLooks[repeat + 3] = beneath ? beneath[ys.cell[y]] : 0;
    for (let l = 0; l <= layers; l++) {
      const o = l * H + y;
      const p0 = ys.before[o];
      const p1 = ys.after[o];
      kindLooks[kind + 3 + 3 * l] = p0 < 0 ? 0 : 1;
      kindLooks[kind + 4 + 3 * l] = p1 < 0 ? 0 : 1;
      kindLooks[kind + 5 + 3 * l] = betweenBits[o];
      repeatLooks[repeat + 4 + 2 * l] = p0 < 0 ? -1 : interlacing[p0];
      repeatLooks[repeat + 5 + 2 * l] = p1 < 0 ? -1 : interlacing[p1];
    }
  }
  const rowKind = classesOf(kindLooks, H, kindLength);
  for (let y = 0; y < H; y++) repeatLooks[y * repeatLength] = rowKind[y];
  const rowRepeat = classesOf(repeatLooks, H, repeatLength);
  const drawnRows = new Int32Array(H).fill(-1);
  // And within rows: a span of a thread space is drawn once per kind of row, shape of span and
  // state of the ends it reads, and copied wherever they come again (see Spans).
  const spans = spansOf(xs, W, layers, endLayer, warpBase);
  let kinds = 0;
  for (let y = 0; y < H; y++) kinds = Math.max(kinds, rowKind[y] + 1);
  let sides = layers + 1;
  for (const faces of [upper, lower]) if (faces) for (let i = 0; i < faces.length; i++) sides = Math.max(sides, faces[i] + 1);
  const shapes = spans.count === 0 ? 0 : Math.max(...spans.shape) + 1;
  const states = spans.bits <= MAX_STATE_BITS ? 2 ** spans.bits * sides * sides : 0;
  const slotCount = kinds * shapes * states;
  const slots = states > 0 && slotCount <= MAX_SLOT_TABLE ? new Int32Array(slotCount) : null;
  const slotMap = states > 0 && !slots ? new Map<number, number>() : null;
  for (let y = 0; y < H; y++) {
    const pc = ys.cell[y];
    if (pc < 0) continue;
    const same = drawnRows[rowRepeat[y]];
    if (same >= 0) {
      words.copyWithin(y * W, same * W, (same + 1) * W);
      continue;
    }
    drawnRows[rowRepeat[y]] = y;
    const pt = ys.thread[y];
    const ay = ys.cover[y];
    const weftLayer = pl ? pl[pt] : 1;
    const weftShade = ys.shade[y];
    for (let l = 0; l <= layers; l++) {
      const o = l * H + y;
      before[l] = ys.before[o];
      after[l] = ys.after[o];
      between[l] = ys.between[o];
      beforeRow[l] = Math.max(0, before[l]) * stride;
      afterRow[l] = Math.max(0, after[l]) * stride;
      known[l] = 1 | (before[l] < 0 ? 0 : 2) | (after[l] < 0 ? 0 : 4);
    }
    const row = pt * stride;
    for (let e = 0; e < ends; e++) {
      const l = endLayer[e];
      const w = e >>> 5;
      const at = e & 31;
      const lie = ((bits[row + w] >>> at) & 1) | (((bits[beforeRow[l] + w] >>> at) & 1) << 1) | (((bits[afterRow[l] + w] >>> at) & 1) << 2);
      state[e] = (lie ^ flips) & known[l];
    }
    if (states === 0) for (let e = 0; e < ends; e++) settle(e);
    const wo = weftLayer * W;
    const cellRow = pc * ends;
    const out = y * W;
    const kindBase = rowKind[y] * shapes;
    const lo = weftLayer * spans.count;
    for (let sp = 0; sp < spans.count; sp++) {
      const x0 = spans.start[sp];
      const x1 = x0 + spans.length[sp];
      const ec = spans.cell[sp];
      const top = upper ? upper[cellRow + ec] : 1;
      const below = lower ? lower[cellRow + ec] : top;
      let slot = -1;
      if (states > 0) {
        let s = 0;
        const from = spans.refFrom[lo + sp];
        const to = spans.refTo[lo + sp];
        for (let q = from; q < to; q++) s = (s << spans.refBits[q]) | (state[spans.refs[q]] & spans.refMask[q]);
        slot = (kindBase + spans.shape[lo + sp]) * states + (s * sides + top) * sides + below;
        const at = slots ? slots[slot] : (slotMap?.get(slot) ?? 0);
        if (at > 0) {
          const n = x1 - x0;
          if (n <= 16) for (let i = 0; i < n; i++) words[out + x0 + i] = words[at - 1 + i];
          else words.copyWithin(out + x0, at - 1, at - 1 + n);
          continue;
        }
        for (let q = from; q < to; q++) settle(spans.refs[q]);
      }
      for (let x = x0; x < x1; x++) {
        const et = xs.thread[x];
        const ax = xs.cover[x];
        const up = weftLit[et] !== 1;
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
        // underneath at a crossing first).
        let r = bgR;
        let g = bgG;
        let b = bgB;
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
      if (slot < 0) continue;
      if (slots) slots[slot] = out + x0 + 1;
      else if (slotMap && slotMap.size < MAX_SLOT_MAP) slotMap.set(slot, out + x0 + 1);
    }
  }
  return { width: W, height: H, rgba };
}
