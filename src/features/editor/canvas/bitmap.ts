import { hexToRgb } from '../../../../shared/weave';

const littleEndian = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

/** '#rrggbb' as one pixel word (bytes R, G, B, A in memory), for writing into ImageData words. */
export function pixel(hex: string): number {
  const [r, g, b] = hexToRgb(hex);
  return (littleEndian ? (255 << 24) | (b << 16) | (g << 8) | r : (r << 24) | (g << 16) | (b << 8) | 255) >>> 0;
}

type Canvas2D = HTMLCanvasElement;

/** A box of cells (inclusive corners). */
export interface CellBox {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/**
 * One grid painted as one bitmap, a pixel per cell; Konva draws it scaled up without smoothing.
 * Each paint writes into a scratch buffer and copies to the canvas only the box of pixels that
 * changed, so toggling one cell of a 1000 × 1000 drawdown uploads a column, not the whole image.
 */
export class GridBitmap {
  readonly canvas: Canvas2D;
  private ctx: CanvasRenderingContext2D | null;
  private image: ImageData | null = null;
  private words = new Uint32Array(0);
  private scratch = new Uint32Array(0);
  width = 0;
  height = 0;
  /** The cells the last paint or patch changed (all of them after a resize), so a view can redraw just those. */
  changed: CellBox | null = null;

  constructor() {
    this.canvas = document.createElement('canvas');
    this.ctx = this.canvas.getContext('2d');
  }

  /**
   * Repaints through `fill`, which writes every pixel of a width × height word buffer (row-major).
   * Returns true when any pixel changed.
   */
  paint(width: number, height: number, fill: (out: Uint32Array) => void): boolean {
    const w = Math.max(1, width);
    const h = Math.max(1, height);
    const resized = w !== this.width || h !== this.height || !this.image || this.scratch.length !== w * h;
    if (resized) {
      this.width = w;
      this.height = h;
      this.canvas.width = w;
      this.canvas.height = h;
      this.image = this.ctx ? this.ctx.createImageData(w, h) : null;
      this.words = this.image ? new Uint32Array(this.image.data.buffer) : new Uint32Array(w * h);
      this.scratch = new Uint32Array(w * h);
    }
    this.scratch.fill(0);
    fill(this.scratch);
    const src = this.scratch;
    const dst = this.words;
    let x0 = w;
    let y0 = h;
    let x1 = -1;
    let y1 = -1;
    for (let y = 0; y < h; y++) {
      const row = y * w;
      for (let x = 0; x < w; x++) {
        const v = src[row + x];
        if (v !== dst[row + x]) {
          dst[row + x] = v;
          if (x < x0) x0 = x;
          if (x > x1) x1 = x;
          if (y < y0) y0 = y;
          y1 = y;
        }
      }
    }
    if (x1 < 0 && !resized) return false;
    this.changed = resized ? { x0: 0, y0: 0, x1: w - 1, y1: h - 1 } : { x0, y0, x1, y1 };
    if (this.ctx && this.image) {
      if (resized) this.ctx.putImageData(this.image, 0, 0);
      else this.ctx.putImageData(this.image, 0, 0, x0, y0, x1 - x0 + 1, y1 - y0 + 1);
    }
    return true;
  }

  /**
   * Changes a few pixels in place: `write(set)` calls `set(x, y, word)` for each; only the box they
   * span is uploaded. For edits that know exactly which cells changed.
   */
  patch(write: (set: (x: number, y: number, word: number) => void) => void): boolean {
    const w = this.width;
    const words = this.words;
    let x0 = w;
    let y0 = this.height;
    let x1 = -1;
    let y1 = -1;
    write((x, y, word) => {
      const i = y * w + x;
      if (words[i] === word) return;
      words[i] = word;
      if (x < x0) x0 = x;
      if (x > x1) x1 = x;
      if (y < y0) y0 = y;
      if (y > y1) y1 = y;
    });
    if (x1 < 0) return false;
    this.changed = { x0, y0, x1, y1 };
    if (this.ctx && this.image) this.ctx.putImageData(this.image, 0, 0, x0, y0, x1 - x0 + 1, y1 - y0 + 1);
    return true;
  }

  /**
   * Shows a finished picture (pixel words, row-major, as `ImageData` wants them) in one upload,
   * taking the buffer over instead of copying it: for pictures worked out elsewhere (a worker).
   */
  show(width: number, height: number, pixels: Uint32Array<ArrayBuffer>): void {
    this.width = width;
    this.height = height;
    this.canvas.width = width;
    this.canvas.height = height;
    this.words = pixels;
    this.scratch = new Uint32Array(0);
    this.changed = { x0: 0, y0: 0, x1: width - 1, y1: height - 1 };
    this.image = this.ctx && width > 0 && height > 0 ? new ImageData(new Uint8ClampedArray(pixels.buffer, pixels.byteOffset, pixels.byteLength), width, height) : null;
    if (this.ctx && this.image) this.ctx.putImageData(this.image, 0, 0);
  }

  /** The pixel word at (x, y), for tests and checks. */
  pixelAt(x: number, y: number): number {
    return this.words[y * this.width + x] ?? 0;
  }
}
