import { computeDrawdown, type Drawdown } from './drawdown';
import type { Draft } from './types';

/** The cloth in colour: width = ends, height = picks; 0-based (end, pick) as in the drawdown. */
export interface Cloth {
  readonly width: number;
  readonly height: number;
  /** '#rrggbb' of the thread that shows at (end, pick): the warp colour where the end is up, else the weft colour. */
  colorAt(end: number, pick: number): string;
  /** RGBA pixels, one per cell, row p = pick p, column e = end e (ready for ImageData). */
  toRGBA(): Uint8ClampedArray;
}

/** '#rrggbb' → [r, g, b]. */
export function hexToRgb(hex: string): [number, number, number] {
  const n = Number.parseInt(hex.slice(1, 7), 16);
  return [(n >>> 16) & 255, (n >>> 8) & 255, n & 255];
}

/** [r, g, b] (0–255) → '#rrggbb'. */
export function rgbToHex(r: number, g: number, b: number): string {
  return `#${((1 << 24) | (r << 16) | (g << 8) | b).toString(16).slice(1)}`;
}

const littleEndian = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

/** '#rrggbb' as a 32-bit pixel word whose bytes in memory are R, G, B, 255 (for writing ImageData as words). */
export function packedRgba(hex: string): number {
  const [r, g, b] = hexToRgb(hex);
  return (littleEndian ? ((255 << 24) | (b << 16) | (g << 8) | r) : ((r << 24) | (g << 16) | (b << 8) | 255)) >>> 0;
}

/**
 * Renders the draft in its warp and weft colours. Pass a drawdown already computed to avoid
 * computing it again.
 *
 * @example renderCloth(draft).colorAt(0, 0) // '#2b2b33' where end 1 is up on pick 1
 */
export function renderCloth(draft: Draft, drawdown: Drawdown = computeDrawdown(draft)): Cloth {
  const { ends, picks, stride, bits } = drawdown;
  const palette = draft.palette;
  const warp = draft.warpColors;
  const weft = draft.weftColors;
  const up = (end: number, pick: number) => ((bits[pick * stride + (end >>> 5)] >>> (end & 31)) & 1) === 1;
  return {
    width: ends,
    height: picks,
    colorAt(end: number, pick: number): string {
      if (end < 0 || end >= ends || pick < 0 || pick >= picks) throw new RangeError(`no cell at end ${end + 1}, pick ${pick + 1}`);
      return palette[up(end, pick) ? warp[end] : weft[pick]];
    },
    toRGBA(): Uint8ClampedArray {
      const out = new Uint8ClampedArray(ends * picks * 4);
      const words = new Uint32Array(out.buffer);
      const packed = Uint32Array.from(palette, packedRgba);
      const warpPixel = Uint32Array.from(warp, (c) => packed[c]);
      for (let p = 0; p < picks; p++) {
        const weftPixel = packed[weft[p]];
        const row = p * stride;
        const outRow = p * ends;
        for (let w = 0; w < stride; w++) {
          const word = bits[row + w];
          const base = w << 5;
          const n = Math.min(32, ends - base);
          for (let b = 0; b < n; b++) {
            words[outRow + base + b] = (word >>> b) & 1 ? warpPixel[base + b] : weftPixel;
          }
        }
      }
      return out;
    },
  };
}
