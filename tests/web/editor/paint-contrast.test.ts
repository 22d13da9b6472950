// The canvas views carry meaning in their tones; these checks hold the tones to WCAG 2.2 SC 1.4.11
// (3:1 for what must be told apart), computed by axe-core's contrast (tests/helpers/contrast.ts).
import { describe, expect, it } from 'vitest';
import { TONES } from '../../../src/features/editor/canvas/paint';
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
    // The case found by hand: the red against the dimmed warp was 2.2:1.
    expect(contrastRatio(rgbOf(TONES.floatA), rgbOf(TONES.dimUp))).toBeCloseTo(3.77, 2);
  });

  it('still shows the structure under the floats, and the hatch inside a float', () => {
    expect(contrastRatio(rgbOf(TONES.dimUp), rgbOf(TONES.dimDown))).toBeGreaterThan(1.5);
    expect(contrastRatio(rgbOf(TONES.floatA), rgbOf(TONES.floatB))).toBeGreaterThan(1.5);
  });
});
