import { computeDrawdown, liftMasks, pickCount, type Draft, type Drawdown } from '../../shared/weave';
import { encodePngRgb } from '../print/png';
import { clothSources, threadImage } from '../print/raster';
import type { DraftAttributes } from '../models/draft';

/** Ends and picks of cloth in a library thumbnail (from the first end and pick), and pixels per end. */
export const THUMBNAIL_CELLS = 96;
export const THUMBNAIL_SCALE = 2;
/** Structure is judged on the start of the cloth, so saving a 20 000-end draft stays quick. */
const STRUCTURE_CELLS = 256;

/** The structures the library can filter by. */
export const STRUCTURE_TAGS = ['plain weave', 'twill', 'double weave', 'block weave'] as const;

/** The first `ends` × `picks` of a draft, as a draft of its own (blocks dropped: they describe the whole). */
export function cropDraft(draft: Draft, ends: number, picks: number): Draft {
  const { blocks: _blocks, ...rest } = draft;
  return {
    ...rest,
    threading: draft.threading.slice(0, ends),
    warpColors: draft.warpColors.slice(0, ends),
    warpLayers: draft.warpLayers.slice(0, ends),
    treadling: draft.treadling.slice(0, picks),
    liftplan: draft.liftplan.slice(0, picks),
    weftColors: draft.weftColors.slice(0, picks),
    weftLayers: draft.weftLayers.slice(0, picks),
  };
}

function isPlainWeave(dd: Drawdown): boolean {
  if (dd.ends < 2 || dd.picks < 2) return false;
  for (let p = 0; p < dd.picks; p++) {
    for (let e = 0; e < dd.ends; e++) {
      const up = dd.isUp(e, p);
      if ((e + 1 < dd.ends && dd.isUp(e + 1, p) === up) || (p + 1 < dd.picks && dd.isUp(e, p + 1) === up)) return false;
    }
  }
  return true;
}

const rotate = (mask: number, by: number, n: number) => ((mask << by) | (mask >>> (n - by))) & ((2 ** n - 1) >>> 0);

/**
 * Common practice (our own rule of thumb, no published source): in a twill every pick lifts the same
 * group of shafts moved round by some shafts (so the interlacings step diagonally), at least three
 * different lifts are used, and the threading mostly steps to the next shaft up or down (straight,
 * point and broken draws). Plain weave is checked first and is never called a twill.
 */
function isTwill(draft: Draft): boolean {
  const n = draft.shafts;
  if (n < 3 || draft.threading.length < 3) return false;
  const lifts = [...new Set(liftMasks(draft))].filter((m) => m !== 0 && m !== 2 ** n - 1);
  if (lifts.length < 3) return false;
  const rotations = new Set(Array.from({ length: n }, (_, k) => rotate(lifts[0], k, n) >>> 0));
  if (!lifts.every((m) => rotations.has(m >>> 0))) return false;
  let steps = 0;
  for (let e = 1; e < draft.threading.length; e++) {
    const [a, b] = [draft.threading[e - 1], draft.threading[e]];
    if (a.length === 1 && b.length === 1 && [1, n - 1].includes((b[0] - a[0] + n) % n)) steps++;
  }
  return steps >= 0.8 * (draft.threading.length - 1);
}

/** Structures found in the draft, for the library's filter. */
export function structureTags(draft: Draft): string[] {
  const tags: string[] = [];
  const start = cropDraft(draft, STRUCTURE_CELLS, STRUCTURE_CELLS);
  // Most cloth is not plain weave, and its first 2 × 2 cells usually show it without the whole start.
  const plain = isPlainWeave(computeDrawdown(cropDraft(draft, 2, 2))) && isPlainWeave(computeDrawdown(start));
  if (plain) tags.push('plain weave');
  if (!plain && isTwill(start)) tags.push('twill');
  if (distinctCount(draft.warpLayers, draft.weftLayers) > 1) tags.push('double weave');
  if (draft.blocks && draft.blocks.warp.some((b) => b > 0)) tags.push('block weave');
  return tags;
}

/** A small PNG of the start of the cloth in colour, or null for a draft with no ends or no picks. */
export function thumbnailPng(draft: Draft): Buffer | null {
  const crop = cropDraft(draft, THUMBNAIL_CELLS, THUMBNAIL_CELLS);
  const ends = crop.threading.length;
  const picks = pickCount(crop);
  if (ends === 0 || picks === 0) return null;
  // Drawn thread by thread from the yarn sizes and sett, ends THUMBNAIL_SCALE pixels apart.
  const img = threadImage(clothSources(crop), 'colour', THUMBNAIL_SCALE);
  return encodePngRgb(img.width, img.height, img.rgb);
}

/** How many different numbers two lists hold between them. */
function distinctCount(a: readonly number[], b: readonly number[]): number {
  const seen = new Set(a);
  for (const v of b) seen.add(v);
  return seen.size;
}

/** The small columns kept beside the document so the library can filter and sort without parsing it. */
export function draftStats(draft: Draft): Pick<DraftAttributes, 'ends' | 'picks' | 'shafts' | 'colors'> {
  return {
    ends: draft.threading.length,
    picks: pickCount(draft),
    shafts: draft.shafts,
    colors: distinctCount(draft.warpColors, draft.weftColors),
  };
}

/**
 * Every column computed from the document, written whenever the document changes. The thumbnail is
 * cleared, to be rendered when it is first asked for (services/draft-thumbnails).
 */
/** The columns kept beside a draft's document, worked out from it. */
export type DerivedColumns = Pick<DraftAttributes, 'ends' | 'picks' | 'shafts' | 'colors' | 'structure' | 'thumbnail'>;

export function derivedColumns(draft: Draft): DerivedColumns {
  return { ...draftStats(draft), structure: structureTags(draft), thumbnail: null };
}
