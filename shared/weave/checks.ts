import { checkThreading, type ThreadingProblem } from './check-threading';
import { colourName } from './colour-names';
import { pickCount } from './drawdown';
import type { Float } from './floats';
import { resolveLayers } from './layer-lists';
import type { LayerProblem } from './layers';
import type { Draft } from './types';
import { numberList, plural } from './words';

/** What a Checks item is about, for the count by kind and for folding. */
export type CheckKind = 'threading' | 'layers' | 'floats';

export const CHECK_KINDS: readonly { kind: CheckKind; label: string }[] = [
  { kind: 'threading', label: 'Ends on the wrong shaft' },
  { kind: 'layers', label: 'Layers tied together' },
  { kind: 'floats', label: 'Long floats' },
];

/** One problem as an engine check found it, before grouping. */
export type FoundProblem =
  | { source: 'threading'; problem: ThreadingProblem }
  | { source: 'layers'; problem: LayerProblem }
  | { source: 'floats'; problem: Float };

/** One item of Checks: one cause (an end or a pick), with every problem it explains. */
export interface CheckGroup {
  /** 'end-4' or 'pick-12' (0-based): one group per end or pick at most. */
  key: string;
  kind: CheckKind;
  axis: 'ends' | 'picks';
  /** 0-based end or pick the cause sits on. */
  index: number;
  /** 0-based picks (for an end) or ends (for a pick) where it ties the layers, in order. */
  extent: number[];
  message: string;
  problems: FoundProblem[];
}

export interface CheckInputs {
  /** Layer problems (simulateLayers), all of them; empty for a one-layer draft. */
  layers?: readonly LayerProblem[];
  /** Floats over the weaver's limit (findFloats' overLimit). */
  floats?: readonly Float[];
  /** The weaver's float limit, for the floats' messages. */
  floatLimit?: number;
  /** Threading problems; worked out from the draft when not given. */
  threading?: readonly ThreadingProblem[];
}

/** Every problem the engine's checks found, as one list. */
export function foundProblems(draft: Draft, inputs: CheckInputs): FoundProblem[] {
  const threading = inputs.threading ?? checkThreading(draft).problems;
  return [
    ...threading.map((problem): FoundProblem => ({ source: 'threading', problem })),
    ...(inputs.layers ?? []).map((problem): FoundProblem => ({ source: 'layers', problem })),
    ...(inputs.floats ?? []).map((problem): FoundProblem => ({ source: 'floats', problem })),
  ];
}

/**
 * The engine's checks, one item per cause: an end on a wrong shaft is one item however many picks
 * it ties the layers on, and the threading check and the layer check never list it twice.
 *
 * @example findChecks(draft, { layers: sim.problems })[0].message
 * // "End 2 (layer 2) is on shaft 1, a layer-1 shaft: it ties the layers on 100 picks (1, 3, 5 … 199)."
 */
export function findChecks(draft: Draft, inputs: CheckInputs = {}): CheckGroup[] {
  return groupChecks(draft, foundProblems(draft, inputs), inputs.floatLimit);
}

/**
 * Groups problems by their cause. Each problem has one thread to blame: a threading problem or a
 * crossed end its end, a wrong lift its pick, a float its own thread, and a stitch (one crossing)
 * the end or pick it shares with most other stitches (a thread already blamed for something else
 * first, then the end on a tie). Every problem lands in exactly one group, and no end or pick has
 * two groups.
 */
