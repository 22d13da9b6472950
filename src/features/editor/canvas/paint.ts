import type { Cloth, Drawdown, Float } from '../../../../shared/weave';
import { rowOfShaft } from './layout';
import { THEME } from '@/lib/theme';
import { pixel } from './bitmap';

/** Grid and cloth tones from the theme (src/theme.css): ink on white, a pale weft for the structure. */
export const TONES = {
  mark: pixel(THEME.ink),
  empty: pixel(THEME.surface),
  warpUp: pixel(THEME.clothWarp),
  weftUp: pixel(THEME.clothWeft),
  // Floats over the limit: danger red hatched with ink, so the mark shows without colour vision, on a
  // structure dimmed to light tones.
  floatA: pixel(THEME.danger),
  floatB: pixel(THEME.ink),
  dimUp: pixel(THEME.dimWarp),
  dimDown: pixel(THEME.dimWeft),
};

/** Threading or tie-up: column = end (or treadle), row = shaft as the weaver counts them. */
export function paintShaftColumns(out: Uint32Array, width: number, list: readonly (readonly number[])[], shafts: number, fromTop: boolean): void {
  out.fill(TONES.empty);
  for (let i = 0; i < list.length && i < width; i++) {
    for (const s of list[i]) if (s >= 1 && s <= shafts) out[rowOfShaft(s, shafts, fromTop) * width + i] = TONES.mark;
  }
}

/** Treadling or lift plan: row = pick, column = treadle (or shaft) − 1. */
export function paintPickRows(out: Uint32Array, width: number, list: readonly (readonly number[])[]): void {
  out.fill(TONES.empty);
  for (let p = 0; p < list.length; p++) {
    for (const v of list[p]) if (v >= 1 && v <= width) out[p * width + v - 1] = TONES.mark;
  }
}

/** A colour order, one cell per end or pick; the cells past the last thread stay empty. */
export function paintColorOrder(out: Uint32Array, order: readonly number[], palette: readonly string[]): void {
  out.fill(TONES.empty);
  const words = palette.map(pixel);
  for (let i = 0; i < order.length && i < out.length; i++) out[i] = words[order[i]] ?? TONES.empty;
}

/**
 * Layer tones for the layer rows: dark and light in turn (1 dark blue, 2 light blue, 3 dark green,
 * 4 light green …), so neighbouring layers differ in lightness, not only in hue.
 */
const LAYER_ROW_TONES = THEME.layerRows.map(pixel);

/** A layer row: one cell per end or pick in its layer's tone (an empty list is layer 1 throughout). */
export function paintLayerRow(out: Uint32Array, layers: readonly number[], count: number): void {
  out.fill(TONES.empty);
  for (let i = 0; i < count && i < out.length; i++) out[i] = LAYER_ROW_TONES[((layers.length > 0 ? layers[i % layers.length] : 1) - 1) % LAYER_ROW_TONES.length];
}

/** The interlacement in two tones: warp over, weft over. */
export function paintStructure(out: Uint32Array, dd: Drawdown, up = TONES.warpUp, down = TONES.weftUp): void {
  const { ends, picks, stride, bits } = dd;
  for (let p = 0; p < picks; p++) {
    const row = p * ends;
    for (let w = 0; w < stride; w++) {
      const word = bits[p * stride + w];
      const base = w << 5;
      const n = Math.min(32, ends - base);
      for (let b = 0; b < n; b++) out[row + base + b] = (word >>> b) & 1 ? up : down;
    }
  }
}

/** The cloth in its colours (the engine's renderCloth). */
export function paintCloth(out: Uint32Array, cloth: Cloth): void {
  out.set(new Uint32Array(cloth.toRGBA().buffer));
}

/** The structure dimmed, with every float over the limit hatched across the cells it floats past. */
export function paintFloats(out: Uint32Array, dd: Drawdown, floats: readonly Float[]): void {
  paintStructure(out, dd, TONES.dimUp, TONES.dimDown);
  const { ends, picks } = dd;
  for (const f of floats) {
    const span = f.kind === 'warp' ? picks : ends;
    const length = f.last >= f.start ? f.last - f.start + 1 : span - f.start + f.last + 1;
    for (let k = 0; k < length; k++) {
      const along = (f.start + k) % span;
      const e = f.kind === 'warp' ? f.thread : along;
      const p = f.kind === 'warp' ? along : f.thread;
      out[p * ends + e] = (e + p) % 3 === 0 ? TONES.floatB : TONES.floatA;
    }
  }
}

/** How a layer's cells are patterned in the layer map, so layers never differ by colour alone. */
export type LayerPattern = 'plain' | 'diagonal' | 'across' | 'upright';
const LAYER_PATTERNS: readonly LayerPattern[] = ['plain', 'diagonal', 'across', 'upright'];
const LAYER_WORDS = THEME.layers.map(pixel);
/** The mark of each pattern: ink on the light tones, paper on the dark ones (layers 1 and 3). */
const PATTERN_MARKS = THEME.layers.map((_, i) => pixel(i % 2 === 0 ? THEME.paper : THEME.ink));

/**
 * How layer n (1-based) looks in the layer map: its tone, its pattern and the pattern's mark. Layer 1
 * is dark blue and plain, 2 light with diagonal stripes, 3 dark green with stripes across, 4 light
 * with upright stripes; the layer map's key shows each with its number.
 */
export function layerLook(layer: number): { tone: string; pattern: LayerPattern; mark: string } {
  const i = (layer - 1) % THEME.layers.length;
  return { tone: THEME.layers[i], pattern: LAYER_PATTERNS[i], mark: i % 2 === 0 ? THEME.paper : THEME.ink };
}

/** Whether the cell at end e, pick p carries the mark of a pattern. */
function marked(pattern: LayerPattern, e: number, p: number): boolean {
  if (pattern === 'diagonal') return (e + p) % 4 === 0;
  if (pattern === 'across') return p % 4 === 0;
  if (pattern === 'upright') return e % 4 === 0;
  return false;
}

/** Which layer is on top at each cell, in its tone and pattern (see layerLook). */
export function paintLayerMap(out: Uint32Array, top: Uint8Array, ends: number): void {
  for (let i = 0; i < top.length; i++) {
    const at = (top[i] - 1) % LAYER_WORDS.length;
    const e = i % ends;
    const p = (i - e) / ends;
    out[i] = marked(LAYER_PATTERNS[at], e, p) ? PATTERN_MARKS[at] : LAYER_WORDS[at];
  }
}
