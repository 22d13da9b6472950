// The cloth views' old way, for comparison in tests/bench/cloth.bench.ts: one flat colour per cell
// (the warp's colour where the end is up, else the weft's; for a face, its top layer's).
import { packedRgba, renderCloth } from '../../../shared/weave/cloth';
import type { Drawdown } from '../../../shared/weave/drawdown';
import type { LayerSimulation } from '../../../shared/weave/layers';
import type { Draft } from '../../../shared/weave/types';

/** One pixel word per cell of the whole cloth (`face` null) or of the front of layered cloth. */
export function paintFaceCells(draft: Draft, drawdown: Drawdown, layers: LayerSimulation | null): Uint32Array {
  if (!layers) return new Uint32Array(renderCloth(draft, drawdown).toRGBA().buffer);
  const packed = Uint32Array.from(draft.palette, packedRgba);
  return Uint32Array.from(layers.front.indices, (i) => packed[i]);
}
