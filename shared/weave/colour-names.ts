import type { DraftYarn } from './types';

/**
 * A palette colour as the weaver knows it: the name of the yarn shown in it, else "colour 3"
 * (1-based). Messages never name a colour by its hex code.
 *
 * @example colourName(draft, 2) // "Rust wool 2/8", or "colour 3" when no yarn is named for it
 */
export function colourName(draft: { readonly yarns: readonly DraftYarn[] }, index: number): string {
  return draft.yarns.find((y) => y.color === index)?.name ?? `colour ${index + 1}`;
}
