import { packedRgba } from './cloth';

/** A rectangle of a picture, in its pixels: the part a view shows. */
export interface Window {
  x: number;
  y: number;
  width: number;
  height: number;
}

/**
 * Averages each k × k block of an RGBA picture into one pixel (a box filter), for pictures drawn
 * k times larger than shown. Width and height should be multiples of k; a ragged edge is dropped.
 */
export function boxAverage(rgba: Uint8ClampedArray, width: number, height: number, k: number): Uint8ClampedArray<ArrayBuffer> {
  const w = Math.floor(width / k);
  const h = Math.floor(height / k);
  const out = new Uint8ClampedArray(w * h * 4);
  const sums = new Float64Array(w * 4);
  const area = k * k;
  for (let y = 0; y < h; y++) {
    sums.fill(0);
    for (let dy = 0; dy < k; dy++) {
      const row = (y * k + dy) * width * 4;
      for (let x = 0, i = row; x < w; x++) {
        const s = x * 4;
        for (let dx = 0; dx < k; dx++, i += 4) {
          sums[s] += rgba[i];
          sums[s + 1] += rgba[i + 1];
          sums[s + 2] += rgba[i + 2];
          sums[s + 3] += rgba[i + 3];
        }
      }
    }
    const o = y * w * 4;
    for (let i = 0; i < w * 4; i++) out[o + i] = sums[i] / area;
  }
  return out;
}

export interface CellPictureOptions {
  /** Pixels per cell side; below 1, each pixel is the average of the cells it covers. */
  cellSize: number;
  /** Repeats of the cells across and down. Default 1. */
  repeats?: number;
  /** The part of the picture to draw; the whole picture by default. */
  window?: Window;
  /** Outside the repeats. */
  background?: string;
}

/** Cells at least this many pixels wide get grid lines between them. */
export const GRID_LINE_MIN_CELL = 6;
/** How dark a grid line makes the pixels it crosses (their brightness is multiplied by this). */
const GRID_LINE_SHADE = 0.72;

/** The whole picture's size in pixels for `cells` at `cellSize`. */
export function cellPictureSize(width: number, height: number, cellSize: number, repeats = 1): { width: number; height: number } {
  return { width: Math.ceil(width * repeats * cellSize), height: Math.ceil(height * repeats * cellSize) };
}

/**
 * Draws a picture of one colour per cell (pixel words, `width` × `height`, row-major) at any
 * size, so it reads at every zoom: large cells get grid lines between them, and a cell smaller
 * than a pixel is averaged with its neighbours over the pixel's area (a fine plain weave turns to
 * the mean of its two tones, never to a moiré).
 *
 * @example renderCells(structure, 440, 560, { cellSize: 0.25 }) // 110 × 140 averaged pixels
 */
export function renderCells(cells: Uint32Array, width: number, height: number, options: CellPictureOptions): { width: number; height: number; rgba: Uint8ClampedArray<ArrayBuffer> } {
  const repeats = Math.max(1, Math.floor(options.repeats ?? 1));
  const s = options.cellSize;
  const whole = cellPictureSize(width, height, s, repeats);
  const win = options.window ?? { x: 0, y: 0, width: whole.width, height: whole.height };
  const W = Math.max(0, Math.floor(win.width));
  const H = Math.max(0, Math.floor(win.height));
  const rgba = new Uint8ClampedArray(W * H * 4);
  const words = new Uint32Array(rgba.buffer);
  words.fill(packedRgba(options.background ?? '#ffffff'));
  const cols = width * repeats;
  const rows = height * repeats;
  if (W === 0 || H === 0 || cols === 0 || rows === 0) return { width: W, height: H, rgba };
  const x0 = Math.floor(win.x);
  const y0 = Math.floor(win.y);
  if (s >= 1) {
    const cellOfX = Int32Array.from({ length: W }, (_, i) => Math.floor((x0 + i + 0.5) / s));
    const lineX = Uint8Array.from({ length: W }, (_, i) => (s >= GRID_LINE_MIN_CELL && Math.floor(cellOfX[i] * s) === x0 + i ? 1 : 0));
    for (let y = 0; y < H; y++) {
      const r = Math.floor((y0 + y + 0.5) / s);
      if (r < 0 || r >= rows) continue;
      const src = (r % height) * width;
      const lineY = s >= GRID_LINE_MIN_CELL && Math.floor(r * s) === y0 + y;
      const out = y * W;
      for (let x = 0; x < W; x++) {
        const c = cellOfX[x];
        if (c < 0 || c >= cols) continue;
        words[out + x] = cells[src + (c % width)];
        if (lineY || lineX[x]) {
          const i = (out + x) * 4;
          rgba[i] *= GRID_LINE_SHADE;
          rgba[i + 1] *= GRID_LINE_SHADE;
          rgba[i + 2] *= GRID_LINE_SHADE;
        }
      }
    }
    return { width: W, height: H, rgba };
  }
  averageCells(cells, width, height, cols, rows, s, x0, y0, W, H, rgba);
  return { width: W, height: H, rgba };
}

