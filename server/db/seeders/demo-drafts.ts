import type { Draft } from '../../../shared/weave/types';
import { asLists, createDraft, expandProfile, pointDraw, repeat, twillTieup } from '../../../shared/weave';

// Built with the engine's own constructor, so each demo draft is checked by parseDraft as it is made.

/** A 4-shaft 2/2 point twill scarf: point-draw threading and treadling, so the twill forms diamonds. */
export function pointTwillScarf(): Draft {
  return createDraft({
    name: 'Point twill scarf',
    shafts: 4,
    threading: asLists(pointDraw(4, 10)),
    tieup: twillTieup([2, 2]),
    treadling: asLists(pointDraw(4, 10)),
    // Warp all colour 0, weft all colour 1: the engine fills the colour lists that are left empty.
    palette: ['#1f5f6b', '#efe6d2'],
    sett: { warp: 20, weft: 20, unit: 'inch' },
    yarns: [
      { id: 'warp', name: 'Fine wool, deep teal', color: 0 },
      { id: 'weft', name: 'Fine wool, oat', color: 1 },
    ],
    notes: 'A soft scarf in 2/2 point twill. Weave a sample first: the sett suits a fine two-ply wool.',
  });
}

/**
 * A plain-weave colour-and-weave sampler on 4 shafts: the same tabby in three colour orders
 * (1 dark 1 light, 2 dark 2 light, and a log cabin swap), warp and weft alike.
 */
export function colourAndWeaveSampler(): Draft {
  const dark = 0;
  const light = 1;
  const order = [
    ...repeat([dark, light], 8),
    ...repeat([dark, dark, light, light], 4),
    ...repeat([dark, light], 4),
    ...repeat([light, dark], 4),
  ];
  return createDraft({
    name: 'Colour-and-weave sampler',
    shafts: 4,
    threading: asLists(repeat([1, 2, 3, 4], order.length / 4)),
    tieup: [[1, 3], [2, 4]],
    treadling: asLists(repeat([1, 2], order.length / 2)),
    palette: ['#3a2f5b', '#f2d98a'],
    warpColors: order,
    weftColors: order,
    sett: { warp: 12, weft: 12, unit: 'cm' },
    yarns: [
      { id: 'dark', name: 'Cotton 8/2, plum', color: dark },
      { id: 'light', name: 'Cotton 8/2, straw', color: light },
    ],
    notes: 'Plain weave throughout; only the order of dark and light threads changes from block to block.',
  });
}

/** A student's own 2/2 straight twill trial, kept private to show that personal drafts stay personal. */
export function straightTwillTrial(): Draft {
  return createDraft({
    name: 'Straight twill trial',
    shafts: 4,
    threading: asLists(repeat([1, 2, 3, 4], 6)),
    tieup: twillTieup([2, 2]),
    treadling: asLists(repeat([1, 2, 3, 4], 6)),
    palette: ['#e9e4da', '#7a3b2e'],
    sett: { warp: 16, weft: 16, unit: 'inch' },
  });
}

/** The two colourways of the demo table mat: the single-colour layer and the two-colour layer. */
export const TABLE_MAT_COLOURWAYS = {
  harbour: { name: 'Two-block double weave table mat — harbour', palette: ['#1d3557', '#f1e9da', '#b5533c'] },
  meadow: { name: 'Two-block double weave table mat — meadow', palette: ['#2f5d3a', '#f4efe1', '#c99a2e'] },
} as const;

/**
 * A two-block double-weave table mat on an 8-shaft table loom: block A on shafts 1–4, block B on
 * 5–8, 4-end units alternating layers. Layer 1 is one colour; layer 2 alternates two colours, so
 * its face shows a fine colour-and-weave texture. The blocks trade layers to make squares.
 */
export function doubleWeaveTableMat(colourway: keyof typeof TABLE_MAT_COLOURWAYS = 'harbour'): Draft {
  const { name, palette } = TABLE_MAT_COLOURWAYS[colourway];
  const draft = expandProfile(
    {
      name,
      // 11 blocks of 40 ends (11" in the reed at 40 ends per inch) by 14 blocks of 40 picks.
      threading: [1, 2, 1, 2, 1, 2, 1, 2, 1, 2, 1],
      treadling: [[1], [2], [1], [2], [1], [2], [1], [2], [1], [2], [1], [2], [1], [2]],
      endsPerUnit: 40,
      picksPerUnit: 40,
      palette: [...palette],
      warpColors: [[0], [1, 2]],
      weftColors: [[0], [1, 2]],
      sett: { warp: 40, weft: 40, unit: 'inch' },
    },
    'double-weave',
  );
  return createDraft({
    ...draft,
    yarns: [
      { id: 'layer-1', name: 'Cotton 8/2, layer 1', color: 0 },
      { id: 'layer-2a', name: 'Cotton 8/2, layer 2 light', color: 1 },
      { id: 'layer-2b', name: 'Cotton 8/2, layer 2 accent', color: 2 },
    ],
    notes:
      'Sett 40 ends per inch: 20 per layer, twice the plain-weave sett for 8/2 cotton. Sley one end of ' +
      'each layer per dent pair. Check the layers separate by raising each block\'s layer shafts before weaving.',
  });
}
