import type { ThreadSizes } from '../weave/threads';
import { pickCount } from '../weave/drawdown';
import type { Draft, LengthUnit } from '../weave/types';
import type { PlanDocument } from './plan-schema';
import { diametersPerInch } from './sett';
import { convertDensity } from './units';
import { fromMetresPerKg, parseYarn } from './yarn';

/** With no yarn size known, a thread is drawn this share of its space wide (our own choice). */
export const UNKNOWN_YARN_COVER = 0.8;
/** Ends per inch when neither the plan nor the draft gives a sett. */
const DEFAULT_SETT = 10;

/** Thread sizes and spacing for the cloth views, and where the yarn sizes came from. */
export interface ClothThreadSizes extends ThreadSizes {
  /** 'plan': the plan's yarns; 'yarn names': counts read from the draft's yarn names; 'unknown': drawn at UNKNOWN_YARN_COVER of the spacing. */
  warpSource: YarnSource;
  weftSource: YarnSource;
}

export type YarnSource = 'plan' | 'yarn names' | 'unknown';

/**
 * A yarn's diameters per inch from a description: by Ashenhurst's rule from its count
 * (D ≈ 0.9 √(yd/lb)), or the wraps per inch as given. Undefined when the text names no size.
 */
export function yarnDiametersPerInch(text: string): number | undefined {
  const r = parseYarn(text);
  if (!r.ok) return undefined;
  return r.yarn.kind === 'wraps' ? r.yarn.wrapsPerInch : diametersPerInch(fromMetresPerKg('ydPerLb', r.yarn.metresPerKg));
}

/**
 * A yarn's size read from a name such as "Cotton 8/2, plum": the whole name, or else the first
 * comma-separated part that reads as a yarn description.
 */
function sizeFromName(name: string): number | undefined {
  for (const part of [name, ...name.split(',')]) {
    const d = yarnDiametersPerInch(part);
    if (d !== undefined) return d;
  }
  return undefined;
}

/** Diameters per inch per palette colour, from the plan's yarn for one direction. */
function planSizes(yarn: PlanDocument['warpYarn'] | undefined, wraps: number | undefined): { base?: number; byColour: Map<number, number> } {
  const byColour = new Map<number, number>();
  for (const [c, text] of Object.entries(yarn?.byColor ?? {})) {
    const d = yarnDiametersPerInch(text);
    if (d !== undefined) byColour.set(Number(c), d);
  }
  const base = (yarn?.text !== undefined ? yarnDiametersPerInch(yarn.text) : undefined) ?? wraps;
  return { base, byColour };
}

/**
 * How thick each end and pick is and how closely they lie, for drawing the cloth thread by thread.
 * The sett is the plan's when it gives one, else the draft's. A thread's yarn is the plan's yarn
 * for its colour (or the plan's yarn for its direction, or the plan's wraps per inch for the warp),
 * else a count or wraps per inch read from the name of the draft's yarn in its colour.
 *
 * @example threadSizesFor(draft).warpDiameters[0] // 1 / 52.2 inch for an end of "8/2 cotton"
 */
export function threadSizesFor(draft: Draft, plan?: PlanDocument): ClothThreadSizes {
  const perInch = (v: number | undefined, unit: LengthUnit) => (v !== undefined && Number.isFinite(v) && v > 0 ? convertDensity(v, unit, 'inch') : undefined);
  const fromDraft = (v: number) => perInch(v, draft.sett.unit);
  const endsPerInch = perInch(plan?.sett, plan?.unit ?? 'inch') ?? fromDraft(draft.sett.warp) ?? DEFAULT_SETT;
  const picksPerInch = perInch(plan?.picksPerUnit ?? plan?.sett, plan?.unit ?? 'inch') ?? fromDraft(draft.sett.weft) ?? endsPerInch;

  const named = new Map<number, number>();
  for (const y of draft.yarns) {
    const d = sizeFromName(y.name);
    if (d !== undefined && !named.has(y.color)) named.set(y.color, d);
  }
  const warpPlan = planSizes(plan?.warpYarn, plan?.wrapsPerInch);
  const weftPlan = planSizes(plan?.weftYarn, undefined);

  const resolve = (colours: readonly number[], count: number, fromPlan: ReturnType<typeof planSizes>, spacing: number) => {
    const sources = new Set<YarnSource>();
    const diameters = new Float64Array(count);
    for (let i = 0; i < count; i++) {
      const c = colours[i] ?? 0;
      const p = fromPlan.byColour.get(c) ?? fromPlan.base;
      const n = named.get(c);
      const d = p ?? n;
      sources.add(p !== undefined ? 'plan' : n !== undefined ? 'yarn names' : 'unknown');
      diameters[i] = d !== undefined ? 1 / d : UNKNOWN_YARN_COVER / spacing;
    }
    const source: YarnSource = sources.has('plan') ? 'plan' : sources.has('yarn names') ? 'yarn names' : 'unknown';
    return { diameters, source };
  };
  const warp = resolve(draft.warpColors, draft.threading.length, warpPlan, endsPerInch);
  const weft = resolve(draft.weftColors, pickCount(draft), weftPlan, picksPerInch);
  return {
    endsPerInch,
    picksPerInch,
    warpDiameters: warp.diameters,
    weftDiameters: weft.diameters,
    warpSource: warp.source,
    weftSource: weft.source,
  };
}
