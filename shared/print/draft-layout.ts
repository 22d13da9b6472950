import type { DraftArrangement, Rect } from './types';

/**
 * Where the cells of one grid land on the page. Cell (col, row) has its top-left corner at
 * (x0 + col·stepX, y0 + row·stepY); a negative step runs the grid right-to-left or bottom-up.
 */
export interface GridPlacement {
  x0: number;
  y0: number;
  stepX: number;
  stepY: number;
  cols: number;
  rows: number;
  cell: number;
}

/** The counts that decide how much room a draft's fixed parts take. */
export interface DraftShape {
  ends: number;
  picks: number;
  shafts: number;
  /** Treadles for a treadled draft, shafts for a lift plan. */
  pickColumns: number;
  liftPlan: boolean;
}

/** Height of the band that carries end (and treadle) numbers. */
export const LABEL_BAND = 12;
/** Width of the column that carries pick (and shaft) numbers: five digits at the label size. */
export const LABEL_COLUMN = 24;
/** Height of a view's caption line. */
export const CAPTION = 14;

/**
 * Every part of one page's share of the draft. Columns of `drawdown`, `threading` and
 * `warpColours` are ends counted from the tile's first end; rows of `drawdown`, `treadling` and
 * `weftColours` are picks counted from the tile's first pick; rows of `threading` and `tieup`
 * are shaft − 1; columns of `treadling` and `tieup` are treadle − 1 (or shaft − 1 in a lift plan).
 */
export interface DraftTileLayout {
  box: Rect;
  cell: number;
  drawdown: GridPlacement;
  threading: GridPlacement;
  /** Absent for a lift plan, which needs no tie-up. */
  tieup: GridPlacement | null;
  treadling: GridPlacement;
  warpColours: GridPlacement;
  weftColours: GridPlacement;
  /** The band where end and treadle numbers go. */
  endLabels: Rect;
  /** The column where pick and shaft numbers go. */
  pickLabels: Rect;
}

/** A plain grid of one cloth view (structure, a face, the layer map) with its numbers. */
export interface ViewTileLayout {
  box: Rect;
  caption: Rect;
  grid: GridPlacement;
  endLabels: Rect;
  pickLabels: Rect;
}

/** Top-left corner of a cell. */
export function cellOrigin(g: GridPlacement, col: number, row: number): { x: number; y: number } {
  return { x: g.x0 + col * g.stepX, y: g.y0 + row * g.stepY };
}

/** Centre of a cell: where a test samples its colour, where a number is centred. */
export function cellCentre(g: GridPlacement, col: number, row: number): { x: number; y: number } {
  const o = cellOrigin(g, col, row);
  return { x: o.x + g.cell / 2, y: o.y + g.cell / 2 };
}

/** The rectangle a grid covers. */
export function gridBounds(g: GridPlacement): Rect {
  const xs = [g.x0, g.x0 + (g.cols - 1) * g.stepX];
  const ys = [g.y0, g.y0 + (g.rows - 1) * g.stepY];
  const x = Math.min(...xs);
  const y = Math.min(...ys);
  return { x, y, width: g.cols * g.cell, height: g.rows * g.cell };
}

/** Cells of a draft tile that fit in an area of the given size; zero or less means none fit. */
export function draftCapacity(width: number, height: number, shape: DraftShape, cell: number): { cols: number; rows: number } {
  return {
    cols: Math.floor((width - LABEL_COLUMN - (shape.pickColumns + 3) * cell) / cell + 1e-9),
    rows: Math.floor((height - LABEL_BAND - (shape.shafts + 3) * cell) / cell + 1e-9),
  };
}

/** Cells of a view tile that fit in an area of the given size. */
export function viewCapacity(width: number, height: number, cell: number): { cols: number; rows: number } {
  return {
    cols: Math.floor((width - LABEL_COLUMN) / cell + 1e-9),
    rows: Math.floor((height - CAPTION - LABEL_BAND) / cell + 1e-9),
  };
}

/** Size of a draft tile of cols ends × rows picks. */
export function draftTileSize(shape: DraftShape, cols: number, rows: number, cell: number): { width: number; height: number } {
  return {
    width: LABEL_COLUMN + (shape.pickColumns + 3 + cols) * cell,
    height: LABEL_BAND + (shape.shafts + 3 + rows) * cell,
  };
}

/** Size of a view tile of cols ends × rows picks. */
export function viewTileSize(cols: number, rows: number, cell: number): { width: number; height: number } {
  return { width: LABEL_COLUMN + cols * cell, height: CAPTION + LABEL_BAND + rows * cell };
}

