/**
 * Everything the Plan and At-the-loom views show, recomputed from a draft and its saved plan.
 */
import type { Draft } from '../weave/types';
import { convertDensity } from './units';
import { diametersPerInch, layeredSett, maximumSett, settFromWraps, workingSettRange, WEAVES } from './sett';
import { planDenting, settFromDenting, type DentingPlan } from './reed';
import { computeWarpPlan, expandWarp, type WarpPlan } from './warp';
import { fromMetresPerKg } from './yarn';
import { groupSizeForWidth, sleyingSteps, threadingSteps, tieOnGroups, weavingList } from './loom-lists';
import { warpPlanInput, type PlanDocument } from './plan-schema';

export interface SettGuide {
  /** Ashenhurst's maximum for the warp yarn, the weave and the layer count, per the plan's unit. */
  maximum?: number;
  working?: { low: number; high: number };
  /** From wraps per inch, for the weave and the layer count, per the plan's unit. */
  fromWraps?: number;
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
}

/** Sett suggestions from the warp yarn (Ashenhurst) and from wraps per inch, when given. */
export function settGuide(doc: PlanDocument, warpMetresPerKg: number | undefined): SettGuide {
  const weave = WEAVES[doc.weave];
  const perUnit = (perInch: number) => convertDensity(layeredSett(perInch, doc.layers), 'inch', doc.unit);
  const guide: SettGuide = {};
  if (warpMetresPerKg !== undefined) {
    const max = maximumSett(diametersPerInch(fromMetresPerKg('ydPerLb', warpMetresPerKg)), weave);
    const range = workingSettRange(max);
    guide.maximum = perUnit(max);
    guide.working = { low: perUnit(range.low), high: perUnit(range.high) };
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
  const orientation = { side: lists.side, direction: lists.direction, shaftNumbering: lists.shaftNumbering, endOneAt: lists.endOneAt };
  const repeat = input.repeatEnds ?? Math.max(1, draft.threading.length);
  const endsPerDent = denting.pattern.reduce((a, b) => a + b, 0) / denting.pattern.length;
  return {
    settGuide: settGuide(doc, input.warpYarn?.metresPerKg),
    warp,
    denting,
    threading: threadingSteps(draft, ends, orientation, lists.groupSize ?? repeat),
    sleying: sleyingSteps(ends, orientation, denting.pattern, lists.dentsPerGroup ?? Math.max(1, Math.round(repeat / endsPerDent)), {
      layerRule: lists.layerRule,
      layerOrder: lists.layerOrder,
      flipEvery: lists.flipEvery,
    }),
    // One unit of width per bundle: about an inch, or about 2.5 cm, of ends.
    tieOn: tieOnGroups(ends.length, orientation, lists.tieOnEnds ?? groupSizeForWidth(warp.sett, doc.unit === 'inch' ? 1 : 2.5)),
    // Weaving is done from the front: keep calling each shaft what the weaver called it while threading.
    weaving: weavingList(draft, {
      totalPicks: warp.totalPicks,
      shaftNumbering: orientation.side === 'front' ? orientation.shaftNumbering : orientation.shaftNumbering === 'near' ? 'far' : 'near',
      picksPerUnit: warp.picksPerUnit,
      unit: doc.unit,
    }),
  };
}
