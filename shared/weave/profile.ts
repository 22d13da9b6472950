import { createDraft, DEFAULT_SETT } from './draft';
import { resolveLayers } from './layer-lists';
import { liftPlanOf, toTreadlingDraft } from './liftplan';
import { numberList, plural } from './words';
import {
  MAX_PROFILE_COLUMNS,
  MAX_PROFILE_ROWS,
  MAX_SHAFTS,
  MAX_THREADS_PER_UNIT,
  MAX_TREADLES,
  type BlockDesign,
  type Draft,
  type ProfileUnitId,
  type Sett,
} from './types';

/** A block design with the palette its colours point into, ready to expand. */
export interface Profile extends Omit<BlockDesign, 'unit'> {
  name?: string;
  /** '#rrggbb' colours the orders point into. */
  palette: string[];
  sett?: Sett;
}

/** A unit the editor can offer for expanding a profile. */
export interface ProfileUnit {
  id: ProfileUnitId;
  name: string;
  /** Shafts each block adds. */
  shaftsPerBlock: number;
  /** Shafts every block shares (tie-down shafts), numbered before the block shafts. */
  sharedShafts: number;
  /** Ends and picks in one repeat of the unit. */
  width: number;
  height: number;
  /** What each warp set and weft set is, in the order {@link Profile.warpColors} and weftColors use. */
  warpSets: string[];
  weftSets: string[];
  /** Layers the cloth has (double weave 2). */
  layers: number;
  description: string;
}

export const PROFILE_UNITS: readonly ProfileUnit[] = [
  {
    id: 'double-weave',
    name: 'Double weave, two layers',
    shaftsPerBlock: 4,
    sharedShafts: 0,
    width: 4,
    height: 4,
    warpSets: ['Layer 1', 'Layer 2'],
    weftSets: ['Layer 1', 'Layer 2'],
    layers: 2,
    description:
      'Two plain-weave cloths woven one above the other that trade places block by block. ' +
      'Each block takes four shafts (two per layer), so 8 shafts weave 2 blocks. Ends and picks ' +
      'alternate layers; in a pattern block layer 1 is on top, elsewhere layer 2.',
  },
  {
    id: 'summer-and-winter',
    name: 'Summer and winter',
    shaftsPerBlock: 1,
    sharedShafts: 2,
    width: 4,
    height: 4,
    warpSets: ['All ends'],
    weftSets: ['Pattern weft', 'Plain weave (tabby) weft'],
    layers: 1,
    description:
      'A tied unit weave: shafts 1 and 2 tie the pattern weft down, and each block has one pattern ' +
      'shaft of its own (unit 1, p, 2, p), so 4 shafts weave 2 blocks. Pattern picks alternate with ' +
      'plain-weave picks; no float is longer than three threads. The pattern weft shows on the ' +
      'front in pattern blocks and on the back elsewhere.',
  },
];

export interface ExpandOptions {
  /**
   * Treadles on the loom. When the expanded draft needs no more distinct lifts than this, it is
   * given as a tie-up and treadling (one treadle per pick); otherwise it stays a lift plan.
   */
  treadles?: number;
}

/** One thread of a unit: the shaft relative to its block, and which set (layer) it belongs to. */
interface UnitThread {
  /** 0-based shaft within the block's own shafts, or a shared shaft when `shared` is set. */
  shaft: number;
  shared: boolean;
  set: number;
}

interface UnitRecipe {
  ends: UnitThread[];
  /**
   * The shafts pick `row` (0-based within the unit) lifts, given whether each block shows its
   * pattern (double weave: layer 1 on top).
   */
  lift(row: number, patternByBlock: readonly boolean[]): number[];
  /** Weft set of each pick of the unit. */
  pickSets: number[];
  /** Whether the draft records layers: the set number is then the layer. */
  layered: boolean;
}