export function groupChecks(draft: Draft, problems: readonly FoundProblem[], floatLimit?: number): CheckGroup[] {
  const stitchesOnEnd = new Map<number, number>();
  const stitchesOnPick = new Map<number, number>();
  const blamed = new Set<string>();
  for (const found of problems) {
    if (found.source === 'layers' && found.problem.kind === 'stitch') {
      const { end, pick } = found.problem;
      if (end !== undefined) stitchesOnEnd.set(end, (stitchesOnEnd.get(end) ?? 0) + 1);
      if (pick !== undefined) stitchesOnPick.set(pick, (stitchesOnPick.get(pick) ?? 0) + 1);
    } else {
      const cause = causeOf(found);
      if (cause) blamed.add(keyOf(cause));
    }
  }

  const groups = new Map<string, { axis: 'ends' | 'picks'; index: number; problems: FoundProblem[] }>();
  for (const found of problems) {
    let cause = causeOf(found);
    if (!cause && found.source === 'layers') {
      const { end, pick } = found.problem;
      if (end === undefined || pick === undefined) cause = end !== undefined ? { axis: 'ends', index: end } : pick !== undefined ? { axis: 'picks', index: pick } : null;
      else {
        const endBlamed = blamed.has(keyOf({ axis: 'ends', index: end }));
        const pickBlamed = blamed.has(keyOf({ axis: 'picks', index: pick }));
        const toEnd = endBlamed !== pickBlamed ? endBlamed : (stitchesOnEnd.get(end) ?? 0) >= (stitchesOnPick.get(pick) ?? 0);
        cause = toEnd ? { axis: 'ends', index: end } : { axis: 'picks', index: pick };
      }
    }
    // A problem with no thread at all cannot be shown on the grid; the engine makes none.
    if (!cause) continue;
    const key = keyOf(cause);
    let group = groups.get(key);
    if (!group) groups.set(key, (group = { ...cause, problems: [] }));
    group.problems.push(found);
  }

  const layers = { warp: resolveLayers(draft.warpLayers, draft.threading.length), weft: resolveLayers(draft.weftLayers, pickCount(draft)) };
  const out = [...groups].map(([key, g]): CheckGroup => {
    const extent = extentOf(g.axis, g.problems);
    const kind = g.axis === 'ends' && onAnotherBlocksShaft(draft, g.index) ? 'threading' : kindOf(g.problems);
    return { key, kind, axis: g.axis, index: g.index, extent, message: describe(draft, layers, g.axis, g.index, g.problems, extent, floatLimit), problems: g.problems };
  });
  const order: Record<CheckKind, number> = { threading: 0, layers: 1, floats: 2 };
  return out.sort((a, b) => order[a.kind] - order[b.kind] || (a.axis === b.axis ? 0 : a.axis === 'ends' ? -1 : 1) || a.index - b.index);
}

/** Counts of groups by kind, in the order of {@link CHECK_KINDS}. */
export function countByKind(groups: readonly CheckGroup[]): { kind: CheckKind; label: string; count: number }[] {
  return CHECK_KINDS.map((k) => ({ ...k, count: groups.filter((g) => g.kind === k.kind).length }));
}

type Cause = { axis: 'ends' | 'picks'; index: number };

const keyOf = (c: Cause) => `${c.axis === 'ends' ? 'end' : 'pick'}-${c.index}`;

/** The thread a problem blames on its own; null for a stitch, which is placed by the counts. */
function causeOf(found: FoundProblem): Cause | null {
  switch (found.source) {
    case 'threading':
      return { axis: 'ends', index: found.problem.end };
    case 'floats':
      return { axis: found.problem.kind === 'warp' ? 'ends' : 'picks', index: found.problem.thread };
    case 'layers': {
      const p = found.problem;
      if (p.kind === 'crossed-end' && p.end !== undefined) return { axis: 'ends', index: p.end };
      if (p.kind === 'wrong-lift' && p.pick !== undefined) return { axis: 'picks', index: p.pick };
      return null;
    }
  }
}

/** The block most of the other ends on a shaft belong to, from the draft's block links. */
function blockOfShaft(draft: Draft, shaft: number, except: number): number | undefined {
  const links = draft.blocks?.warp;
  if (!links || !links[except]) return undefined;
  return mostOnShaft(draft, shaft, except, (e) => (links[e] ? links[e] : undefined));
}

/** An end of an expanded block design threaded on a shaft whose other ends are another block's. */
function onAnotherBlocksShaft(draft: Draft, end: number): boolean {
  const shaft = draft.threading[end]?.[0];
  const block = draft.blocks?.warp[end];
  const shaftBlock = shaft !== undefined ? blockOfShaft(draft, shaft, end) : undefined;
  return shaftBlock !== undefined && shaftBlock !== block;
}

function kindOf(problems: readonly FoundProblem[]): CheckKind {
  if (problems.some((f) => f.source === 'threading' || (f.source === 'layers' && f.problem.kind === 'crossed-end'))) return 'threading';
  if (problems.some((f) => f.source === 'layers')) return 'layers';
  return 'floats';
}

/** The other threads the cause ties the layers on. */
function extentOf(axis: 'ends' | 'picks', problems: readonly FoundProblem[]): number[] {
  const at = new Set<number>();
  for (const f of problems) {
    if (f.source !== 'layers') continue;
    const p = f.problem;
    if (p.kind === 'stitch') {
      const other = axis === 'ends' ? p.pick : p.end;
      if (other !== undefined) at.add(other);
    } else {
      for (const i of p.tied ?? []) at.add(i);
    }
  }
  return [...at].sort((a, b) => a - b);
}

/** The value most of a shaft's other ends have (their layer, colour or block), undefined if none. */
function mostOnShaft(draft: Draft, shaft: number, except: number, valueOf: (end: number) => number | undefined): number | undefined {
  const counts = new Map<number, number>();
  draft.threading.forEach((shafts, e) => {
    const v = e !== except && shafts.includes(shaft) ? valueOf(e) : undefined;
    if (v !== undefined) counts.set(v, (counts.get(v) ?? 0) + 1);
  });
  let best: number | undefined;
  for (const [v, n] of counts) if (best === undefined || n > (counts.get(best) ?? 0)) best = v;
  return best;
}

