import { createDraft, DEFAULT_PALETTE } from './draft';
import { applyProfile, profileUnit, tieUpDistinctLifts } from './profile';
import { asLists, pointDraw, straightDraw, twillTieup } from './sequences';
import { MAX_PROFILE_COLUMNS, MAX_PROFILE_ROWS, MAX_SHAFTS, MAX_THREADS, MAX_TREADLES, type BlockDesign, type Draft, type ProfileUnitId } from './types';

/** What a new draft starts with, before the weaver draws anything. */
export const STARTING_STRUCTURES = ['empty', 'plain', 'straight-twill', 'point-twill', 'block'] as const;
export type StartingStructure = (typeof STARTING_STRUCTURES)[number];

export interface StartingDraftOptions {
  name: string;
  shafts: number;
  /** Treadles on the loom; 0 for a loom worked by a lift plan (table and dobby looms). */
  treadles: number;
  ends: number;
  picks: number;
  structure: StartingStructure;
  /** The unit of a block design (only for `structure: 'block'`). */
  unit?: ProfileUnitId;
}

/** A starting choice that cannot be made on the loom described; `field` names the form field at fault. */
export class StartingDraftError extends Error {
  constructor(readonly field: keyof StartingDraftOptions, message: string) {
    super(message);
  }
}

const cycle = <T>(list: readonly T[], length: number): T[] => Array.from({ length }, (_, i) => list[i % list.length]);

/** One repeat of a structure: threading and lifts as 1-based shaft numbers. */
interface Repeat {
  threading: number[][];
  /** Per pick of the repeat: the shafts lifted. */
  lifts: number[][];
}

/**
 * The twill a weaver means by "a twill on n shafts" when nothing more is said: as balanced as n
 * allows, more down than up when n is odd (2/2 on four shafts, 1/2 on three, 4/4 on eight).
 */
export function balancedTwill(shafts: number): [up: number, down: number] {
  const up = Math.floor(shafts / 2);
  return [up, shafts - up];
}

function checkLoom(o: StartingDraftOptions): void {
  const whole = (n: number) => Number.isInteger(n);
  if (!whole(o.shafts) || o.shafts < 2 || o.shafts > MAX_SHAFTS) throw new StartingDraftError('shafts', `Shafts must be a whole number from 2 to ${MAX_SHAFTS}`);
  if (!whole(o.treadles) || o.treadles < 0 || o.treadles > MAX_TREADLES) throw new StartingDraftError('treadles', `Treadles must be a whole number from 1 to ${MAX_TREADLES}, or none for a lift plan`);
  if (!whole(o.ends) || o.ends < 1 || o.ends > MAX_THREADS) throw new StartingDraftError('ends', `Ends must be a whole number from 1 to ${MAX_THREADS}`);
  if (!whole(o.picks) || o.picks < 1 || o.picks > MAX_THREADS) throw new StartingDraftError('picks', `Picks must be a whole number from 1 to ${MAX_THREADS}`);
}

function structureRepeat(o: StartingDraftOptions): Repeat {
  const n = o.shafts;
  switch (o.structure) {
    case 'plain': {
      // Plain weave: alternate ends up on alternate picks. Threaded straight over an even number of
      // shafts so that odd and even shafts alternate across every repeat (a checkerboard).
      const used = n - (n % 2);
      const odd = straightDraw(used).filter((s) => s % 2 === 1);
      const even = straightDraw(used).filter((s) => s % 2 === 0);
      return { threading: asLists(straightDraw(used)), lifts: [odd, even] };
    }
    case 'straight-twill':
    case 'point-twill': {
      if (n < 3) throw new StartingDraftError('shafts', 'A twill needs at least 3 shafts; on 2 shafts choose plain weave');
      // Lifts of treadle t of the twill tie-up; treadled 1, 2, … n the twill line steps one end per pick.
      const lifts = twillTieup(balancedTwill(n));
      if (o.structure === 'straight-twill') return { threading: asLists(straightDraw(n)), lifts };
      // Point twill: threaded and treadled on a point draw, so the lines turn into diamonds.
      return { threading: asLists(pointDraw(n)), lifts: pointDraw(n).map((t) => lifts[t - 1]) };
    }
    default:
      return { threading: [[]], lifts: [[]] };
  }
}