function doubleWeave(): UnitRecipe {
  // End order A1 B1 A2 B2 (common practice): layer 1 on the block's first two shafts, layer 2 on
  // the other two, so the layers alternate end by end and share the reed evenly.
  const ends: UnitThread[] = [
    { shaft: 0, shared: false, set: 0 },
    { shaft: 2, shared: false, set: 1 },
    { shaft: 1, shared: false, set: 0 },
    { shaft: 3, shared: false, set: 1 },
  ];
  // Picks alternate layers: layer 1 on shaft 1, layer 2 on shaft 3, layer 1 on shaft 2, layer 2 on shaft 4.
  const pickSets = [0, 1, 0, 1];
  return {
    ends,
    pickSets,
    layered: true,
    lift(row, patternByBlock) {
      const layer = pickSets[row];
      const half = row >> 1; // which shaft of the pick's own layer pair weaves this pick
      const shafts: number[] = [];
      patternByBlock.forEach((layerOneUp, b) => {
        const base = b * 4;
        const upperLayer = layerOneUp ? 0 : 1;
        if (layer === upperLayer) {
          shafts.push(base + layer * 2 + half + 1);
        } else {
          // A pick of the lower layer passes under the whole upper layer, so all its shafts rise.
          shafts.push(base + upperLayer * 2 + 1, base + upperLayer * 2 + 2, base + layer * 2 + half + 1);
        }
      });
      return shafts.sort((a, b) => a - b);
    },
  };
}

function summerAndWinter(): UnitRecipe {
  // Unit 1-p-2-p: tie-down shafts 1 and 2 shared, one pattern shaft per block; treadled "singles"
  // (pattern picks on tie-downs 1 then 2, each followed by a plain-weave pick).
  const ends: UnitThread[] = [
    { shaft: 0, shared: true, set: 0 },
    { shaft: 0, shared: false, set: 0 },
    { shaft: 1, shared: true, set: 0 },
    { shaft: 0, shared: false, set: 0 },
  ];
  // Pattern on tie-down 1, plain weave a, pattern on tie-down 2, plain weave b.
  const pickSets = [0, 1, 0, 1];
  return {
    ends,
    pickSets,
    layered: false,
    lift(row, patternByBlock) {
      const blocks = patternByBlock.length;
      if (row === 1) return [1, 2];
      if (row === 3) return Array.from({ length: blocks }, (_, b) => b + 3);
      // Rising shed: a pattern shaft left down lets the pattern weft lie over its ends on the front;
      // lifted, it sends the pattern weft to the back.
      const shafts = [row === 0 ? 1 : 2];
      patternByBlock.forEach((shows, b) => {
        if (!shows) shafts.push(b + 3);
      });
      return shafts;
    },
  };
}

const RECIPES: Record<ProfileUnitId, () => UnitRecipe> = {
  'double-weave': doubleWeave,
  'summer-and-winter': summerAndWinter,
};

/** The unit with this id. @throws Error for an unknown id. */
export function profileUnit(id: ProfileUnitId): ProfileUnit {
  const unit = PROFILE_UNITS.find((u) => u.id === id);
  if (!unit) throw new Error(`"${String(id)}" is not a unit this program knows`);
  return unit;
}

/** Most blocks a unit can weave on the given number of shafts. */
export function maxBlocks(unit: ProfileUnit, shafts: number = MAX_SHAFTS): number {
  return Math.max(0, Math.floor((shafts - unit.sharedShafts) / unit.shaftsPerBlock));
}

