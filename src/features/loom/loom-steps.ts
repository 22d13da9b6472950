/** The loom-side lists as the page steps through them: counts, the step at a place, and quick checks. */
import type { LoomList, WorkingOrder } from '../../../shared/api/plans';
import { computePlan, type PlanOutputs } from '../../../shared/plan/compute-plan';
import { weaverShaft, type Group, type SleyingStep, type ThreadingStep, type WeavingList, type WeavingRow } from '../../../shared/plan/loom-lists';
import type { PlanDocument } from '../../../shared/plan/plan-schema';
import { quickChecks } from '../../../shared/weave/check-threading';
import type { Draft } from '../../../shared/weave/types';

/**
 * The plan's lists in the weaver's working order, with the guide's own bundle size for tying on.
 * Group sizes are the plan's (about an inch of ends unless the weaver set them).
 */
export function loomOutputs(draft: Draft, plan: PlanDocument, order: WorkingOrder, tieOnEnds?: number): PlanOutputs {
  return computePlan(draft, { ...plan, lists: { ...plan.lists, ...order, ...(tieOnEnds ? { tieOnEnds } : {}) } });
}

/** How many places the marker can be on in a list: groups, or picks for weaving. */
export function stepCount(outputs: PlanOutputs, list: LoomList): number {
  switch (list) {
    case 'threading': return outputs.threading.length;
    case 'sleying': return outputs.sleying.length;
    case 'tieon': return outputs.tieOn.length;
    case 'weaving': return Math.max(outputs.warp.totalPicks, 0);
  }
}

export interface PickStep {
  /** 1-based pick of the whole cloth. */
  pick: number;
  of: number;
  /** 1-based pick within the draft's sequence. */
  pickInDraft: number;
  repeat: number;
  repeats: number;
  row: WeavingRow;
}

/** The pick at a 0-based place in the cloth, with where it falls in the draft's repeats. */
export function pickAt(weaving: WeavingList, totalPicks: number, index: number): PickStep | null {
  const n = weaving.picksInSequence;
  if (n === 0 || index < 0 || index >= totalPicks) return null;
  const pickInDraft = (index % n) + 1;
  const row = weaving.rows.find((r) => r.fromPick <= pickInDraft && pickInDraft <= r.toPick)!;
  return { pick: index + 1, of: totalPicks, pickInDraft, repeat: Math.floor(index / n) + 1, repeats: Math.ceil(totalPicks / n), row };
}

export interface ShaftCheck {
  /** The shaft as the weaver numbers it. */
  shaft: number;
  /** 1-based ends of the group on this shaft. */
  ends: number[];
  /** The colour every end on the shaft should show; undefined where the draft mixes colours on it. */
  color?: number;
  layer?: number;
  /** Ends of this group that, as drawn, differ from the shaft's colour or layer. */
  odd: number[];
  /** For a mixed shaft: the colours it carries. */
  mix: number[];
}

/**
 * The quick check after a threading group: for each shaft the group used, what raising that shaft
 * alone should show, from the engine's threading check of the draft.
 */
export function threadingGroupCheck(draft: Draft, group: Group<ThreadingStep>, order: WorkingOrder): ShaftCheck[] {
  const byDraftShaft = new Map(quickChecks(draft).map((q) => [q.shaft, q]));
  const shafts = [...new Set(group.items.flatMap((s) => s.shafts))].sort((a, b) => a - b);
  return shafts.map((shaft) => {
    // Renumbering is its own inverse: applying it again gives back the draft's shaft.
    const q = byDraftShaft.get(weaverShaft(shaft, draft.shafts, order));
    const on = group.items.filter((s) => s.shafts.includes(shaft));
    const odd = on.filter((s) => (q?.color !== undefined && s.color !== q.color) || (q?.layer !== undefined && s.layer !== q.layer));
    return {
      shaft,
      ends: on.map((s) => s.end),
      color: q?.color,
      layer: q?.layer,
      odd: odd.map((s) => s.end),
      mix: q?.color === undefined ? [...new Set(on.map((s) => s.color))] : [],
    };
  });
}

/** Dents of a sleying group that hold more than one end: those ends should share the dent. */
export function sharedDents(group: Group<SleyingStep>): SleyingStep[] {
  return group.items.filter((d) => d.ends.length > 1);
}

/** "1–12" for a run of end numbers (in the order met), or the list when they do not run. */
export function endRange(ends: readonly number[]): string {
  if (ends.length === 0) return '';
  if (ends.length === 1) return String(ends[0]);
  const step = ends[1] - ends[0];
  const runs = Math.abs(step) === 1 && ends.every((e, i) => i === 0 || e - ends[i - 1] === step);
  return runs ? `${ends[0]}–${ends[ends.length - 1]}` : ends.join(', ');
}

/** The first end of the group at a place (in the order met), or undefined for weaving or an empty group. */
export function firstEndAt(outputs: PlanOutputs, list: LoomList, position: number): number | undefined {
  switch (list) {
    case 'threading': return outputs.threading[position]?.items[0]?.end;
    case 'sleying': return outputs.sleying[position]?.items.flatMap((d) => d.ends)[0]?.end;
    case 'tieon': return outputs.tieOn[position]?.items[0];
    case 'weaving': return undefined;
  }
}

/** The place (0-based group) of the list that holds an end, or undefined when no group does. */
export function groupOfEnd(outputs: PlanOutputs, list: LoomList, end: number): number | undefined {
  const at = (i: number) => (i >= 0 ? i : undefined);
  switch (list) {
    case 'threading': return at(outputs.threading.findIndex((g) => g.items.some((s) => s.end === end)));
    case 'sleying': return at(outputs.sleying.findIndex((g) => g.items.some((d) => d.ends.some((e) => e.end === end))));
    case 'tieon': return at(outputs.tieOn.findIndex((g) => g.items.includes(end)));
    case 'weaving': return undefined;
  }
}
