/**
 * Loom-side lists in the order the weaver works.
 *
 * Conventions (common practice, stated so every list agrees):
 * - The draft's shaft 1 is the shaft at the front of the loom, nearest the bench.
 * - `endOneAt` says on which side the draft's end 1 lies, seen from the front of the loom; the
 *   default is the right, as drafts are commonly read right to left (common practice, from memory).
 * - The weaver stands at the front or the back. Seen from the back, left and right swap, so the
 *   same working direction meets the ends in the opposite order, and the shaft nearest the weaver
 *   is the back one: threading from the back reverses both the end order and which side shaft 1 is on.
 * - `shaftNumbering` says how the weaver counts shafts from where they stand: 'near' numbers the
 *   nearest shaft 1, 'far' the farthest. A weaver at the back who still calls the front shaft
 *   "shaft 1" chooses 'far'.
 */
import type { Draft } from '../weave/types';
import { liftMasks, pickCount } from '../weave/drawdown';
import type { WarpEnd } from './warp';
import { sleyingList, type SleyOptions } from './reed';

export type LoomSide = 'front' | 'back';
export type WorkingDirection = 'right-to-left' | 'left-to-right';
export type ShaftNumbering = 'near' | 'far';

export interface Orientation {
  side: LoomSide;
  direction: WorkingDirection;
  shaftNumbering: ShaftNumbering;
  /** Side of the draft's end 1, seen from the front. */
  endOneAt: 'right' | 'left';
}

/** Threading from the front, right to left, front shaft = 1, end 1 on the right. */
export const DEFAULT_ORIENTATION: Orientation = {
  side: 'front',
  direction: 'right-to-left',
  shaftNumbering: 'near',
  endOneAt: 'right',
};

/** True when the weaver meets end 1 first. */
function startsAtEndOne(o: Orientation): boolean {
  const endOneSeen = o.side === 'front' ? o.endOneAt : o.endOneAt === 'right' ? 'left' : 'right';
  const startSide = o.direction === 'right-to-left' ? 'right' : 'left';
  return endOneSeen === startSide;
}

/** 0-based end indices in the order the weaver meets them. */
export function workingOrder(ends: number, o: Orientation): number[] {
  const order = Array.from({ length: ends }, (_, i) => i);
  return startsAtEndOne(o) ? order : order.reverse();
}

/** The number the weaver gives a draft shaft from where they stand. */
export function weaverShaft(draftShaft: number, shafts: number, o: Pick<Orientation, 'side' | 'shaftNumbering'>): number {
  const frontIsOne = (o.side === 'front') === (o.shaftNumbering === 'near');
  return frontIsOne ? draftShaft : shafts + 1 - draftShaft;
}

export interface Group<T> {
  /** 1-based, as in "group 7 of 24". */
  index: number;
  of: number;
  items: T[];
}

/** Splits a list into counted groups of `size` (the last may be smaller). */
export function groupInto<T>(items: readonly T[], size: number): Group<T>[] {
  if (!(size >= 1)) throw new RangeError('A group needs at least one item.');
  const of = Math.ceil(items.length / size);
  return Array.from({ length: of }, (_, i) => ({ index: i + 1, of, items: items.slice(i * size, (i + 1) * size) }));
}

/** Ends in a width at a sett, for groups "one inch (or cm) at a time". */
export function groupSizeForWidth(sett: number, width: number): number {
  return Math.max(1, Math.round(sett * width));
}

export interface ThreadingStep {
  /** 1-based end number across the warp, counted from the draft's end 1. */
  end: number;
  /** Shafts as the weaver numbers them in this orientation, ascending. */
  shafts: number[];
  color: number;
  colorHex: string;
  layer: number;
  selvedge: boolean;
  /** The dent this end is sleyed in, numbered as on the sleying list, when there is one. */
  dent?: number;
}

/**
 * The threading list in working order, in counted groups of `groupSize` ends; with `dents`
 * (end → dent, from {@link dentOfEnd}) each end carries the dent it goes through.
 */
export function threadingSteps(draft: Draft, warp: readonly WarpEnd[], o: Orientation, groupSize: number, dents?: ReadonlyMap<number, number>): Group<ThreadingStep>[] {
  const steps = workingOrder(warp.length, o).map((i) => {
    const e = warp[i];
    const step: ThreadingStep = {
      end: e.end,
      shafts: e.shafts.map((s) => weaverShaft(s, draft.shafts, o)).sort((a, b) => a - b),
      color: e.color,
      colorHex: draft.palette[e.color] ?? '',
      layer: e.layer,
      selvedge: e.selvedge,
    };
    const dent = dents?.get(e.end);
    if (dent !== undefined) step.dent = dent;
    return step;
  });
  return groupInto(steps, groupSize);
}

export interface SleyingStep {
  dent: number;
  ends: { end: number; color: number; layer: number }[];
  planned: number;
}

/**
 * The sleying list in working order (dents counted from where the weaver starts), in groups of
 * `dentsPerGroup` dents. The layer rule uses each end's layer when `layerRule` is on.
 */
