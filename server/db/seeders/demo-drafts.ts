import type { Draft } from '../../../shared/weave/types';
import { asLists, createDraft, pointDraw, repeat, twillTieup } from '../../../shared/weave';

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