function checkProfile(profile: Profile, unit: ProfileUnit): { endsPerUnit: number; picksPerUnit: number; blocks: number } {
  const problems: string[] = [];
  const endsPerUnit = profile.endsPerUnit ?? unit.width;
  const picksPerUnit = profile.picksPerUnit ?? unit.height;
  if (!Number.isInteger(endsPerUnit) || endsPerUnit < unit.width || endsPerUnit % unit.width !== 0) {
    problems.push(`ends per unit must be a whole multiple of ${unit.width} for ${unit.name.toLowerCase()}`);
  }
  if (!Number.isInteger(picksPerUnit) || picksPerUnit < unit.height || picksPerUnit % unit.height !== 0) {
    problems.push(`picks per unit must be a whole multiple of ${unit.height} for ${unit.name.toLowerCase()}`);
  }
  if (profile.threading.length === 0) problems.push('give the profile at least one column');
  if (profile.threading.length > MAX_PROFILE_COLUMNS) problems.push(`${profile.threading.length} profile columns is more than ${MAX_PROFILE_COLUMNS}`);
  if (profile.treadling.length > MAX_PROFILE_ROWS) problems.push(`${profile.treadling.length} profile rows is more than ${MAX_PROFILE_ROWS}`);
  if (endsPerUnit > MAX_THREADS_PER_UNIT || picksPerUnit > MAX_THREADS_PER_UNIT) problems.push(`a profile column or row can stand for at most ${MAX_THREADS_PER_UNIT} ends or picks`);
  let blocks = 0;
  profile.threading.forEach((b, i) => {
    if (!Number.isInteger(b) || b < 1) problems.push(`profile column ${i + 1}: ${String(b)} is not a block number (they start at 1)`);
    else blocks = Math.max(blocks, b);
  });
  const treadles = profile.tieup?.length;
  profile.treadling.forEach((row, i) => {
    for (const b of row) {
      if (treadles === undefined && (!Number.isInteger(b) || b < 1)) problems.push(`profile row ${i + 1}: ${String(b)} is not a block number (they start at 1)`);
      if (treadles !== undefined && (!Number.isInteger(b) || b < 1 || b > treadles)) problems.push(`profile row ${i + 1}: ${String(b)} is not one of the ${plural(treadles, 'block treadle')}`);
    }
  });
  profile.tieup?.forEach((blocksOf, t) => {
    for (const b of blocksOf) {
      if (!Number.isInteger(b) || b < 1) problems.push(`block treadle ${t + 1}: ${String(b)} is not a block number (they start at 1)`);
    }
  });
  const most = maxBlocks(unit);
  if (blocks > most) {
    problems.push(`${blocks} blocks need ${unit.sharedShafts + blocks * unit.shaftsPerBlock} shafts; ${unit.name.toLowerCase()} weaves at most ${most} blocks on ${MAX_SHAFTS}`);
  }
  const checkOrders = (orders: number[][], sets: string[], side: string) => {
    sets.forEach((set, i) => {
      const order = orders[i];
      if (!order || order.length === 0) problems.push(`${side} colours: give a colour order for "${set}"`);
      else {
        for (const c of order) {
          if (!Number.isInteger(c) || c < 0 || c >= profile.palette.length) {
            problems.push(`${side} colours for "${set}": colour ${String(c)} is not in the palette`);
          }
        }
      }
    });
  };
  checkOrders(profile.warpColors, unit.warpSets, 'warp');
  checkOrders(profile.weftColors, unit.weftSets, 'weft');
  profile.blockWarpColors?.forEach((orders, b) => {
    if (orders && orders.length > 0) checkOrders(orders, unit.warpSets, `block ${b + 1} warp`);
  });
  profile.blockWeftColors?.forEach((orders, b) => {
    if (orders && orders.length > 0) checkOrders(orders, unit.weftSets, `block ${b + 1} weft`);
  });
  if (problems.length > 0) throw new Error(`The profile cannot be expanded: ${problems.join('; ')}`);
  return { endsPerUnit, picksPerUnit, blocks };
}

/** The blocks showing the pattern in profile row `r`: the row itself, or through the block tie-up the blocks its treadles are tied to. */
export function profileRowBlocks(design: Pick<BlockDesign, 'treadling' | 'tieup'>, r: number): number[] {
  const row = design.treadling[r] ?? [];
  if (!design.tieup) return row;
  return [...new Set(row.flatMap((t) => design.tieup?.[t - 1] ?? []))].sort((a, b) => a - b);
}

/**
 * The weft block of profile row `r`, for its own weft colours: its lowest block treadle under a
 * block tie-up, else the lowest block showing the pattern in it; 0 for none.
 */
export function profileRowWeftBlock(design: Pick<BlockDesign, 'treadling'>, r: number): number {
  const row = design.treadling[r] ?? [];
  return row.length > 0 ? Math.min(...row) : 0;
}

/**
 * A block lift plan given as a block tie-up and treadling, one block treadle per different row
 * (in order of first use): the same cloth, for a weaver who treadles the blocks.
 */
