import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { hexToRgb, renderCloth, rgbToHex } from '../../../shared/weave/cloth';
import { computeDrawdown } from '../../../shared/weave/drawdown';
import { draftArb } from './arbitraries';

describe('renderCloth', () => {
  it('shows the warp colour where the end is up and the weft colour elsewhere, in colorAt and toRGBA alike', () => {
    fc.assert(
      fc.property(draftArb({ maxEnds: 40 }), (draft) => {
        const dd = computeDrawdown(draft);
        const cloth = renderCloth(draft);
        const rgba = cloth.toRGBA();
        expect([cloth.width, cloth.height, rgba.length]).toEqual([dd.ends, dd.picks, dd.ends * dd.picks * 4]);
        const expectedHex: string[] = [];
        const expectedBytes: number[] = [];
        const seenHex: string[] = [];
        for (let p = 0; p < dd.picks; p++) {
          for (let e = 0; e < dd.ends; e++) {
            const hex = draft.palette[dd.isUp(e, p) ? draft.warpColors[e] : draft.weftColors[p]];
            expectedHex.push(hex);
            expectedBytes.push(...hexToRgb(hex), 255);
            seenHex.push(cloth.colorAt(e, p));
          }
        }
        expect(seenHex).toEqual(expectedHex);
        expect([...rgba]).toEqual(expectedBytes);
      }),
    );
  });

  it('converts colours both ways', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 0xffffff }), (n) => {
      const hex = `#${n.toString(16).padStart(6, '0')}`;
      expect(rgbToHex(...hexToRgb(hex))).toBe(hex);
    }));
  });
});
