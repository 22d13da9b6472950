import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rgbToHex } from '../../../shared/weave';
import { tickColorOn } from '../../../src/features/editor/components/palette-panel';

describe('the tick on the chosen swatch', () => {
  it('is black on light colours and white on dark ones', () => {
    // Source: WCAG 2.1 relative luminance (from memory): pure yellow is light (L ≈ 0.93), pure blue dark (L ≈ 0.07).
    expect(tickColorOn('#ffffff')).toBe('#000000');
    expect(tickColorOn('#ffff00')).toBe('#000000');
    expect(tickColorOn('#efe6d2')).toBe('#000000');
    expect(tickColorOn('#000000')).toBe('#ffffff');
    expect(tickColorOn('#0000ff')).toBe('#ffffff');
    expect(tickColorOn('#27345c')).toBe('#ffffff');
  });

  it('never turns white when a swatch only gets lighter', () => {
    const channel = fc.integer({ min: 0, max: 255 });
    fc.assert(
      fc.property(fc.tuple(channel, channel, channel), fc.tuple(channel, channel, channel), (a, lift) => {
        const lighter = a.map((c, i) => Math.min(255, c + lift[i])) as [number, number, number];
        if (tickColorOn(rgbToHex(...a)) === '#000000') expect(tickColorOn(rgbToHex(...lighter))).toBe('#000000');
      }),
    );
  });
});
