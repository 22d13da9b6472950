import { arrangementOf, type Draft, type DraftArrangement } from '../../../../shared/weave';
import type { GridId } from '../store/grids';

/** Where the grids go, in the editor's words: the draft's own arrangement (see {@link arrangementFromDraft}). */
export interface Arrangement {
  threadingBelow: boolean;
  treadlingLeft: boolean;
  /** Shaft 1 at the top row instead of the bottom. */
  shaftsFromTop: boolean;
  /** End 1 at the right of the drawdown: the threading, colour and layer rows and the drawdown run right to left. */
  endOneRight: boolean;
}

/** The editor's arrangement from the draft's. */
export function arrangementFromDraft(draft: Draft): Arrangement {
  const a = arrangementOf(draft);
  return { threadingBelow: a.threading === 'below', treadlingLeft: a.treadling === 'left', shaftsFromTop: a.shaftOne === 'top', endOneRight: a.endOne === 'right' };
}

/** The draft's arrangement from the editor's. */
export function draftArrangement(a: Arrangement): DraftArrangement {
  return { endOne: a.endOneRight ? 'right' : 'left', threading: a.threadingBelow ? 'below' : 'above', treadling: a.treadlingLeft ? 'left' : 'right', shaftOne: a.shaftsFromTop ? 'top' : 'bottom' };
}

/**
 * Where a stage x lands when end 1 is on the right: the ends' grids are mirrored inside their
 * common band (the drawdown's columns), so painting and pointing both go through this. Its own inverse.
 */
export function mirrorX(layout: Layout, x: number): number {
  const band = layout.endRuler;
  return 2 * band.x + band.width - x;
}

/** True for the stage x inside the ends' band (where mirroring applies). */
export function inEndBand(layout: Layout, x: number): boolean {
  return x >= layout.endRuler.x && x < layout.endRuler.x + layout.endRuler.width;
}

export type RegionId = GridId | 'drawdown';

/** One grid on the stage: its box in stage pixels, its size in cells, and which scroll it follows. */
export interface Region {
  id: RegionId;
  x: number;
  y: number;
  width: number;
  height: number;
  cols: number;
  rows: number;
  scrollsX: boolean;
  scrollsY: boolean;
}

export interface Layout {
  cell: number;
  regions: Region[];
  /** The rulers: a strip of end numbers and a strip of pick numbers. */
  endRuler: { x: number; y: number; width: number; height: number };
  pickRuler: { x: number; y: number; width: number; height: number };
  /** End 1 on the right: the grids that scroll across are drawn mirrored in their band ({@link mirrorX}). */
  mirrored: boolean;
  /** Largest scroll offsets in pixels. */
  maxScrollX: number;
  maxScrollY: number;
  width: number;
  height: number;
}

export const GAP = 6;
export const RULER_HEIGHT = 18;
export const RULER_WIDTH = 34;
/** Empty ends and picks shown past the last ones, where drawing grows the draft. */
export const GROW_MARGIN = 8;

/**
 * Lays out the grids in the weaver's arrangement for a stage of the given size. Ends run left to
 * right and picks top to bottom; the drawdown takes whatever room the other grids leave.
 */
export function computeLayout(
  draft: Draft,
  arrangement: Arrangement,
  cell: number,
  stageWidth: number,
  stageHeight: number,
  /** Show the warp and weft layer rows, beside the colour rows on the outside. */
  layerRows = false,
): Layout {
  const liftplan = draft.control === 'liftplan';
  const ends = draft.threading.length;
  const picks = liftplan ? draft.liftplan.length : draft.treadling.length;
  const endCols = ends + GROW_MARGIN;
  const pickRows = picks + GROW_MARGIN;
  const sideCols = liftplan ? draft.shafts : Math.max(1, draft.treadles);
  const shaftRows = draft.shafts;

  // Fixed strips across: ruler, weft colours (and layers), pick list (in cells), drawdown takes the rest.
  const layerStrip = layerRows ? cell + GAP : 0;
  const fixedW = RULER_WIDTH + cell + sideCols * cell + 3 * GAP + layerStrip;
  const fixedH = RULER_HEIGHT + cell + shaftRows * cell + 3 * GAP + layerStrip;
  const ddW = Math.max(cell, Math.min(endCols * cell, stageWidth - fixedW));
  const ddH = Math.max(cell, Math.min(pickRows * cell, stageHeight - fixedH));

  // Columns left to right and rows top to bottom, in the weaver's arrangement.
  const { treadlingLeft, threadingBelow } = arrangement;
  const shown = <K extends string>(order: K[]) => (layerRows ? order : order.filter((k) => k !== 'layers'));
  const across = stack(shown(treadlingLeft ? ['ruler', 'layers', 'weft', 'side', 'dd'] : ['dd', 'side', 'weft', 'layers', 'ruler']), { ruler: RULER_WIDTH, layers: cell, weft: cell, side: sideCols * cell, dd: ddW });
  const down = stack(shown(threadingBelow ? ['dd', 'shafts', 'warp', 'layers', 'ruler'] : ['ruler', 'layers', 'warp', 'shafts', 'dd']), { ruler: RULER_HEIGHT, layers: cell, warp: cell, shafts: shaftRows * cell, dd: ddH });
  const colX = across.at;
  const rowY = down.at;
  const x = across.total;
  const y = down.total;

  const region = (id: RegionId, rx: number, ry: number, width: number, height: number, cols: number, rows: number, scrollsX: boolean, scrollsY: boolean): Region => ({
    id, x: rx, y: ry, width, height, cols, rows, scrollsX, scrollsY,
  });
  const regions: Region[] = [
    region('warpColors', colX.dd, rowY.warp, ddW, cell, endCols, 1, true, false),
    region('threading', colX.dd, rowY.shafts, ddW, shaftRows * cell, endCols, shaftRows, true, false),
    region('drawdown', colX.dd, rowY.dd, ddW, ddH, ends, picks, true, true),
    region(liftplan ? 'liftplan' : 'treadling', colX.side, rowY.dd, sideCols * cell, ddH, sideCols, pickRows, false, true),
    region('weftColors', colX.weft, rowY.dd, cell, ddH, 1, pickRows, false, true),
  ];
  if (layerRows) {
    regions.push(
      region('warpLayers', colX.dd, rowY.layers, ddW, cell, endCols, 1, true, false),
      region('weftLayers', colX.layers, rowY.dd, cell, ddH, 1, pickRows, false, true),
    );
  }
  if (!liftplan) regions.push(region('tieup', colX.side, rowY.shafts, sideCols * cell, shaftRows * cell, sideCols, shaftRows, false, false));

  return {
    cell,
    regions,
    endRuler: { x: colX.dd, y: rowY.ruler, width: ddW, height: RULER_HEIGHT },
    pickRuler: { x: colX.ruler, y: rowY.dd, width: RULER_WIDTH, height: ddH },
    mirrored: arrangement.endOneRight,
    maxScrollX: Math.max(0, endCols * cell - ddW),
    maxScrollY: Math.max(0, pickRows * cell - ddH),
    width: x,
    height: y,
  };
}

