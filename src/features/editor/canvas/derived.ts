import { threadSizesFor, type ClothThreadSizes } from '../../../../shared/plan';
import {
  computeDrawdown,
  findFloats,
  renderCloth,
  simulateLayers,
  type Cloth,
  type Draft,
  type Drawdown,
  type FloatReport,
  type LayerSimulation,
} from '../../../../shared/weave';

/**
 * Layer problems kept for Checks, which groups them by cause: enough for every crossing of a
 * 200 × 100 cloth woven wrong; a draft with more lists its first ones.
 */
const MAX_LAYER_PROBLEMS = 20_000;

/** Keeps the last result and recomputes only when one of the keys changed (by identity). */
function lastResult<R>(): (keys: readonly unknown[], compute: () => R) => R {
  let last: readonly unknown[] | null = null;
  let result: R;
  return (keys, compute) => {
    if (!last || keys.length !== last.length || keys.some((v, i) => v !== last![i])) {
      result = compute();
      last = keys;
    }
    return result;
  };
}

/**
 * What the canvas and the cloth views compute from the draft, each recomputed only when the parts
 * of the draft it reads change: a colour edit never recomputes the drawdown.
 */
export interface Derived {
  drawdown(draft: Draft): Drawdown;
  cloth(draft: Draft): Cloth;
  floats(draft: Draft, limit: number): FloatReport;
  layers(draft: Draft): LayerSimulation;
  /** Thread sizes and spacing for the thread-by-thread views. */
  sizes(draft: Draft): ClothThreadSizes;
  /** What Checks lists for a float limit, worked out by `compute` when the limit changed. */
  checks<T>(floatLimit: number, compute: () => T): T;
}

export function createDerived(): Derived {
  const dd = lastResult<Drawdown>();
  const cl = lastResult<Cloth>();
  const fl = lastResult<FloatReport>();
  const ly = lastResult<LayerSimulation>();
  const sz = lastResult<ClothThreadSizes>();
  const ch = lastResult<unknown>();
  const drawdown = (d: Draft) => dd([d.threading, d.tieup, d.treadling, d.liftplan, d.shed, d.control], () => computeDrawdown(d));
  return {
    drawdown,
    cloth: (d) => {
      const down = drawdown(d);
      return cl([down, d.palette, d.warpColors, d.weftColors], () => renderCloth(d, down));
    },
    floats: (d, limit) => {
      const down = drawdown(d);
      return fl([down, d.warpLayers, d.weftLayers, limit], () => findFloats(d, { limit }, down));
    },
    layers: (d) => {
      const down = drawdown(d);
      return ly([down, d.warpLayers, d.weftLayers, d.warpColors, d.weftColors, d.palette, d.blocks], () => simulateLayers(d, undefined, { drawdown: down, maxProblems: MAX_LAYER_PROBLEMS }));
    },
    sizes: (d) => sz([d.threading.length, d.treadling.length, d.liftplan.length, d.control, d.warpColors, d.weftColors, d.yarns, d.sett], () => threadSizesFor(d)),
    // Checks read the whole draft: kept only while the draft (this object's lifetime) and the limit stay.
    checks: <T,>(limit: number, compute: () => T) => ch([limit], compute) as T,
  };
}
