import type { Cloth, Drawdown, Float } from '../../../../shared/weave';
import { rowOfShaft } from './layout';
import { pixel } from './bitmap';

/** Grid and cloth tones from the app theme (src/index.css): ink on white, paper for the structure's weft. */
export const TONES = {
  mark: pixel('#1e2126'),
  empty: pixel('#ffffff'),
  warpUp: pixel('#2b2f3a'),
  weftUp: pixel('#f3efe6'),
  // Floats over the limit: danger red hatched with ink, so the mark shows without colour vision, on a
  // structure dimmed to light tones: red is 3.8:1 against the lighter of them (WCAG SC 1.4.11 asks 3:1).
  floatA: pixel('#a12a1f'),
  floatB: pixel('#1e2126'),
  dimUp: pixel('#b8babf'),
  dimDown: pixel('#faf8f3'),
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
const LAYER_ROW_TONES = ['#2f44b0', '#a9b3e6', '#1f6a3b', '#a3cfb0', '#7a3b12', '#e3b98f', '#4b2a6b', '#c8b2de'].map(pixel);

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

/** The layer map's tones, layer 1 first; even layers are light and carry a diagonal stripe. */
const LAYER_TONES = ['#2f44b0', '#e9ecfa', '#1f6a3b', '#f3efe6'];
const LAYER_WORDS = LAYER_TONES.map(pixel);

/** How layer n (1-based) looks in the layer map: its tone, and whether it is striped. */
export function layerLook(layer: number): { tone: string; striped: boolean } {
  return { tone: LAYER_TONES[(layer - 1) % LAYER_TONES.length], striped: layer % 2 === 0 };
}

/**
 * Which layer is on top at each cell. Layer 1 solid, layer 2 light with a diagonal stripe, and so
 * on: the stripe tells the layers apart without colour.
 */
export function paintLayerMap(out: Uint32Array, top: Uint8Array, ends: number): void {
  for (let i = 0; i < top.length; i++) {
    const layer = top[i];
    const e = i % ends;
    const p = (i - e) / ends;
    const striped = layer % 2 === 0 && (e + p) % 4 === 0;
    out[i] = striped ? TONES.mark : LAYER_WORDS[(layer - 1) % LAYER_WORDS.length];
  }
}
