// The thread-by-thread cloth picture, checked pixel by pixel on the buffer it writes: gaps where
// an open sett leaves them, stripe widths from yarn sizes by Ashenhurst's rule, both faces of the
// demo double weave, and area averaging of cells smaller than a pixel.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { doubleWeaveTableMat } from '../../../server/db/seeders/demo-drafts';
import { threadSizesFor, yarnDiametersPerInch } from '../../../shared/plan/thread-sizes';
import { computeDrawdown } from '../../../shared/weave/drawdown';
import { asLists, createDraft, repeat } from '../../../shared/weave';
import { simulateLayers } from '../../../shared/weave/layers';
import { renderCells } from '../../../shared/weave/picture';
import { renderThreads, type ThreadSizes } from '../../../shared/weave/threads';
import type { Draft } from '../../../shared/weave/types';
import { draftArb } from './arbitraries';

const BACKGROUND = '#ffffff';

/** Plain weave on two shafts, `ends` × `picks`, with the given colours, sett and yarns. */
function plainWeave(over: Partial<Parameters<typeof createDraft>[0]> & { ends: number; picks: number }): Draft {
  const { ends, picks, ...rest } = over;
  return createDraft({
    name: 'Plain weave',
    shafts: 2,
    threading: asLists(repeat([1, 2], ends / 2)),
    tieup: [[1], [2]],
    treadling: asLists(repeat([1, 2], picks / 2)),
    palette: ['#1a1a1a', '#d8d0c0'],
    ...rest,
  });
}

/** Yards per pound of a cotton count Ne size/plies: 840 yd per lb × size ÷ plies (ASTM D2260, Table 1). */
const cottonYardsPerPound = (size: number, plies: number) => (840 * size) / plies;
/** Ashenhurst's rule: diameters per inch ≈ 0.9 √(yd/lb) (Ashenhurst, 1880s treatise, as restated in weaving education articles). */
const ashenhurst = (yardsPerPound: number) => 0.9 * Math.sqrt(yardsPerPound);

const rgbAt = (pic: { width: number; rgba: Uint8ClampedArray }, x: number, y: number) => {
  const i = (y * pic.width + x) * 4;
  return [pic.rgba[i], pic.rgba[i + 1], pic.rgba[i + 2]];
};