function describe(
  draft: Draft,
  layers: { warp: Uint8Array; weft: Uint8Array },
  axis: 'ends' | 'picks',
  index: number,
  problems: readonly FoundProblem[],
  extent: readonly number[],
  floatLimit: number | undefined,
): string {
  const layered = layers.warp.some((l) => l !== 1) || layers.weft.some((l) => l !== 1);
  const ties = extent.length > 0 ? `ties the layers on ${plural(extent.length, axis === 'ends' ? 'pick' : 'end')} (${numberList(extent)})` : '';
  const floats = problems.flatMap((f) => (f.source === 'floats' ? [f.problem] : []));
  const floatText = floats.length === 0 ? '' : floatWords(floats, floatLimit);
  const parts: string[] = [];

  if (axis === 'ends') {
    const layer = layers.warp[index] ?? 1;
    const who = `End ${index + 1}${layered ? ` (layer ${layer})` : ''}`;
    const threading = problems.flatMap((f) => (f.source === 'threading' ? [f.problem] : []));
    const crossed = problems.flatMap((f) => (f.source === 'layers' && f.problem.kind === 'crossed-end' ? [f.problem] : []));
    const wrongLayer = threading.find((p) => p.kind === 'layer') ?? crossed[0];
    const colour = threading.find((p) => p.kind === 'colour');
    const shaft = wrongLayer?.shaft ?? colour?.shaft ?? draft.threading[index]?.[0];
    const block = draft.blocks?.warp[index];
    const shaftBlock = shaft !== undefined ? blockOfShaft(draft, shaft, index) : undefined;
    const otherBlock = shaftBlock !== undefined && shaftBlock !== block ? `, a block-${shaftBlock} shaft among block-${block} ends` : '';
    if (wrongLayer?.shaft !== undefined) {
      const shaftLayer = layered ? mostOnShaft(draft, wrongLayer.shaft, index, (e) => layers.warp[e]) : undefined;
      parts.push(`${who} is on shaft ${wrongLayer.shaft}${shaftLayer ? `, a layer-${shaftLayer} shaft` : ''}${otherBlock}: it ${ties || 'will weave into the wrong layer'}`);
    } else if (otherBlock || (ties && shaft !== undefined)) {
      parts.push(`${who} is on shaft ${shaft}${otherBlock}: it ${ties || 'weaves with the other block'}`);
    } else if (ties) {
      parts.push(`${who} ${ties}`);
    }
    if (colour) {
      const main = colourName(draft, mostOnShaft(draft, colour.shaft, index, (e) => draft.warpColors[e] ?? 0) ?? 0);
      const colourText = `${parts.length > 0 ? 'it is' : `${who} is`} ${colourName(draft, draft.warpColors[index] ?? 0)} on shaft ${colour.shaft}, where the other ends are ${main}`;
      parts.push(colourText);
    }
  } else {
    const layer = layers.weft[index] ?? 1;
    const who = `Pick ${index + 1}${layered ? ` (layer ${layer})` : ''}`;
    const lifts = problems.flatMap((f) => (f.source === 'layers' && f.problem.kind === 'wrong-lift' ? [f.problem] : []));
    if (lifts.length > 0) {
      const raised = lifts.filter((p) => p.raised && p.shaft !== undefined).map((p) => p.shaft!);
      const down = lifts.filter((p) => !p.raised && p.shaft !== undefined).map((p) => p.shaft!);
      const acts = [
        raised.length > 0 ? `raises ${raised.length === 1 ? 'shaft' : 'shafts'} ${raised.join(', ')}` : '',
        down.length > 0 ? `leaves ${down.length === 1 ? 'shaft' : 'shafts'} ${down.join(', ')} down` : '',
      ].filter(Boolean);
      parts.push(`${who} ${acts.join(' and ')} against the layer order: it ${ties || 'ties the layers'}`);
    } else if (ties) {
      parts.push(`${who} ${ties}`);
    }
  }
  if (floatText) parts.push(parts.length > 0 ? `it also ${floatText}` : `${axis === 'ends' ? 'End' : 'Pick'} ${index + 1} ${floatText}`);
  return `${parts.join('; ')}.`;
}

function floatWords(floats: readonly Float[], limit: number | undefined): string {
  const longest = floats.reduce((a, b) => (b.length > a.length ? b : a));
  const limitText = limit !== undefined ? ` (your limit is ${limit})` : '';
  const more = floats.length > 1 ? `, ${floats.length} floats over the limit in all` : '';
  return `floats ${longest.side} ${longest.length} threads${limitText}${more}`;
}
