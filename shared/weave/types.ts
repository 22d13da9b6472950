/**
 * The draft document: everything a weaver decides about one cloth.
 *
 * Counted things a weaver sees (shafts, treadles, layers, blocks) are 1-based numbers;
 * positions in arrays (end, pick, palette entry) are 0-based indices.
 */
export const DRAFT_SCHEMA_VERSION = 3;

export const MAX_SHAFTS = 32;
export const MAX_TREADLES = 32;
export const MAX_THREADS = 20_000;

export type Shed = 'rising' | 'sinking';

/** Which list decides the picks: treadles through the tie-up, or shafts lifted directly. */
export type PickControl = 'treadling' | 'liftplan';

export type LengthUnit = 'inch' | 'cm';

export interface Sett {
  /** Ends per unit of width. */
  warp: number;
  /** Picks per unit of length. */
  weft: number;
  unit: LengthUnit;
}

export interface DraftYarn {
  id: string;
  name: string;
  /** Index into the palette of the colour this yarn is shown in. */
  color: number;
}

/** For drafts expanded from a profile: the 1-based block each end and pick came from (0 = none). */
export interface BlockLinks {
  warp: number[];
  weft: number[];
}

/** Units a block design can be expanded with (profile.ts describes each). */
export const PROFILE_UNIT_IDS = ['double-weave', 'summer-and-winter'] as const;
export type ProfileUnitId = (typeof PROFILE_UNIT_IDS)[number];

/** Most profile columns (block-ends) and rows (block-picks) a block design may have. */
export const MAX_PROFILE_COLUMNS = 200;
export const MAX_PROFILE_ROWS = 200;
/** Most ends (or picks) one profile column (or row) may stand for. */
export const MAX_THREADS_PER_UNIT = 64;

/**
 * A block design: which block each group of ends and picks belongs to, expanded with a unit into
 * the full draft (profile.ts). Kept in the draft it was expanded into, so it can be reopened.
 * Block numbers are 1-based; colours are indices into the draft's palette.
 */
export interface BlockDesign {
  unit: ProfileUnitId;
  /** Per profile column (block-end): the block whose unit fills it. */
  threading: number[];
  /**
   * Per profile row (block-pick), a block lift plan: the blocks where the pattern shows (for double
   * weave, where layer 1 is on top; every other block has layer 2 on top).
   */
  treadling: number[][];
  /** Ends per profile column; a whole multiple of the unit's own width. Default: the unit's width. */
  endsPerUnit?: number;
  /** Picks per profile row; a whole multiple of the unit's own height. Default: the unit's height. */
  picksPerUnit?: number;
  /**
   * Per warp set of the unit (double weave: layer 1, layer 2): a colour order, repeated over the
   * ends of that set, so [dark, light] in one layer and [dark] in the other weaves colour-and-weave
   * inside each block.
   */
  warpColors: number[][];
  /** Per weft set of the unit, as for the warp. */
  weftColors: number[][];
  /** Per block (entry block − 1): its own warp colour orders per set; a missing or empty entry uses `warpColors`. */
  blockWarpColors?: number[][][];
  /**
   * A block tie-up: per block treadle, the blocks where it shows the pattern. When given, the
   * profile rows are a block treadling: each row of `treadling` names the block treadles pressed
   * (1-based), not blocks.
   */
  tieup?: number[][];
  /**
   * Per weft block (entry block − 1): its own weft colour orders per set; a missing or empty entry
   * uses `weftColors`. A row's weft block is its (first) block treadle under a block tie-up, else
   * the first block showing the pattern in it; a row showing none uses `weftColors`.
   */
  blockWeftColors?: number[][][];
}

/**
 * How the draft is laid out, seen from the front of the loom: the one arrangement the editor, the
 * cloth views, pictures, the print and the loom-side lists all follow.
 */
export interface DraftArrangement {
  /** The side end 1 is on. */
  endOne: 'left' | 'right';
  /** The threading above or below the drawdown (pick 1 is next to it). */
  threading: 'above' | 'below';
  /** The treadling or lift plan to the right or left of the drawdown. */
  treadling: 'right' | 'left';
  /** Shaft 1 as the bottom or the top row of the threading. */
  shaftOne: 'bottom' | 'top';
}

/** The arrangement of a draft that names none: as the editor has always shown drafts. */
export const DEFAULT_ARRANGEMENT: Readonly<DraftArrangement> = { endOne: 'left', threading: 'above', treadling: 'right', shaftOne: 'bottom' };

/** The draft's arrangement, the default where it names none. */
export function arrangementOf(draft: Pick<Draft, 'arrangement'>): DraftArrangement {
  return { ...DEFAULT_ARRANGEMENT, ...draft.arrangement };
}

export interface Draft {
  schemaVersion: typeof DRAFT_SCHEMA_VERSION;
  name: string;
  shafts: number;
  /** 0 when the loom has no treadles (table or dobby loom). */
  treadles: number;
  shed: Shed;
  control: PickControl;
  /** Per end: the 1-based shafts it is threaded on; [] for an end on no shaft. */
  threading: number[][];
  /** Per treadle: the 1-based shafts tied to it. */
  tieup: number[][];
  /** Per pick: the 1-based treadles pressed together. */
  treadling: number[][];
  /** Per pick: the 1-based shafts lifted. */
  liftplan: number[][];
  /** '#rrggbb' colours. */
  palette: string[];
  /** Per end: palette index. Same length as threading. */
  warpColors: number[];
  /** Per pick: palette index. Same length as the controlling pick list. */
  weftColors: number[];
  /** Per end: 1-based layer. Empty means every end is in layer 1. */
  warpLayers: number[];
  /** Per pick: 1-based layer. Empty means every pick is in layer 1. */
  weftLayers: number[];
  sett: Sett;
  yarns: DraftYarn[];
  notes: string;
  blocks?: BlockLinks;
  /** The block design the draft was expanded from, to reopen and change. */
  profile?: BlockDesign;
  /** How the draft is laid out (absent: {@link DEFAULT_ARRANGEMENT}). */
  arrangement?: DraftArrangement;
}
