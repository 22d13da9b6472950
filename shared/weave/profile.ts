import { createDraft, DEFAULT_SETT } from './draft';
import { MAX_SHAFTS, MAX_TREADLES, type Draft, type Sett } from './types';

/**
 * A block design: which block each group of ends and picks belongs to, expanded later with a unit.
 * Block numbers are 1-based, as the weaver counts them.
 */
export interface Profile {
  name?: string;
  /** Per profile column (block-end): the 1-based block whose unit fills it. */
  threading: number[];
  /**
   * Per profile row (block-pick): the 1-based blocks where the pattern shows — for double weave,
   * where layer 1 is on top; every other block has layer 2 on top.
   */
  treadling: number[][];
  /** Ends per profile column; a whole multiple of the unit's own width. Default: the unit's width. */
  endsPerUnit?: number;
  /** Picks per profile row; a whole multiple of the unit's own height. Default: the unit's height. */
  picksPerUnit?: number;
  /** '#rrggbb' colours the orders below point into. */
  palette: string[];
  /**
   * Per warp set of the unit (see {@link ProfileUnit.warpSets}): a colour order as palette indices,
   * repeated over the ends of that set. Double weave: [layer 1 order, layer 2 order].
   */
  warpColors: number[][];
  /** Per weft set of the unit, as for the warp. */
  weftColors: number[][];
  sett?: Sett;
}

export type ProfileUnitId = 'double-weave' | 'summer-and-winter';

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
  let blocks = 0;
  profile.threading.forEach((b, i) => {
    if (!Number.isInteger(b) || b < 1) problems.push(`profile column ${i + 1}: ${String(b)} is not a block number (they start at 1)`);
    else blocks = Math.max(blocks, b);
  });
  profile.treadling.forEach((row, i) => {
    for (const b of row) {
      if (!Number.isInteger(b) || b < 1) problems.push(`profile row ${i + 1}: ${String(b)} is not a block number (they start at 1)`);
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
  if (problems.length > 0) throw new Error(`The profile cannot be expanded: ${problems.join('; ')}`);
  return { endsPerUnit, picksPerUnit, blocks };
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
  const warpSetCount = new Array<number>(unit.warpSets.length).fill(0);
  for (const block of profile.threading) {
    for (let i = 0; i < endsPerUnit; i++) {
      const t = recipe.ends[i % unit.width];
      threading.push([t.shared ? t.shaft + 1 : unit.sharedShafts + (block - 1) * unit.shaftsPerBlock + t.shaft + 1]);
      const order = profile.warpColors[t.set];
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
  profile.treadling.forEach((row, r) => {
    const pattern = Array.from({ length: blocks }, (_, b) => row.includes(b + 1));
    for (let i = 0; i < picksPerUnit; i++) {
      const k = i % unit.height;
      lifts.push(recipe.lift(k, pattern));
      const set = recipe.pickSets[k];
      const order = profile.weftColors[set];
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
function tieUpDistinctLifts(lifts: number[][], treadles: number): { tieup: number[][]; treadling: number[][] } | undefined {
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