/** Tie-up and treadling for the lifts, one treadle per distinct lift, or an error naming the treadles. */
function treadlesFor(lifts: number[][], treadles: number): { tieup: number[][]; treadling: number[][] } {
  const tied = tieUpDistinctLifts(lifts, treadles);
  if (!tied) {
    const needed = new Set(lifts.map((l) => l.join(','))).size;
    throw new StartingDraftError('treadles', `This structure needs ${needed} treadles; the loom has ${treadles}. Give more treadles or use a lift plan`);
  }
  return tied;
}

/**
 * The block design's starting draft: two blocks side by side, trading places every two rows, over as
 * many profile columns and rows as the ends and picks asked for need (rounded up to whole units).
 * The design is kept with the draft, so the block design opens on it.
 */
function blockDraft(o: StartingDraftOptions): Draft {
  if (!o.unit) throw new StartingDraftError('unit', 'Choose the unit of the block design');
  const unit = profileUnit(o.unit);
  const needed = unit.sharedShafts + 2 * unit.shaftsPerBlock;
  if (o.shafts < needed) throw new StartingDraftError('shafts', `${unit.name} in 2 blocks needs ${needed} shafts; the loom has ${o.shafts}`);
  const columns = Math.ceil(o.ends / unit.width);
  const rows = Math.ceil(o.picks / unit.height);
  if (columns > MAX_PROFILE_COLUMNS) throw new StartingDraftError('ends', `A block design starts with at most ${MAX_PROFILE_COLUMNS * unit.width} ends in this unit`);
  if (rows > MAX_PROFILE_ROWS) throw new StartingDraftError('picks', `A block design starts with at most ${MAX_PROFILE_ROWS * unit.height} picks in this unit`);
  const sets = (names: readonly string[]) => names.map((_, i) => [i % DEFAULT_PALETTE.length]);
  const design: BlockDesign = {
    unit: o.unit,
    threading: cycle([1, 1, 2, 2], columns),
    treadling: cycle([[1], [1], [2], [2]], rows).map((row) => [...row]),
    warpColors: sets(unit.warpSets),
    weftColors: sets(unit.weftSets),
  };
  const loom = createDraft({
    name: o.name,
    shafts: o.shafts,
    treadles: o.treadles,
    control: o.treadles > 0 ? 'treadling' : 'liftplan',
    tieup: Array.from({ length: o.treadles }, () => []),
  });
  const { draft } = applyProfile(loom, design);
  return { ...draft, shafts: Math.max(draft.shafts, o.shafts) };
}

/**
 * The first version of a new draft: a loom of the size given and a starting structure repeated
 * over the ends and picks asked for, woven with treadles when the loom has them, else a lift plan.
 *
 * @example startingDraft({ name: 'Towels', shafts: 4, treadles: 6, ends: 240, picks: 300, structure: 'straight-twill' })
 * @throws StartingDraftError naming the field when the structure cannot be set up on that loom.
 */
export function startingDraft(o: StartingDraftOptions): Draft {
  checkLoom(o);
  if (o.structure === 'block') return blockDraft(o);
  const repeat = structureRepeat(o);
  const lifts = cycle(repeat.lifts, o.picks);
  const empty = o.structure === 'empty';
  const picks = o.treadles > 0
    ? { control: 'treadling' as const, ...(empty ? { tieup: Array.from({ length: o.treadles }, () => []), treadling: lifts } : treadlesFor(lifts, o.treadles)), liftplan: [] }
    : { control: 'liftplan' as const, tieup: [], treadling: [], liftplan: lifts };
  return createDraft({
    name: o.name,
    shafts: o.shafts,
    treadles: o.treadles,
    threading: cycle(repeat.threading, o.ends),
    ...picks,
  });
}