export function toBlockTreadling(design: BlockDesign): BlockDesign {
  if (design.tieup) return design;
  const tieup: number[][] = [];
  const index = new Map<string, number>();
  const treadling = design.treadling.map((row) => {
    if (row.length === 0) return [];
    const key = [...row].sort((a, b) => a - b).join(',');
    let t = index.get(key);
    if (t === undefined) {
      tieup.push([...row].sort((a, b) => a - b));
      t = tieup.length;
      index.set(key, t);
    }
    return [t];
  });
  return { ...design, tieup: tieup.length > 0 ? tieup : [[1]], treadling };
}

/** A block treadling given as the block lift plan it weaves (the tie-up dropped). */
export function toBlockLiftPlan(design: BlockDesign): BlockDesign {
  if (!design.tieup) return design;
  const { tieup: _tieup, ...rest } = design;
  return { ...rest, treadling: design.treadling.map((_, r) => profileRowBlocks(design, r)) };
}

/**
 * Expands a profile with a unit into a full draft: threading, lift plan (or tie-up and treadling
 * when `options.treadles` allows), colours, layers, and for every end and pick the block link
 * (`draft.blocks.warp`: the 1-based block; `draft.blocks.weft`: the 1-based profile row).
 *
 * Blocks named in the treadling but absent from the threading have no shafts and are ignored.
 *
 * @example expandProfile({ threading: [1, 2], treadling: [[1], [2]], palette, warpColors: [[0], [1]], weftColors: [[0], [1]] }, 'double-weave')
 * @throws Error when the profile does not fit the unit (block numbers, shafts, colour orders).
 */
export function expandProfile(profile: Profile, unitId: ProfileUnitId, options: ExpandOptions = {}): Draft {
  const unit = profileUnit(unitId);
  const { endsPerUnit, picksPerUnit, blocks } = checkProfile(profile, unit);
  const recipe = RECIPES[unitId]();
  const shafts = Math.max(1, unit.sharedShafts + blocks * unit.shaftsPerBlock);

  const threading: number[][] = [];
  const warpColors: number[] = [];
  const warpLayers: number[] = [];
  const warpBlocks: number[] = [];
  // Each set counts its ends across the whole warp, so a colour order runs on unbroken from block to block.
  const warpSetCount = new Array<number>(unit.warpSets.length).fill(0);
  for (const block of profile.threading) {
    const own = profile.blockWarpColors?.[block - 1];
    const orders = own && own.length > 0 ? own : profile.warpColors;
    for (let i = 0; i < endsPerUnit; i++) {
      const t = recipe.ends[i % unit.width];
      threading.push([t.shared ? t.shaft + 1 : unit.sharedShafts + (block - 1) * unit.shaftsPerBlock + t.shaft + 1]);
      const order = orders[t.set];
      warpColors.push(order[warpSetCount[t.set]++ % order.length]);
      warpLayers.push(t.set + 1);
      warpBlocks.push(block);
    }
  }

  const lifts: number[][] = [];
  const weftColors: number[] = [];
  const weftLayers: number[] = [];
  const weftBlocks: number[] = [];
  const weftSetCount = new Array<number>(unit.weftSets.length).fill(0);
  profile.treadling.forEach((_, r) => {
    const shown = profileRowBlocks(profile, r);
    const pattern = Array.from({ length: blocks }, (_, b) => shown.includes(b + 1));
    const own = profile.blockWeftColors?.[profileRowWeftBlock(profile, r) - 1];
    const orders = own && own.length > 0 ? own : profile.weftColors;
    for (let i = 0; i < picksPerUnit; i++) {
      const k = i % unit.height;
      lifts.push(recipe.lift(k, pattern));
      const set = recipe.pickSets[k];
      const order = orders[set];
      weftColors.push(order[weftSetCount[set]++ % order.length]);
      weftLayers.push(set + 1);
      weftBlocks.push(r + 1);
    }
  });

  const base: Partial<Draft> = {
    name: profile.name ?? `${unit.name} profile`,
    shafts,
    shed: 'rising',
    threading,
    palette: profile.palette,
    warpColors,
    weftColors,
    warpLayers: recipe.layered ? warpLayers : [],
    weftLayers: recipe.layered ? weftLayers : [],
    sett: profile.sett ?? { ...DEFAULT_SETT },
    blocks: { warp: warpBlocks, weft: weftBlocks },
  };
  const treadles = options.treadles ?? 0;
  const tied = treadles > 0 ? tieUpDistinctLifts(lifts, Math.min(treadles, MAX_TREADLES)) : undefined;
  if (tied) {
    return createDraft({ ...base, control: 'treadling', treadles, tieup: tied.tieup, treadling: tied.treadling, liftplan: [] });
  }
  return createDraft({ ...base, control: 'liftplan', treadles: 0, tieup: [], treadling: [], liftplan: lifts });
}