describe('renderThreads', () => {
  it('leaves the background showing in the gaps of an open sett, exactly where the yarn diameters say', () => {
    // 8/2 cotton: 3360 yd/lb, D ≈ 52.2 per inch by Ashenhurst's rule; at 13 ends and picks per inch
    // (half of the plain-weave maximum of about 26) each thread fills under 1/4 of its space.
    const D = ashenhurst(cottonYardsPerPound(8, 2));
    expect(D).toBeCloseTo(52.17, 1);
    const draft = plainWeave({
      ends: 8,
      picks: 8,
      sett: { warp: 13, weft: 13, unit: 'inch' },
      yarns: [
        { id: 'a', name: 'Cotton 8/2, charcoal', color: 0 },
        { id: 'b', name: '8/2 cotton', color: 1 },
      ],
      warpColors: repeat([0], 8),
      weftColors: repeat([1], 8),
    });
    const sizes = threadSizesFor(draft);
    expect([sizes.warpSource, sizes.weftSource]).toEqual(['yarn names', 'yarn names']);
    expect(1 / sizes.warpDiameters[0]).toBeCloseTo(D, 6);
    expect(1 / sizes.weftDiameters[0]).toBeCloseTo(D, 6);

    const ppi = 13 * 20; // 20 pixels per thread
    const pic = renderThreads({ draft, drawdown: computeDrawdown(draft), sizes }, { face: 'colour', pixelsPerInch: ppi, background: BACKGROUND });
    expect([pic.width, pic.height]).toEqual([160, 160]);
    // Thread k is centred at (k + 0.5) × 20 pixels and is ppi / D ≈ 4.98 pixels wide.
    const half = ppi / D / 2;
    const inGap = (v: number) => [...Array(8).keys()].every((k) => v + 1 <= (k + 0.5) * 20 - half || v >= (k + 0.5) * 20 + half);
    const inThread = (v: number) => [...Array(8).keys()].some((k) => v >= (k + 0.5) * 20 - half && v + 1 <= (k + 0.5) * 20 + half);
    let gaps = 0;
    let threads = 0;
    for (let y = 0; y < pic.height; y++) {
      for (let x = 0; x < pic.width; x++) {
        const c = rgbAt(pic, x, y);
        if (inGap(x) && inGap(y)) {
          gaps++;
          expect(c).toEqual([255, 255, 255]);
        } else if (inThread(x) || inThread(y)) {
          threads++;
          expect(c).not.toEqual([255, 255, 255]);
        }
      }
    }
    // Threads span 7.51–12.49 of every 20 pixels: pixels 0–6 and 13–19 lie wholly in a gap.
    expect(gaps).toBe((8 * 14) ** 2);
    expect(threads).toBeGreaterThan(0);
  });

  it('draws a yarn of twice the diameter as a stripe twice as wide (±1 pixel)', () => {
    // Ne 8/2 (3360 yd/lb) against Ne 2/2 (840 yd/lb): a quarter of the length per pound, so by
    // Ashenhurst's rule (D ∝ √(yd/lb)) twice the diameter.
    expect(ashenhurst(cottonYardsPerPound(8, 2)) / ashenhurst(cottonYardsPerPound(2, 2))).toBeCloseTo(2, 10);
    const draft = plainWeave({
      ends: 8,
      picks: 4,
      palette: ['#000000', '#000001', '#000002'],
      sett: { warp: 10, weft: 4, unit: 'inch' },
      yarns: [
        { id: 'fine', name: 'Cotton 8/2', color: 0 },
        { id: 'thick', name: 'Cotton 2/2', color: 1 },
        { id: 'weft', name: 'Cotton 8/2', color: 2 },
      ],
      warpColors: repeat([0, 1], 4),
      weftColors: repeat([2], 4),
    });
    const sizes = threadSizesFor(draft);
    expect(sizes.warpDiameters[1] / sizes.warpDiameters[0]).toBeCloseTo(2, 10);
    const pic = renderThreads({ draft, drawdown: computeDrawdown(draft), sizes }, { face: 'colour', pixelsPerInch: 500, background: BACKGROUND });
    // Pick spacing 125 pixels, weft under 10 pixels wide: row 5 lies between picks, where only ends show.
    const y = 5;
    // Black threads: a pixel's darkness is how much of it the thread covers, whatever the shading.
    const covered = (x: number) => 1 - rgbAt(pic, x, y)[0] / 255;
    for (let end = 0; end < 8; end += 2) {
      const span = (e: number) => Array.from({ length: 50 }, (_, i) => e * 50 + i);
      const stripe = (e: number) => span(e).filter((x) => covered(x) >= 0.5).length;
      const area = (e: number) => span(e).reduce((s, x) => s + covered(x), 0);
      expect(Math.abs(stripe(end + 1) - 2 * stripe(end))).toBeLessThanOrEqual(1);
      expect(Math.abs(area(end + 1) - 2 * area(end))).toBeLessThanOrEqual(1);
      expect(area(end)).toBeCloseTo(500 / ashenhurst(cottonYardsPerPound(8, 2)), 0);
    }
  });

  it("shows each block's top-layer colours on the front of the demo double weave, and the other layer's on the back, mirrored", () => {
    // Pure colours so each layer is one channel: layer 1 red, layer 2 green and blue.
    const demo = doubleWeaveTableMat();
    const draft = { ...demo, palette: ['#ff0000', '#00ff00', '#0000ff'] };
    const drawdown = computeDrawdown(draft);
    const layers = simulateLayers(draft, undefined, { drawdown });
    const sizes = threadSizesFor(draft);
    const ppi = 160; // 4 pixels per end at 40 ends per inch
    const front = renderThreads({ draft, drawdown, layers, sizes }, { face: 'front', pixelsPerInch: ppi, background: '#000000' });
    const back = renderThreads({ draft, drawdown, layers, sizes }, { face: 'back', pixelsPerInch: ppi, background: '#000000' });
    // The profile (server/db/seeders/demo-drafts): 11 warp blocks alternating 1, 2 by 14 weft
    // blocks alternating 1, 2, 40 threads each; a double-weave block has layer 1 up where the weft
    // row names the end's block (books on loom-controlled double weave; the profile's own rule).
    const warpBlocks = [1, 2, 1, 2, 1, 2, 1, 2, 1, 2, 1];
    const weftBlocks = repeat([1, 2], 7);
    const block = 40 * 4;
    for (let j = 0; j < weftBlocks.length; j++) {
      for (let i = 0; i < warpBlocks.length; i++) {
        const topLayer = warpBlocks[i] === weftBlocks[j] ? 1 : 2;
        for (const [pic, face] of [[front, 'front'], [back, 'back']] as const) {
          // The back is seen turned over: block i sits i blocks from the right, with the other layer up.
          const x0 = face === 'front' ? i * block : pic.width - (i + 1) * block;
          const shown = face === 'front' ? topLayer : 3 - topLayer;
          // Sums of each layer's channel over the block's inside (a few threads in from its edges).
          let layer1 = 0;
          let layer2 = 0;
          let brightestBelow = 0;
          for (let y = j * block + 16; y < (j + 1) * block - 16; y++) {
            for (let x = x0 + 16; x < x0 + block - 16; x++) {
              const [r, g, b] = rgbAt(pic, x, y);
              layer1 += r;
              layer2 += g + b;
              brightestBelow = Math.max(brightestBelow, shown === 1 ? Math.max(g, b) : r);
            }
          }
          const [up, down] = shown === 1 ? [layer1, layer2] : [layer2, layer1];
          expect(up, `${face}, block ${i + 1} × ${j + 1}`).toBeGreaterThan(2 * down);
          // The other layer shows only through the gaps, in the shadow of the layer on top.
          expect(brightestBelow).toBeLessThanOrEqual(Math.ceil(0.6 * 255) + 1);
        }
      }
    }
    // Two 1760 × 2240 pictures checked pixel by pixel: allow for a busy machine (no timing is asserted).
  }, 60_000);

  it('draws any window as the same pixels as that part of the whole picture, on either face and at any zoom', () => {
    fc.assert(
      fc.property(
        draftArb({ maxEnds: 12, maxPicks: 12, maxLayers: 2 }),
        fc.constantFrom<'colour' | 'front' | 'back'>('colour', 'front', 'back'),
        fc.double({ min: 0.3, max: 6, noNaN: true }),
        fc.integer({ min: 1, max: 3 }),
        fc.record({ x: fc.nat(40), y: fc.nat(40), width: fc.integer({ min: 1, max: 30 }), height: fc.integer({ min: 1, max: 30 }) }),
        (draft, face, perEnd, repeats, win) => {
          const drawdown = computeDrawdown(draft);
          const sizes: ThreadSizes = { ...threadSizesFor(draft), endsPerInch: 10, picksPerInch: 12 };
          const input = { draft, drawdown, layers: simulateLayers(draft, undefined, { drawdown }), sizes };
          const options = { face, pixelsPerInch: perEnd * 10, repeats };
          const whole = renderThreads(input, options);
          const part = renderThreads(input, { ...options, window: win });
          expect([part.width, part.height]).toEqual([win.width, win.height]);
          if (perEnd < 1 || perEnd * (12 / 10) < 1) return; // averaged pictures are cut by blocks, not pixels
          for (let y = 0; y < win.height; y++) {
            for (let x = 0; x < win.width; x++) {
              const inside = x + win.x < whole.width && y + win.y < whole.height;
              if (inside) expect(rgbAt(part, x, y)).toEqual(rgbAt(whole, x + win.x, y + win.y));
            }
          }
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe('renderCells', () => {
  it('averages a plain weave finer than a pixel to the mean of its two tones, with no moiré', () => {
    const dark = [0x2b, 0x2f, 0x3a];
    const light = [0xf3, 0xef, 0xe6];
    const word = ([r, g, b]: number[]) => new Uint32Array(new Uint8Array([r, g, b, 255]).buffer)[0];
    const n = 600;
    const cells = new Uint32Array(n * n);
    for (let p = 0; p < n; p++) for (let e = 0; e < n; e++) cells[p * n + e] = (e + p) % 2 ? word(light) : word(dark);
    const mean = dark.map((d, c) => (d + light[c]) / 2);
    // 0.37 pixels per cell: no whole number of cells per pixel, where point sampling beats into a moiré.
    const pic = renderCells(cells, n, n, { cellSize: 0.37 });
    expect([pic.width, pic.height]).toEqual([222, 222]);
    let worst = 0;
    for (let y = 0; y < pic.height - 1; y++) {
      for (let x = 0; x < pic.width - 1; x++) {
        const c = rgbAt(pic, x, y);
        for (let k = 0; k < 3; k++) worst = Math.max(worst, Math.abs(c[k] - mean[k]));
      }
    }
    // A pixel covers 2.7 × 2.7 cells: its partial cells can tip the balance by at most half a cell
    // row and column of 7.3 cells, about 8 % of the difference between the tones.
    expect(worst).toBeLessThanOrEqual(0.08 * (light[0] - dark[0]));
    // Picking one cell per pixel instead would show the pure tones: the test can tell the difference.
    const sampled = renderCells(cells, n, n, { cellSize: 1 });
    expect(rgbAt(sampled, 0, 0)).toEqual(dark);
  });

  it('draws grid lines between cells when they are large enough, and none when small', () => {
    const cells = new Uint32Array([0xffffffff, 0xffffffff, 0xffffffff, 0xffffffff]);
    const big = renderCells(cells, 2, 2, { cellSize: 8 });
    expect(rgbAt(big, 8, 3)[0]).toBeLessThan(255);
    expect(rgbAt(big, 3, 3)).toEqual([255, 255, 255]);
    const small = renderCells(cells, 2, 2, { cellSize: 3 });
    for (let x = 0; x < 6; x++) expect(rgbAt(small, x, 3)).toEqual([255, 255, 255]);
  });
});

describe('yarnDiametersPerInch', () => {
  it('reads counts by Ashenhurst’s rule and wraps per inch as given', () => {
    expect(yarnDiametersPerInch('8/2 cotton')).toBeCloseTo(ashenhurst(3360), 10);
    // 20/2 linen: 300 yd per lb × 20 ÷ 2 = 3000 yd/lb (ASTM D2260, Table 1).
    expect(yarnDiametersPerInch('20/2 linen')).toBeCloseTo(ashenhurst(3000), 10);
    expect(yarnDiametersPerInch('12 wpi')).toBe(12);
    expect(yarnDiametersPerInch('Layer 1')).toBeUndefined();
  });
});
