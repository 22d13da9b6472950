import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeDrawdown, expandProfile, hexToRgb, renderThreads, simulateLayers } from '../../../shared/weave';
import { threadSizesFor } from '../../../shared/plan';
import { encodePngRgb } from '../../../server/print/png';
import { renderDrawdownPng } from '../../../server/print/drawdown-png';
import { openBrowser, type Browser } from '../../helpers/e2e';
import { doubleWeaveProfile } from '../../helpers/draft-fixtures';
import { checkerboard, HARBOUR, MUSTARD } from '../../helpers/print-fixtures';

/**
 * The independent reader: headless Chromium decodes the PNG in an <img>, draws it on a canvas
 * and hands back the pixels (RGBA).
 */
let browser: Browser;
beforeAll(async () => {
  browser = await openBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function decode(png: Buffer): Promise<{ width: number; height: number; rgba: number[] }> {
  return browser.page.evaluate(async (b64) => {
    const img = new Image();
    img.src = `data:image/png;base64,${b64}`;
    await img.decode();
    const canvas = document.createElement('canvas');
    canvas.width = img.naturalWidth;
    canvas.height = img.naturalHeight;
    const g = canvas.getContext('2d')!;
    g.drawImage(img, 0, 0);
    return { width: canvas.width, height: canvas.height, rgba: Array.from(g.getImageData(0, 0, canvas.width, canvas.height).data) };
  }, png.toString('base64'));
}

const at = (d: { width: number; rgba: number[] }, x: number, y: number) => d.rgba.slice((y * d.width + x) * 4, (y * d.width + x) * 4 + 3);

describe('encodePngRgb', () => {
  it('writes PNGs that Chromium decodes to the same pixels', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.integer({ min: 1, max: 40 }).chain((w) =>
          fc.integer({ min: 1, max: 40 }).chain((h) => fc.uint8Array({ minLength: w * h * 3, maxLength: w * h * 3 }).map((rgb) => ({ w, h, rgb }))),
        ),
        async ({ w, h, rgb }) => {
          const d = await decode(encodePngRgb(w, h, rgb));
          expect([d.width, d.height]).toEqual([w, h]);
          const expected: number[] = [];
          for (let i = 0; i < w * h; i++) expected.push(rgb[i * 3], rgb[i * 3 + 1], rgb[i * 3 + 2], 255);
          expect(d.rgba).toEqual(expected);
        },
      ),
      { numRuns: 12 },
    );
  });

  it('refuses an image with no pixels or the wrong amount of data', () => {
    expect(() => encodePngRgb(0, 1, new Uint8Array(0))).toThrow(RangeError);
    expect(() => encodePngRgb(2, 2, new Uint8Array(5))).toThrow(RangeError);
  });
});

describe('renderDrawdownPng', () => {
  it('draws the plain-weave checkerboard thread by thread, ends `scale` pixels apart, end 1 on the right and pick 1 on top by default', async () => {
    const ends = 6;
    const picks = 5;
    const scale = 8;
    const draft = checkerboard(ends, picks);
    const sizes = threadSizesFor(draft);
    const pitchY = (scale * sizes.endsPerInch) / sizes.picksPerInch;
    const d = await decode(renderDrawdownPng(draft, { view: 'colour', scale, endOneRight: true }));
    expect([d.width, d.height]).toEqual([ends * scale, Math.ceil(picks * pitchY)]);
    const distance = (a: number[], b: number[]) => a.reduce((s, v, i) => s + (v - b[i]) ** 2, 0);
    for (let e = 0; e < ends; e++) {
      for (let p = 0; p < picks; p++) {
        // Plain weave: end e is up on pick p when both are even or both odd (end 1 on shaft 1, pick 1
        // lifts shaft 1); the thread on top shows at the crossing's middle, shaded but of its own colour.
        const [shown, hidden] = (e + p) % 2 === 0 ? [HARBOUR, MUSTARD] : [MUSTARD, HARBOUR];
        const c = at(d, (ends - 1 - e) * scale + scale / 2, Math.floor((p + 0.5) * pitchY));
        const scaled = (hex: string) => {
          const rgb = hexToRgb(hex);
          const k = c.reduce((s, v, i) => s + v * rgb[i], 0) / rgb.reduce((s, v) => s + v * v, 0);
          return rgb.map((v) => v * k);
        };
        expect(distance(c, scaled(shown))).toBeLessThan(distance(c, scaled(hidden)));
      }
    }
  });

  it('draws the structure in black and white, and follows the arrangement when asked', async () => {
    const d = await decode(renderDrawdownPng(checkerboard(4, 4), { view: 'structure', scale: 1, endOneRight: false, threadingAbove: false }));
    // End 1 on the left, pick 1 at the bottom: end 1 is up on pick 1.
    expect(at(d, 0, 3)).toEqual([0, 0, 0]);
    expect(at(d, 1, 3)).toEqual([255, 255, 255]);
    expect(at(d, 0, 2)).toEqual([255, 255, 255]);
  });

  it('shows the faces of a double weave drawn thread by thread, the back mirrored as seen turned over', async () => {
    const draft = expandProfile(doubleWeaveProfile(), 'double-weave');
    const drawdown = computeDrawdown(draft);
    const input = { draft, drawdown, layers: simulateLayers(draft, undefined, { drawdown }), sizes: threadSizesFor(draft) };
    const drawn = (face: 'front' | 'back', endOneRight: boolean) => {
      const pic = renderThreads(input, { face, pixelsPerInch: 3 * input.sizes.endsPerInch, endOneRight });
      return { width: pic.width, height: pic.height, rgba: Array.from(pic.rgba) };
    };
    for (const face of ['front', 'back'] as const) {
      for (const endOneRight of [true, false]) {
        const d = await decode(renderDrawdownPng(draft, { view: face, scale: 3, endOneRight }));
        expect(d).toEqual(drawn(face, endOneRight));
      }
    }
  });

  it('refuses a bad scale, an oversized picture and a face of a one-layer cloth', () => {
    const draft = checkerboard(4, 4);
    expect(() => renderDrawdownPng(draft, { view: 'colour', scale: 0 })).toThrow(RangeError);
    expect(() => renderDrawdownPng(draft, { view: 'colour', scale: 1.5 })).toThrow(RangeError);
    expect(() => renderDrawdownPng(checkerboard(2000, 2000), { view: 'colour', scale: 4 })).toThrow(RangeError);
    expect(() => renderDrawdownPng(draft, { view: 'front', scale: 2 })).toThrow(/more than one layer/);
  });
});
