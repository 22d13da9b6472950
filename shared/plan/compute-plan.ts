/**
 * Everything the Plan and At-the-loom views show, recomputed from a draft and its saved plan.
 */
import { arrangementOf, type Draft } from '../weave/types';
import { convertDensity } from './units';
import { pickCount } from '../weave/drawdown';
import { diametersPerInch, layeredSett, maximumSett, settFromWraps, settOutside, workingSettRange, WEAVES, type SettOutside } from './sett';
import { centredFirstDent, dentsPerInch, planDenting, settFromDenting, type DentingPlan } from './reed';
import { computeWarpPlan, expandWarp, type WarpPlan } from './warp';
import { fromMetresPerKg } from './yarn';
import { dentOfEnd, groupSizeForWidth, sleyingSteps, threadingSteps, tieOnGroups, weavingList } from './loom-lists';
import { warpPlanInput, type PlanDocument } from './plan-schema';
import { picksReason } from './picks';

/** Ends per tie-on bundle when the weaver sets none (common practice: a dozen ends a knot). */
export const TIE_ON_ENDS = 12;

/** The sett the cloth is woven at: the plan's when there is one, else the draft's. */
export interface ClothSett {
  warp: number;
  weft: number;
  unit: Draft['sett']['unit'];
}

/**
 * The one sett every view shows (plan page, print header, WIF, cloth scale): the plan's ends and
 * picks per unit when it sets them, else the draft's, in the plan's unit when there is a plan.
 * @example clothSett(draft, { ...plan, sett: 24 }).warp // 24
 */
export function clothSett(draft: Draft, plan?: PlanDocument | null): ClothSett {
  if (!plan) return { ...draft.sett };
  return {
    warp: plan.sett ?? convertDensity(draft.sett.warp, draft.sett.unit, plan.unit),
    weft: plan.picksPerUnit ?? convertDensity(draft.sett.weft, draft.sett.unit, plan.unit),
    unit: plan.unit,
  };
}

/** Why a plan cannot give counts for a draft yet, or undefined when it can. */
export function planBlocker(draft: Draft): string | undefined {
  if (draft.threading.length === 0) return 'The draft has no ends yet: draw a threading first.';
  if (pickCount(draft) === 0) return 'The draft has no picks yet: draw a treadling or lift plan first.';
  return undefined;
}

export interface SettGuide {
  /** Ashenhurst's maximum for the warp yarn, the weave and the layer count, per the plan's unit. */
  maximum?: number;
  working?: { low: number; high: number };
  /** From wraps per inch, for the weave and the layer count, per the plan's unit. */
  fromWraps?: number;
  /** The plan's sett against the working range, when it falls outside. */
  outside?: SettOutside;
}

export interface PlanOutputs {
  settGuide: SettGuide;
  warp: WarpPlan;
  /** Setts in the plan's unit. */
  denting: DentingPlan;
  threading: ReturnType<typeof threadingSteps>;
  sleying: ReturnType<typeof sleyingSteps>;
  tieOn: ReturnType<typeof tieOnGroups>;
  weaving: ReturnType<typeof weavingList>;
  /** The sentence that states the picks to weave and why they differ from the draft's. */
  picksReason: string;
  /** Where the warp sits in the reed, when the plan gives the reed's width. */
  centring?: { reedDents: number; dentsUsed: number; firstDent: number };
}

/**
 * Sett suggestions from the warp yarn (Ashenhurst) and from wraps per inch, when given, and where
 * the chosen sett (per the plan's unit) lies against the working range.
 */
export function settGuide(doc: PlanDocument, warpMetresPerKg: number | undefined, sett?: number): SettGuide {
  const weave = WEAVES[doc.weave];
  const perUnit = (perInch: number) => convertDensity(layeredSett(perInch, doc.layers), 'inch', doc.unit);
  const guide: SettGuide = {};
  if (warpMetresPerKg !== undefined) {
    const max = maximumSett(diametersPerInch(fromMetresPerKg('ydPerLb', warpMetresPerKg)), weave);
    const range = workingSettRange(max);
    guide.maximum = perUnit(max);
    guide.working = { low: perUnit(range.low), high: perUnit(range.high) };
    if (sett !== undefined) {
      const outside = settOutside(sett, guide.working);
      if (outside) guide.outside = outside;
    }
  }
  if (doc.wrapsPerInch !== undefined) guide.fromWraps = perUnit(settFromWraps(doc.wrapsPerInch, weave));
  return guide;
}

