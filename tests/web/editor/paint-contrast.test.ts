// The canvas views carry meaning in their tones; these checks hold the tones to WCAG 2.2 SC 1.4.11
// (3:1 for what must be told apart), computed by axe-core's contrast (tests/helpers/contrast.ts).
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { layerLook, paintLayerMap, TONES } from '../../../src/features/editor/canvas/paint';
import { THEME } from '../../../src/lib/theme';
import { contrastRatio } from '../../helpers/contrast';

/** The red, green and blue of a canvas pixel word (its bytes are RGBA in memory on any machine). */
function rgbOf(word: number): [number, number, number] {
  const [r, g, b] = new Uint8Array(new Uint32Array([word]).buffer);
  return [r, g, b];
}

describe('the floats view', () => {
  it('marks floats over the limit at least 3:1 from the dimmed structure, in both tones of the hatch', () => {
    for (const float of [TONES.floatA, TONES.floatB]) {
      for (const dimmed of [TONES.dimUp, TONES.dimDown]) {
        expect(contrastRatio(rgbOf(float), rgbOf(dimmed))).toBeGreaterThanOrEqual(3);
      }
    }
    // The pair that once sat too close: the red against the dimmed warp was 2.2:1.
    expect(contrastRatio(rgbOf(TONES.floatA), rgbOf(TONES.dimUp))).toBeCloseTo(3.77, 2);
  });

  it('still shows the structure under the floats, and the hatch inside a float', () => {
    expect(contrastRatio(rgbOf(TONES.dimUp), rgbOf(TONES.dimDown))).toBeGreaterThan(1.5);
    expect(contrastRatio(rgbOf(TONES.floatA), rgbOf(TONES.floatB))).toBeGreaterThan(1.5);
  });
});

describe('the layer map', () => {
  it('never tells two layers apart by colour alone: each of the first four has its own pattern', () => {
    const looks = [1, 2, 3, 4].map(layerLook);
    expect(new Set(looks.map((l) => l.pattern)).size).toBe(4);
    // The pair that once differed by colour alone: layers 1 and 3 were both plain, dark blue against dark green at 1.24:1.
    expect(contrastRatio(looks[0].tone, looks[2].tone)).toBeCloseTo(1.24, 2);
    expect(looks[0].pattern).not.toBe(looks[2].pattern);
  });

  it('draws the stripes of each pattern at least 3:1 against the tone of its layer', () => {
    for (const look of [2, 3, 4].map(layerLook)) expect(contrastRatio(look.mark, look.tone)).toBeGreaterThanOrEqual(3);
    expect(contrastRatio(layerLook(3).mark, layerLook(3).tone)).toBeCloseTo(6.11, 2);
  });

  it('paints layer 3 with stripes across every fourth pick and layer 1 plain', () => {
    const ends = 4;
    const top = new Uint8Array([1, 1, 1, 1, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3]);
    const out = new Uint32Array(top.length);
    paintLayerMap(out, top, ends);
    const tone = (n: number) => rgbOf(out[n]).join(',');
    expect(new Set([0, 1, 2, 3].map(tone)).size).toBe(1);
    // Picks 2 to 5 are layer 3: pick 5 (index 4) is a stripe, picks 2 to 4 are its tone.
    expect(tone(4)).toBe(tone(8));
    expect(tone(16)).not.toBe(tone(8));
    expect(tone(16)).toBe(tone(17));
  });
});

describe('the grids', () => {
  it('draws the line every fourth (or eighth, or tenth) thread at least 3:1 against the empty cells', () => {
    expect(contrastRatio(THEME.field, THEME.surface)).toBeGreaterThanOrEqual(3);
    expect(contrastRatio(THEME.field, THEME.surface)).toBeCloseTo(4.45, 2);
  });
});

describe('the theme', () => {
  it('gives the painters the colours src/theme.css defines, the file the screens are styled from', () => {
    const css = readFileSync('src/theme.css', 'utf8');
    const defined = (name: string) => new RegExp(`--color-${name}:\\s*(#[0-9a-f]{6})`, 'i').exec(css)?.[1].toLowerCase();
    expect(THEME.ink).toBe(defined('ink'));
    expect(THEME.clothWarp).toBe(defined('cloth-warp'));
    expect(THEME.layers[2]).toBe(defined('layer-3'));
    expect(rgbOf(TONES.mark)).toEqual([0x1e, 0x21, 0x26]);
  });
});