/** One treadle per distinct lift, if they fit; treadles beyond those needed are left untied. */
export function tieUpDistinctLifts(lifts: number[][], treadles: number): { tieup: number[][]; treadling: number[][] } | undefined {
  const index = new Map<string, number>();
  const tieup: number[][] = [];
  const treadling: number[][] = [];
  for (const lift of lifts) {
    const key = lift.join(',');
    let t = index.get(key);
    if (t === undefined) {
      if (tieup.length === treadles) return undefined;
      t = tieup.length;
      index.set(key, t);
      tieup.push(lift);
    }
    treadling.push([t + 1]);
  }
  while (tieup.length < treadles) tieup.push([]);
  return { tieup, treadling };
}

/** A block design expanded into a draft, and what that did, for the weaver. */
export interface AppliedProfile {
  draft: Draft;
  /** What was expanded, kept and replaced, in sentences. */
  summary: string;
}

/**
 * Expands a block design into an existing draft, keeping what the design does not decide: the
 * name, palette, yarns, sett and notes, and the design itself (to reopen). When the draft was
 * expanded before (it has block links), ends and picks the weaver added before or after the linked
 * area are kept as drawn; the rest is replaced, and the summary names the hand edits inside the
 * old design's area that were replaced. A treadled draft stays treadled when its treadles suffice.
 *
 * @example applyProfile(draft, { ...draft.profile!, threading: [1, 2, 2, 1] }).summary
 * // "Expanded into 16 ends and 16 picks on 8 shafts. Kept 4 ends drawn outside the block design."
 * @throws Error when the design cannot be expanded (see {@link expandProfile}).
 */