/**
 * Places a draft tile with its top-left corner at (x, y), following the weaver's arrangement:
 * the tie-up sits in the corner between threading and treadling, end 1 on the side the draft's
 * arrangement names and pick 1 next to the threading.
 * Colour orders and numbers sit on the outer side of the threading and treadling.
 */
export function placeDraftTile(
  x: number,
  y: number,
  shape: DraftShape,
  cols: number,
  rows: number,
  cell: number,
  arrangement: DraftArrangement,
): DraftTileLayout {
  const c = cell;
  const S = shape.shafts;
  const T = shape.pickColumns;
  const size = draftTileSize(shape, cols, rows, c);

  // Across: the drawdown, a gap, the treadling, a gap, the weft colours, then the numbers.
  let ddLeft: number, trLeft: number, weftX: number, labelX: number;
  if (arrangement.treadlingRight) {
    ddLeft = x;
    trLeft = ddLeft + cols * c + c;
    weftX = trLeft + T * c + c;
    labelX = weftX + c;
  } else {
    labelX = x;
    weftX = x + LABEL_COLUMN;
    trLeft = weftX + c + c;
    ddLeft = trLeft + T * c + c;
  }
  const endX0 = arrangement.endOneRight ? ddLeft + (cols - 1) * c : ddLeft;
  const endStep = arrangement.endOneRight ? -c : c;
  const treadleX0 = arrangement.treadlingRight ? trLeft : trLeft + (T - 1) * c;
  const treadleStep = arrangement.treadlingRight ? c : -c;

  // Down: the numbers, the warp colours, a gap, the threading, a gap, the drawdown (or mirrored).
  let labelY: number, warpY: number, thrTop: number, ddTop: number;
  if (arrangement.threadingAbove) {
    labelY = y;
    warpY = y + LABEL_BAND;
    thrTop = warpY + c + c;
    ddTop = thrTop + S * c + c;
  } else {
    ddTop = y;
    thrTop = ddTop + rows * c + c;
    warpY = thrTop + S * c + c;
    labelY = warpY + c;
  }
  const pickY0 = arrangement.threadingAbove ? ddTop : ddTop + (rows - 1) * c;
  const pickStep = arrangement.threadingAbove ? c : -c;
  const shaftY0 = arrangement.shaftsFromBottom ? thrTop + (S - 1) * c : thrTop;
  const shaftStep = arrangement.shaftsFromBottom ? -c : c;

  const grid = (x0: number, y0: number, stepX: number, stepY: number, gc: number, gr: number): GridPlacement => ({
    x0, y0, stepX, stepY, cols: gc, rows: gr, cell: c,
  });
  return {
    box: { x, y, width: size.width, height: size.height },
    cell: c,
    drawdown: grid(endX0, pickY0, endStep, pickStep, cols, rows),
    threading: grid(endX0, shaftY0, endStep, shaftStep, cols, S),
    tieup: shape.liftPlan ? null : grid(treadleX0, shaftY0, treadleStep, shaftStep, T, S),
    treadling: grid(treadleX0, pickY0, treadleStep, pickStep, T, rows),
    warpColours: grid(endX0, warpY, endStep, c, cols, 1),
    weftColours: grid(weftX, pickY0, c, pickStep, 1, rows),
    endLabels: { x: ddLeft, y: labelY, width: trLeft + T * c - ddLeft, height: LABEL_BAND },
    pickLabels: { x: labelX, y, width: LABEL_COLUMN, height: size.height },
  };
}

/** Places a view tile at (x, y): caption on top, numbers on the threading and treadling sides. */
export function placeViewTile(x: number, y: number, cols: number, rows: number, cell: number, arrangement: DraftArrangement): ViewTileLayout {
  const c = cell;
  const size = viewTileSize(cols, rows, c);
  const gridLeft = arrangement.treadlingRight ? x : x + LABEL_COLUMN;
  const labelX = arrangement.treadlingRight ? x + cols * c : x;
  const gridTop = arrangement.threadingAbove ? y + CAPTION + LABEL_BAND : y + CAPTION;
  const labelY = arrangement.threadingAbove ? y + CAPTION : gridTop + rows * c;
  return {
    box: { x, y, width: size.width, height: size.height },
    caption: { x, y, width: size.width, height: CAPTION },
    grid: {
      x0: arrangement.endOneRight ? gridLeft + (cols - 1) * c : gridLeft,
      y0: arrangement.threadingAbove ? gridTop : gridTop + (rows - 1) * c,
      stepX: arrangement.endOneRight ? -c : c,
      stepY: arrangement.threadingAbove ? c : -c,
      cols,
      rows,
      cell: c,
    },
    endLabels: { x: gridLeft, y: labelY, width: cols * c, height: LABEL_BAND },
    pickLabels: { x: labelX, y: gridTop, width: LABEL_COLUMN, height: rows * c },
  };
}
