/**
 * The draft document: everything a weaver decides about one cloth.
 *
 * Counted things a weaver sees (shafts, treadles, layers, blocks) are 1-based numbers;
 * positions in arrays (end, pick, palette entry) are 0-based indices.
 */
export const DRAFT_SCHEMA_VERSION = 1;

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
}