export function applyProfile(draft: Draft, design: BlockDesign): AppliedProfile {
  const expand = (d: BlockDesign) => expandProfile({ ...d, palette: draft.palette, name: draft.name, sett: draft.sett }, d.unit);
  const next = expand(design);
  const ends = linkedSpan(draft.blocks?.warp, draft.threading.length);
  const oldLifts = risingLifts(draft);
  const picks = linkedSpan(draft.blocks?.weft, oldLifts.length);
  const oldWarpLayers = resolveLayerList(draft.warpLayers, draft.threading.length);
  const oldWeftLayers = resolveLayerList(draft.weftLayers, oldLifts.length);
  const newWarpLayers = resolveLayerList(next.warpLayers, next.threading.length);
  const newWeftLayers = resolveLayerList(next.weftLayers, next.liftplan.length);
  const around = <T>(old: readonly T[], span: Span, middle: readonly T[]): T[] => [...old.slice(0, span.first), ...middle, ...old.slice(span.last + 1)];

  const threading = around(draft.threading, ends, next.threading);
  const liftplan = around(oldLifts, picks, next.liftplan);
  const warpLayers = around(oldWarpLayers, ends, newWarpLayers);
  const weftLayers = around(oldWeftLayers, picks, newWeftLayers);
  const shafts = Math.max(next.shafts, ...threading.flat(), ...liftplan.flat());
  let result = createDraft({
    ...draft,
    shafts,
    shed: 'rising',
    control: 'liftplan',
    treadles: 0,
    tieup: [],
    treadling: [],
    liftplan,
    threading,
    warpColors: around(draft.warpColors, ends, next.warpColors),
    weftColors: around(draft.weftColors, picks, next.weftColors),
    warpLayers: warpLayers.every((l) => l === 1) && weftLayers.every((l) => l === 1) ? [] : warpLayers,
    weftLayers: warpLayers.every((l) => l === 1) && weftLayers.every((l) => l === 1) ? [] : weftLayers,
    blocks: { warp: around(new Array<number>(draft.threading.length).fill(0), ends, next.blocks!.warp), weft: around(new Array<number>(oldLifts.length).fill(0), picks, next.blocks!.weft) },
    profile: design,
  });
  if (draft.control === 'treadling' && draft.treadles > 0) {
    const treadled = toTreadlingDraft(result, draft.treadles);
    if (treadled.ok) result = treadled.draft;
  }

  const sentences = [`Expanded into ${plural(next.threading.length, 'end')} and ${plural(next.liftplan.length, 'pick')} on ${plural(shafts, 'shaft')}.`];
  const keptEnds = draft.threading.length - (ends.last - ends.first + 1);
  const keptPicks = oldLifts.length - (picks.last - picks.first + 1);
  if (keptEnds > 0 || keptPicks > 0) {
    sentences.push(`Kept ${[keptEnds > 0 ? plural(keptEnds, 'end') : '', keptPicks > 0 ? plural(keptPicks, 'pick') : ''].filter(Boolean).join(' and ')} drawn outside the block design.`);
  }
  if (draft.profile && draft.blocks) {
    // Hand edits: threads of the old design's area that differ from what the old design expands to.
    let before: Draft | undefined;
    try {
      before = expand(draft.profile);
    } catch {
      before = undefined;
    }
    if (before) {
      const warpLayersBefore = resolveLayerList(before.warpLayers, before.threading.length);
      const weftLayersBefore = resolveLayerList(before.weftLayers, before.liftplan.length);
      const editedEnds = changedWithin(ends, (e, i) => sameList(draft.threading[e], before.threading[i]) && draft.warpColors[e] === before.warpColors[i] && oldWarpLayers[e] === warpLayersBefore[i]);
      const editedPicks = changedWithin(picks, (p, i) => sameList(oldLifts[p], before.liftplan[i]) && draft.weftColors[p] === before.weftColors[i] && oldWeftLayers[p] === weftLayersBefore[i]);
      if (editedEnds.length > 0 || editedPicks.length > 0) {
        const what = [editedEnds.length > 0 ? `${editedEnds.length === 1 ? 'end' : 'ends'} ${numberList(editedEnds)}` : '', editedPicks.length > 0 ? `${editedPicks.length === 1 ? 'pick' : 'picks'} ${numberList(editedPicks)}` : ''];
        sentences.push(`Replaced your changes to ${what.filter(Boolean).join(' and ')} inside the old design.`);
      }
    }
  } else if (draft.threading.length > 0 || oldLifts.length > 0) {
    sentences.push(`Replaced the ${plural(draft.threading.length, 'end')} and ${plural(oldLifts.length, 'pick')} drawn before.`);
  }
  const names = draft.yarns.map((y) => y.name);
  if (names.length > 0) sentences.push(`Yarns kept: ${names.join(', ')}.`);
  return { draft: result, summary: sentences.join(' ') };
}

/** First and last thread of a run, inclusive; first > last for none. */
interface Span {
  first: number;
  last: number;
}

/** The threads from the first to the last linked to a block; all of them when there are no links. */
function linkedSpan(links: readonly number[] | undefined, n: number): Span {
  if (!links || links.length !== n || !links.some((b) => b > 0)) return { first: 0, last: n - 1 };
  return { first: links.findIndex((b) => b > 0), last: n - 1 - [...links].reverse().findIndex((b) => b > 0) };
}

/** Threads of a span (0-based) where `same(thread, positionInSpan)` fails, or that the old design did not reach. */
function changedWithin(span: Span, same: (index: number, i: number) => boolean): number[] {
  const out: number[] = [];
  for (let x = span.first; x <= span.last; x++) if (!same(x, x - span.first)) out.push(x);
  return out;
}

function sameList(a: readonly number[] | undefined, b: readonly number[] | undefined): boolean {
  return a !== undefined && b !== undefined && a.length === b.length && a.every((v, i) => v === b[i]);
}

/** The draft's picks as the shafts raised on a rising shed. */
function risingLifts(draft: Draft): number[][] {
  const lifts = liftPlanOf(draft);
  if (draft.shed === 'rising') return lifts;
  return lifts.map((l) => Array.from({ length: draft.shafts }, (_, i) => i + 1).filter((s) => !l.includes(s)));
}

function resolveLayerList(list: readonly number[], n: number): number[] {
  return Array.from(resolveLayers(list, n));
}
