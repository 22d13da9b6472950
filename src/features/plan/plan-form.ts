/** Pure helpers behind the Plan page: unit switching, measured allowances, cautions. */
import type { MeasuredAllowances, PlanDefaultsResponse } from '../../../shared/api/plans';
import { yarnPairKey } from '../../../shared/api/plans';
import { defaultPlan, type PlanDocument } from '../../../shared/plan/plan-schema';
import { convertDensity, convertLength } from '../../../shared/plan/units';
import type { Draft, LengthUnit } from '../../../shared/weave/types';

/** The plan with every length and density re-expressed in `to`, so switching units keeps the same cloth. */
export function convertPlanUnit(doc: PlanDocument, to: LengthUnit): PlanDocument {
  if (doc.unit === to) return doc;
  const len = (v: number) => convertLength(v, doc.unit, to);
  const density = (v: number | undefined) => (v === undefined ? undefined : convertDensity(v, doc.unit, to));
  return {
    ...doc,
    unit: to,
    finishedWidth: len(doc.finishedWidth),
    finishedLength: len(doc.finishedLength),
    hems: len(doc.hems),
    fringe: len(doc.fringe),
    samples: len(doc.samples),
    loomWaste: doc.loomWaste === undefined ? undefined : len(doc.loomWaste),
    onLoom: doc.onLoom && { widthInReed: len(doc.onLoom.widthInReed), wovenLength: len(doc.onLoom.wovenLength) },
    reedWidth: doc.reedWidth === undefined ? undefined : len(doc.reedWidth),
    sett: density(doc.sett),
    picksPerUnit: density(doc.picksPerUnit),
  };
}

/** The number of layers the draft's ends are in (1 for a single cloth). */
export function draftLayers(draft: Draft): number {
  return Math.max(1, ...draft.warpLayers);
}

/** The saved plan, or a new one in the draft's unit set for the draft's layers. */
export function initialPlan(saved: PlanDocument | null, draft: Draft): PlanDocument {
  if (saved) return saved;
  const layers = Math.min(4, draftLayers(draft));
  return { ...defaultPlan(draft.sett.unit), layers, lists: { ...defaultPlan().lists, layerRule: layers > 1 } };
}

/** The measured allowances to offer: from results with the plan's yarns when there are any, else all results. */
export function measuredChoice(defaults: PlanDefaultsResponse | undefined, plan: PlanDocument): (MeasuredAllowances & { sameYarns: boolean }) | null {
  if (!defaults?.overall) return null;
  const key = yarnPairKey(plan.warpYarn.text, plan.weftYarn.text);
  const same = defaults.byYarn.find((g) => g.key === key);
  return same ? { allowances: same.allowances, results: same.results, sameYarns: true } : { ...defaults.overall, sameYarns: false };
}

const WET_WORK = /\b(dye[ds]?|dyeing|mordant\w*|wet[- ]?finish\w*|fulling|fulled|felt(ing|ed)?|scour\w*|mercer\w*|bleach\w*)\b/i;

/** True when the plan or the draft's notes mention dyeing or wet finishing, which call for the chemicals caution. */
export function mentionsWetWork(...texts: string[]): boolean {
  return texts.some((t) => WET_WORK.test(t));
}

/** Reads a denting written the trade's way ("2", "2-2-1", "1-0"); undefined for blank, an error for nonsense. */
export function parseDenting(text: string): { ok: true; pattern: number[] | undefined } | { ok: false; error: string } {
  const t = text.trim();
  if (t === '') return { ok: true, pattern: undefined };
  if (!/^\d+(\s*-\s*\d+)*$/.test(t)) return { ok: false, error: 'Write ends per dent joined by dashes, e.g. 2-2-1.' };
  const pattern = t.split('-').map((s) => Number(s.trim()));
  if (!pattern.some((n) => n > 0)) return { ok: false, error: 'A denting needs at least one end.' };
  return { ok: true, pattern };
}