export function sleyingSteps(
  warp: readonly WarpEnd[],
  o: Orientation,
  pattern: readonly number[],
  dentsPerGroup: number,
  options: Omit<SleyOptions, 'layers'> & { layerRule?: boolean } = {},
): Group<SleyingStep>[] {
  const order = workingOrder(warp.length, o);
  const { layerRule, ...sley } = options;
  const dents = sleyingList(order, pattern, layerRule ? { ...sley, layers: order.map((i) => warp[i].layer) } : sley);
  const steps = dents.map((d) => ({
    dent: d.dent,
    planned: d.planned,
    ends: d.ends.map((i) => ({ end: warp[i].end, color: warp[i].color, layer: warp[i].layer })),
  }));
  return groupInto(steps, dentsPerGroup);
}

/** The dent of every end on a sleying list: 1-based end → dent number. */
export function dentOfEnd(sleying: readonly Group<SleyingStep>[]): Map<number, number> {
  const out = new Map<number, number>();
  for (const g of sleying) for (const d of g.items) for (const e of d.ends) out.set(e.end, d.dent);
  return out;
}

/** Tie-on bundles of `endsPerGroup` ends in working order, each as its 1-based end numbers. */
export function tieOnGroups(ends: number, o: Orientation, endsPerGroup: number): Group<number>[] {
  return groupInto(
    workingOrder(ends, o).map((i) => i + 1),
    endsPerGroup,
  );
}

export interface WeavingRow {
  /** First and last 1-based pick of the draft this row covers. */
  fromPick: number;
  toPick: number;
  /** Times the same pick is thrown in a row. */
  times: number;
  /** Treadles pressed together, for treadle looms. */
  treadles?: number[];
  /** Shafts up in the shed, as numbered from the front with `shaftNumbering`. */
  raised: number[];
  color: number;
  colorHex: string;
  layer: number;
}

export interface WeavingList {
  rows: WeavingRow[];
  picksInSequence: number;
  /** Whole times through the draft's picks, and the picks of a last partial time. */
  repeats: number;
  extraPicks: number;
  picksPerUnit: number;
  unit: Draft['sett']['unit'];
  /** How `raised` numbers the shafts, seen from the front of the loom. */
  shaftNumbering: ShaftNumbering;
}

export interface WeavingListOptions {
  /** Picks the plan weaves in all (the plan's `totalPicks`). */
  totalPicks: number;
  /** How the weaver, at the front, numbers shafts. Default 'near' (front shaft = 1). */
  shaftNumbering?: ShaftNumbering;
  /** The plan's picks per unit when it differs from the draft's. */
  picksPerUnit?: number;
  unit?: Draft['sett']['unit'];
}

/**
 * The pick-by-pick weaving list: consecutive identical picks merged with a count, the number of
 * times to weave the whole sequence for `totalPicks`, and the picks-per-unit reminder. On a
 * sinking shed the draft names the shafts that sink, so the raised shafts are the others.
 */
export function weavingList(draft: Draft, options: WeavingListOptions): WeavingList {
  const { totalPicks, shaftNumbering = 'near' } = options;
  const picks = pickCount(draft);
  const masks = liftMasks(draft);
  const all = draft.shafts >= 32 ? 0xffffffff : (1 << draft.shafts) - 1;
  const rows: WeavingRow[] = [];
  for (let p = 0; p < picks; p++) {
    const mask = draft.shed === 'sinking' ? ~masks[p] & all : masks[p];
    const raised: number[] = [];
    for (let s = 1; s <= draft.shafts; s++) {
      if ((mask >>> (s - 1)) & 1) raised.push(weaverShaft(s, draft.shafts, { side: 'front', shaftNumbering }));
    }
    raised.sort((a, b) => a - b);
    const color = draft.weftColors[p] ?? 0;
    const row: WeavingRow = {
      fromPick: p + 1,
      toPick: p + 1,
      times: 1,
      ...(draft.control === 'treadling' ? { treadles: [...draft.treadling[p]].sort((a, b) => a - b) } : {}),
      raised,
      color,
      colorHex: draft.palette[color] ?? '',
      layer: draft.weftLayers[p] ?? 1,
    };
    const last = rows[rows.length - 1];
    if (last && sameThrow(last, row)) {
      last.toPick = row.toPick;
      last.times++;
    } else rows.push(row);
  }
  return {
    rows,
    picksInSequence: picks,
    repeats: picks ? Math.floor(totalPicks / picks) : 0,
    extraPicks: picks ? totalPicks % picks : 0,
    picksPerUnit: options.picksPerUnit ?? draft.sett.weft,
    unit: options.unit ?? draft.sett.unit,
    shaftNumbering,
  };
}

function sameThrow(a: WeavingRow, b: WeavingRow): boolean {
  return (
    a.color === b.color &&
    a.layer === b.layer &&
    a.raised.join() === b.raised.join() &&
    (a.treadles ?? []).join() === (b.treadles ?? []).join()
  );
}