/**
 * The plan's outputs: quantities, denting and the loom-side lists.
 * @example computePlan(draft, defaultPlan('cm')).warp.ends.totalEnds
 */
export function computePlan(draft: Draft, doc: PlanDocument): PlanOutputs {
  const input = warpPlanInput(doc, draft);
  const warp = computeWarpPlan(draft, input);
  // Reeds work per inch; the weaver sees the denting's sett in the plan's unit.
  const settPerInch = convertDensity(warp.sett, doc.unit, 'inch');
  const perInch = doc.denting
    ? { pattern: doc.denting, sett: settFromDenting(doc.reed, doc.denting), difference: settFromDenting(doc.reed, doc.denting) - settPerInch }
    : planDenting(settPerInch, doc.reed);
  const denting: DentingPlan = {
    pattern: perInch.pattern,
    sett: convertDensity(perInch.sett, 'inch', doc.unit),
    difference: convertDensity(perInch.difference, 'inch', doc.unit),
  };
  const ends = expandWarp(draft, warp.ends, doc.selvedgeEndsPerSide);
  const { lists } = doc;
  // End 1's side is the draft's, as the editor and the print show it; the plan's own old setting is not read.
  const orientation = { side: lists.side, direction: lists.direction, shaftNumbering: lists.shaftNumbering, endOneAt: arrangementOf(draft).endOne };
  const endsPerDent = denting.pattern.reduce((a, b) => a + b, 0) / denting.pattern.length;
  // Groups of about an inch (2.5 cm) of warp unless the weaver sets a size (common practice).
  const unitWidth = doc.unit === 'inch' ? 1 : 2.5;
  const sleyOptions = { layerRule: lists.layerRule, layerOrder: lists.layerOrder, flipEvery: lists.flipEvery };
  const dentsPerGroup = lists.dentsPerGroup ?? Math.max(1, Math.round(groupSizeForWidth(warp.sett, unitWidth) / endsPerDent));
  let sleying = sleyingSteps(ends, orientation, denting.pattern, dentsPerGroup, sleyOptions);
  let centring: PlanOutputs['centring'];
  if (doc.reedWidth !== undefined) {
    const reedDents = Math.floor(doc.reedWidth * convertDensity(dentsPerInch(doc.reed), 'inch', doc.unit) + 1e-9);
    const dentsUsed = sleying.reduce((n, g) => n + g.items.length, 0);
    centring = { reedDents, dentsUsed, firstDent: centredFirstDent(reedDents, dentsUsed) };
    sleying = sleyingSteps(ends, orientation, denting.pattern, dentsPerGroup, { ...sleyOptions, firstDent: centring.firstDent });
  }
  return {
    settGuide: settGuide(doc, input.warpYarn?.metresPerKg, warp.sett),
    warp,
    denting,
    threading: threadingSteps(draft, ends, orientation, lists.groupSize ?? groupSizeForWidth(warp.sett, unitWidth), dentOfEnd(sleying)),
    sleying,
    tieOn: tieOnGroups(ends.length, orientation, lists.tieOnEnds ?? TIE_ON_ENDS),
    // Weaving is done from the front: keep calling each shaft what the weaver called it while threading.
    weaving: weavingList(draft, {
      totalPicks: warp.totalPicks,
      shaftNumbering: orientation.side === 'front' ? orientation.shaftNumbering : orientation.shaftNumbering === 'near' ? 'far' : 'near',
      picksPerUnit: warp.picksPerUnit,
      unit: doc.unit,
    }),
    picksReason: picksReason(warp.picks),
    ...(centring ? { centring } : {}),
  };
}
