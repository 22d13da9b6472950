import themeCss from '../theme.css?raw';

/**
 * The theme's colours as the canvas painters need them, read from src/theme.css, the one place they
 * are written (the screens' CSS uses the same file through Tailwind).
 */
const COLOURS = new Map([...themeCss.matchAll(/--color-([a-z0-9-]+):\s*(#[0-9a-f]{6})\b/gi)].map((m) => [m[1], m[2].toLowerCase()]));

/** The `#rrggbb` of a theme colour, by its name in src/theme.css without `--color-` (`ink`, `layer-1`). */
export function themeColour(name: string): string {
  const value = COLOURS.get(name);
  // NOTE: a missing name is a typo or a colour removed from theme.css; say so at load rather than paint black.
  if (!value) throw new Error(`src/theme.css has no --color-${name}`);
  return value;
}

/** The theme colours the canvas paints with, by name. */
export const THEME = {
  ink: themeColour('ink'),
  muted: themeColour('muted'),
  surface: themeColour('surface'),
  paper: themeColour('paper'),
  line: themeColour('line'),
  field: themeColour('field'),
  accent: themeColour('accent'),
  danger: themeColour('danger'),
  clothWarp: themeColour('cloth-warp'),
  clothWeft: themeColour('cloth-weft'),
  dimWarp: themeColour('dim-warp'),
  dimWeft: themeColour('dim-weft'),
  layers: [1, 2, 3, 4].map((n) => themeColour(`layer-${n}`)),
  layerRows: [1, 2, 3, 4, 5, 6, 7, 8].map((n) => themeColour(`layer-row-${n}`)),
};

/** A theme colour see-through, as CSS `rgba()` (a selection over the grid that still shows the marks). */
export function withAlpha(hex: string, alpha: number): string {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
  return `rgba(${r},${g},${b},${alpha})`;
}
