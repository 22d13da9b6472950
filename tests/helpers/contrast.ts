// Contrast ratios computed by axe-core (Deque), an implementation of the WCAG 2.x formula independent
// of ours: relative luminance of sRGB, then (lighter + 0.05) / (darker + 0.05). Source: WCAG 2.2,
// definitions of "relative luminance" and "contrast ratio"; SC 1.4.3 asks 4.5:1 for text and SC 1.4.11
// 3:1 for the parts of a control or picture that carry meaning.
import axe from 'axe-core';

type Rgb = readonly [number, number, number];
interface AxeColourApi {
  Color: new (red: number, green: number, blue: number, alpha: number) => object;
  getContrast(a: object, b: object): number;
}
// axe-core's types leave out `commons.color`, which its own rules use.
const colour = (axe.commons as unknown as { color: AxeColourApi }).color;

function rgbOf(c: string | Rgb): Rgb {
  if (typeof c !== 'string') return c;
  const hex = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(c);
  if (!hex) throw new Error(`not a #rrggbb colour: ${c}`);
  return [parseInt(hex[1], 16), parseInt(hex[2], 16), parseInt(hex[3], 16)];
}

/** The WCAG contrast ratio of two opaque colours, given as `#rrggbb` or [r, g, b]. */
export function contrastRatio(a: string | Rgb, b: string | Rgb): number {
  const [x, y] = [rgbOf(a), rgbOf(b)].map(([r, g, bl]) => new colour.Color(r, g, bl, 1));
  return colour.getContrast(x, y);
}
