// A small two-layer draft of our own: 8 ends on 8 shafts, layer 1 navy on shafts 1–4, layer 2 cream on 5–8.
import { createDraft } from '../../../shared/weave/draft';
import type { Draft } from '../../../shared/weave/types';

export function twoLayerDraft(): Draft {
  return createDraft({
    name: 'Two-layer trial',
    shafts: 8,
    control: 'liftplan',
    threading: [[1], [5], [2], [6], [3], [7], [4], [8]],
    liftplan: [[1, 3], [1, 2, 3, 4, 5, 7], [2, 4], [1, 2, 3, 4, 6, 8]],
    palette: ['#1f2a44', '#f2e8d5'],
    warpColors: [0, 1, 0, 1, 0, 1, 0, 1],
    weftColors: [0, 1, 0, 1],
    warpLayers: [1, 2, 1, 2, 1, 2, 1, 2],
    weftLayers: [1, 2, 1, 2],
    sett: { warp: 24, weft: 24, unit: 'inch' },
    yarns: [
      { id: 'navy', name: 'Cotton, harbour navy', color: 0 },
      { id: 'cream', name: 'Cotton, sand', color: 1 },
    ],
  });
}
