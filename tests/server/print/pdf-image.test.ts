import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { GridPlacement } from '../../../shared/print/draft-layout';
import { markBits } from '../../../server/print/pdf-image';

const bitAt = (img: { width: number; bits: Uint8Array }, x: number, y: number) => {
  const rowBytes = Math.ceil(img.width / 8);
  return (img.bits[y * rowBytes + (x >> 3)] >> (7 - (x & 7))) & 1;
};

describe('markBits', () => {
  it('sets the middle of every marked cell, clears unmarked cells and every cell border, and follows the flips', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 30 }),
        fc.integer({ min: 1, max: 12 }),
        fc.boolean(),
        fc.boolean(),
        fc.integer({ min: 3, max: 8 }),
        fc.integer({ min: 0, max: 2 ** 31 - 1 }),
        (cols, rows, flipX, flipY, scale, seed) => {
          const inset = 1;
          const g: GridPlacement = { x0: 0, y0: 0, stepX: flipX ? -1 : 1, stepY: flipY ? -1 : 1, cols, rows, cell: 1 };
          // A deterministic pseudo-random set of marked cells.
          const marked = (c: number, r: number) => ((c * 7919 + r * 104729 + seed) % 5) < 2;
          const img = markBits(g, scale, inset, marked);
          expect(img.width).toBe(cols * scale);
          expect(img.height).toBe(rows * scale);
          const wrong: string[] = [];
          for (let pr = 0; pr < rows; pr++) {
            for (let pc = 0; pc < cols; pc++) {
              // The picture's cell (pc, pr) is the grid's cell counted from the other side when flipped.
              const c = flipX ? cols - 1 - pc : pc;
              const r = flipY ? rows - 1 - pr : pr;
              for (let ky = 0; ky < scale; ky++) {
                for (let kx = 0; kx < scale; kx++) {
                  const border = kx < inset || ky < inset || kx >= scale - inset || ky >= scale - inset;
                  if (bitAt(img, pc * scale + kx, pr * scale + ky) !== (!border && marked(c, r) ? 1 : 0)) wrong.push(`${pc * scale + kx},${pr * scale + ky}`);
                }
              }
            }
          }
          expect(wrong).toEqual([]);
        },
      ),
      { numRuns: 60 },
    );
  });
});