/** For each of `n` pixels from `start`: the cells it covers and how much of it each covers. */
function coverage(start: number, n: number, s: number, cells: number): { first: Int32Array; count: Int32Array; weights: Float64Array; span: number } {
  const span = Math.ceil(1 / s) + 1;
  const first = new Int32Array(n);
  const count = new Int32Array(n);
  const weights = new Float64Array(n * span);
  for (let i = 0; i < n; i++) {
    const a = (start + i) / s;
    const b = (start + i + 1) / s;
    const c0 = Math.max(0, Math.floor(a));
    const c1 = Math.min(cells - 1, Math.ceil(b) - 1);
    first[i] = c0;
    count[i] = Math.max(0, c1 - c0 + 1);
    for (let c = c0; c <= c1; c++) weights[i * span + c - c0] = (Math.min(b, c + 1) - Math.max(a, c)) * s;
  }
  return { first, count, weights, span };
}

/**
 * Area averaging in two passes: each cell row is averaged across into the pixel columns, then the
 * rows into the pixel rows. Weights are the exact share of the pixel each cell covers; a pixel
 * partly past the last cell gets the background for the rest.
 */
function averageCells(cells: Uint32Array, width: number, height: number, cols: number, rows: number, s: number, x0: number, y0: number, W: number, H: number, rgba: Uint8ClampedArray): void {
  const cx = coverage(x0, W, s, cols);
  const cy = coverage(y0, H, s, rows);
  const bytes = new Uint8Array(cells.buffer, cells.byteOffset, cells.byteLength);
  const bg = [rgba[0], rgba[1], rgba[2]];
  const across = new Float64Array(W * 3);
  const sums = new Float64Array(W * 3);
  for (let y = 0; y < H; y++) {
    if (cy.count[y] === 0) continue;
    sums.fill(0);
    let rowWeight = 0;
    for (let k = 0; k < cy.count[y]; k++) {
      const wy = cy.weights[y * cy.span + k];
      rowWeight += wy;
      const src = ((cy.first[y] + k) % height) * width;
      for (let x = 0; x < W; x++) {
        const n = cx.count[x];
        let r = 0;
        let g = 0;
        let b = 0;
        for (let j = 0, o = x * cx.span; j < n; j++) {
          const i = (src + ((cx.first[x] + j) % width)) * 4;
          const w = cx.weights[o + j];
          r += bytes[i] * w;
          g += bytes[i + 1] * w;
          b += bytes[i + 2] * w;
        }
        across[x * 3] = r;
        across[x * 3 + 1] = g;
        across[x * 3 + 2] = b;
      }
      for (let i = 0; i < W * 3; i++) sums[i] += across[i] * wy;
    }
    for (let x = 0; x < W; x++) {
      let colWeight = 0;
      for (let j = 0; j < cx.count[x]; j++) colWeight += cx.weights[x * cx.span + j];
      const rest = 1 - colWeight * rowWeight;
      const o = (y * W + x) * 4;
      for (let c = 0; c < 3; c++) rgba[o + c] = sums[x * 3 + c] + bg[c] * rest;
    }
  }
}