/** Places strips one after another with a gap between: where each starts, and the length of all. */
function stack<K extends string>(order: readonly K[], sizes: Record<K, number>): { at: Record<K, number>; total: number } {
  const at = {} as Record<K, number>;
  let pos = 0;
  order.forEach((k, i) => {
    at[k] = pos;
    pos += sizes[k] + (i < order.length - 1 ? GAP : 0);
  });
  return { at, total: pos };
}

/** The shaft (1-based) shown on a row of threading, tie-up or lift plan rows, and back. */
export function shaftOfRow(row: number, shafts: number, fromTop: boolean): number {
  return fromTop ? row + 1 : shafts - row;
}
export const rowOfShaft = (shaft: number, shafts: number, fromTop: boolean): number => (fromTop ? shaft - 1 : shafts - shaft);

/** A cell of a grid in the draft's terms: 0-based index along the list, 1-based value (shaft or treadle). */
export interface CellRef {
  grid: RegionId;
  /** 0-based end, treadle or pick. */
  index: number;
  /** 1-based shaft or treadle; 0 for the colour orders; for the drawdown, the 0-based pick. */
  value: number;
}

/** Which column and row of a region a cell sits in: the inverse of {@link cellAt}. */
export function cellPosition(ref: CellRef, draftShafts: number, fromTop: boolean): { col: number; row: number } {
  switch (ref.grid) {
    case 'threading':
      return { col: ref.index, row: rowOfShaft(ref.value, draftShafts, fromTop) };
    case 'tieup':
      return { col: ref.index, row: rowOfShaft(ref.value, draftShafts, fromTop) };
    case 'treadling':
    case 'liftplan':
      return { col: ref.value - 1, row: ref.index };
    case 'warpColors':
    case 'warpLayers':
      return { col: ref.index, row: 0 };
    case 'weftColors':
    case 'weftLayers':
      return { col: 0, row: ref.index };
    case 'drawdown':
      return { col: ref.index, row: ref.value };
  }
}

/** The cell at a column and row of a region (the inverse of {@link cellPosition}). */
export function refAt(grid: RegionId, col: number, row: number, shafts: number, fromTop: boolean): CellRef {
  switch (grid) {
    case 'threading':
    case 'tieup':
      return { grid, index: col, value: shaftOfRow(row, shafts, fromTop) };
    case 'treadling':
    case 'liftplan':
      return { grid, index: row, value: col + 1 };
    case 'warpColors':
    case 'warpLayers':
      return { grid, index: col, value: 0 };
    case 'weftColors':
    case 'weftLayers':
      return { grid, index: row, value: 0 };
    case 'drawdown':
      return { grid, index: col, value: row };
  }
}

/** The cell under a stage point, or null outside every grid. */
export function cellAt(layout: Layout, stageX: number, py: number, scrollX: number, scrollY: number, shafts: number, fromTop: boolean): CellRef | null {
  const px = layout.mirrored && inEndBand(layout, stageX) ? mirrorX(layout, stageX) : stageX;
  const r = regionAt(layout, px, py);
  if (!r) return null;
  const col = Math.floor((px - r.x + (r.scrollsX ? scrollX : 0)) / layout.cell);
  const row = Math.floor((py - r.y + (r.scrollsY ? scrollY : 0)) / layout.cell);
  if (col < 0 || row < 0 || col >= r.cols || row >= r.rows) return null;
  return refAt(r.id, col, row, shafts, fromTop);
}

export function regionAt(layout: Layout, px: number, py: number): Region | null {
  return layout.regions.find((r) => px >= r.x && py >= r.y && px < r.x + r.width && py < r.y + r.height) ?? null;
}

/** The stage x of the left edge of a column of a region, scrolled, mirrored when end 1 is on the right. */
export function columnX(layout: Layout, r: Region, col: number, scrollX: number): number {
  const x = r.x + col * layout.cell - (r.scrollsX ? scrollX : 0);
  return layout.mirrored && r.scrollsX ? mirrorX(layout, x + layout.cell) : x;
}

/** The region of a grid, if the layout shows it. */
export function regionOf(layout: Layout, id: RegionId): Region | undefined {
  return layout.regions.find((r) => r.id === id);
}
