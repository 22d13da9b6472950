import { chooseCellSize, MAX_CELL_MM, PT_PER_MM } from './cell-size';
import {
  draftCapacity,
  draftTileSize,
  LABEL_COLUMN,
  placeDraftTile,
  placeViewTile,
  viewCapacity,
  viewTileSize,
  type DraftShape,
  type DraftTileLayout,
  type ViewTileLayout,
} from './draft-layout';
import { splitGrid, type GridSplit, type Span, type Tile } from './page-split';
import type { DraftArrangement, Rect, Size } from './types';

/** Cloth views printed after the draft itself, each as a plain grid. */
export type PrintView = 'structure' | 'front' | 'back' | 'layers';

/** White space around the page (half an inch, common practice for home and office printers). */
export const PAGE_MARGIN = 36;
/** Room at the top of every draft page for the title block or the running head. */
export const HEAD_HEIGHT = 56;
/** Space between blocks on a page. */
export const BLOCK_GAP = 14;
/** Ends and picks repeated at the edge of a page so the pages can be lined up. */
export const PAGE_OVERLAP = 2;
export const LEGEND_ROW = 14;
export const LEGEND_HEAD = 18;

export type PagePart =
  | { kind: 'draft'; tile: Tile; across: number; down: number; layout: DraftTileLayout }
  | { kind: 'view'; view: PrintView; tile: Tile; across: number; down: number; layout: ViewTileLayout }
  /** Rows [first, first + count) of the legend, with a heading when `first` is 0 or continued. */
  | { kind: 'legend'; box: Rect; first: number; count: number };

export interface PrintPage {
  parts: PagePart[];
}

export interface DraftPagesInput {
  page: Size;
  shape: DraftShape;
  arrangement: DraftArrangement;
  /** Views to print after the draft, in order. */
  views: readonly PrintView[];
  legendRows: number;
  overlap?: number;
  /**
   * A view that would need more sheets than this prints only its first sheet (end 1 and pick 1
   * onwards). The draft sheets always carry every end and pick; the views repeat them.
   */
  maxViewSheets?: number;
  /** The ends and picks to print (0-based, [start, end)); default every one. Numbers stay the draft's. */
  window?: { ends: Span; picks: Span };
  /**
   * Print every end of the window across one page width, with cells as small as that needs (down
   * to MIN_FIT_CELL_MM); the picks still run onto as many pages as they need.
   */
  fitWidth?: boolean;
}

/** The smallest cell "fit the width" may use: finer than this a printer blurs the marks (common practice). */
export const MIN_FIT_CELL_MM = 0.5;

/** What a view printed when it was cut to its first sheet. */
export interface ViewCut {
  ends: Span;
  picks: Span;
  /** Sheets the whole view would have needed. */
  fullSheets: number;
}

export interface DraftPages {
  /** Cell size in points. */
  cell: number;
  /** Cell size of the cloth views, in points: at most `cell`. */
  viewCell: number;
  /** Area inside the margins and below the head, shared by every draft page. */
  body: Rect;
  pages: PrintPage[];
  /** Set when the views were cut to their first sheet (see `maxViewSheets`). */
  viewCut?: ViewCut;
}

/**
 * Lays out the draft pages: the draft (threading, tie-up, treadling or lift plan, colour
 * orders, drawdown in colour) split into tiles, then each view, then the colour legend. Small
 * blocks share a page, filling it in rows; a block too big for one page gets pages of its own.
 * The cell size is the largest that needs no more pages than the smallest legible one.
 *
 * @throws RangeError when not even the smallest cell leaves room for the drawdown.
 */
export function planDraftPages(input: DraftPagesInput): DraftPages {
  const body: Rect = {
    x: PAGE_MARGIN,
    y: PAGE_MARGIN + HEAD_HEIGHT,
    width: input.page.width - 2 * PAGE_MARGIN,
    height: input.page.height - 2 * PAGE_MARGIN - HEAD_HEIGHT,
  };
  // Candidate sizes only need counting; placing every part is left to the chosen one.
  const count = (c: number, v: number) => layoutAt(input, body, c, true, v)?.pages.length ?? Number.POSITIVE_INFINITY;
  const cell = input.fitWidth ? fitWidthCell(input, body) : chooseCellSize((c) => count(c, c));
  // The cloth views are pictures, read by eye rather than counted cell by cell: they may be
  // smaller than the draft's cells when that saves sheets (two views to a page, say).
  const cellMm = cell / PT_PER_MM;
  const viewCell = input.fitWidth || cellMm <= MIN_VIEW_CELL_MM ? cell : chooseCellSize((v) => count(cell, v), MIN_VIEW_CELL_MM, cellMm);
  const laid = layoutAt(input, body, cell, false, viewCell);
  if (!laid) throw new RangeError('the draft does not fit on this paper even at the smallest cell size');
  return { cell, viewCell, body, ...laid };
}

/** The smallest cell of a cloth view: a millimetre still shows each end and pick (common practice). */
export const MIN_VIEW_CELL_MM = 1;

/** The window's ends and picks, every one when no window is given. */
function windowOf(input: DraftPagesInput): { ends: Span; picks: Span } {
  return input.window ?? { ends: { start: 0, end: input.shape.ends }, picks: { start: 0, end: input.shape.picks } };
}

/** The largest cell (up to the usual largest) that puts every end of the window across one page. */
function fitWidthCell(input: DraftPagesInput, body: Rect): number {
  const ends = Math.max(1, windowOf(input).ends.end - windowOf(input).ends.start);
  const { pickColumns } = input.shape;
  // draftTileSize's width, solved for the cell: LABEL_COLUMN + (pickColumns + 3 + ends) · cell ≤ width.
  const fit = Math.floor(((body.width - LABEL_COLUMN) / (pickColumns + 3 + ends)) * 1000) / 1000;
  const cell = Math.min(fit, MAX_CELL_MM * PT_PER_MM);
  if (cell < MIN_FIT_CELL_MM * PT_PER_MM) {
    const most = Math.floor((body.width - LABEL_COLUMN) / (MIN_FIT_CELL_MM * PT_PER_MM)) - pickColumns - 3;
    throw new RangeError(`${ends} ends do not fit across one page (at most ${Math.max(0, most)} on this paper): print a range of ends, or turn the page to landscape`);
  }
  return cell;
}

function layoutAt(input: DraftPagesInput, body: Rect, cell: number, countOnly: boolean, viewCell = cell): { pages: PrintPage[]; viewCut?: ViewCut } | null {
  const overlap = input.overlap ?? PAGE_OVERLAP;
  const { shape, arrangement } = input;
  const cap = draftCapacity(body.width, body.height, shape, cell);
  const vcap = viewCapacity(body.width, body.height, viewCell);
  if (Math.min(cap.cols, cap.rows, vcap.cols, vcap.rows) <= overlap) return null;

  const pages: PrintPage[] = [];
  const right = body.x + body.width;
  const bottom = body.y + body.height;
  // A shelf packer: blocks go left to right in rows, a new row when the width runs out,
  // a new page when the height does.
  let x = body.x;
  let y = body.y;
  let rowHeight = 0;
  const newPage = () => {
    pages.push({ parts: [] });
    x = body.x;
    y = body.y;
    rowHeight = 0;
  };
  const newRow = () => {
    y += rowHeight + (rowHeight > 0 ? BLOCK_GAP : 0);
    x = body.x;
    rowHeight = 0;
  };
  const place = (size: Size, own: boolean): { x: number; y: number } => {
    if (pages.length === 0 || own) newPage();
    else if (x + size.width > right + 1e-6) newRow();
    if (y + size.height > bottom + 1e-6) newPage();
    const at = { x, y };
    x += size.width + BLOCK_GAP;
    rowHeight = Math.max(rowHeight, size.height);
    return at;
  };
  const last = () => pages[pages.length - 1];

  const win = windowOf(input);
  const within = (g: GridSplit): GridSplit => ({
    ...g,
    tiles: g.tiles.map((t) => ({
      ...t,
      cols: { start: t.cols.start + win.ends.start, end: t.cols.end + win.ends.start },
      rows: { start: t.rows.start + win.picks.start, end: t.rows.end + win.picks.start },
    })),
  });
  const wEnds = win.ends.end - win.ends.start;
  const wPicks = win.picks.end - win.picks.start;
  // Fitting the width keeps every end of the window on one sheet across.
  const split = within(splitGrid(wEnds, wPicks, input.fitWidth ? Math.max(cap.cols, wEnds, overlap + 1) : cap.cols, cap.rows, overlap));
  for (const tile of split.tiles) {
    const cols = tile.cols.end - tile.cols.start;
    const rows = tile.rows.end - tile.rows.start;
    const at = place(draftTileSize(shape, cols, rows, cell), true);
    if (countOnly) continue;
    const layout = placeDraftTile(at.x, at.y, shape, cols, rows, cell, arrangement);
    last().parts.push({ kind: 'draft', tile, across: split.across, down: split.down, layout });
  }
  // Nothing shares a row with the draft: the next block starts below it.
  newRow();

  let viewCut: ViewCut | undefined;
  for (const view of input.views) {
    let vsplit = within(splitGrid(wEnds, wPicks, input.fitWidth ? Math.max(vcap.cols, wEnds, overlap + 1) : vcap.cols, vcap.rows, overlap));
    if (input.maxViewSheets !== undefined && vsplit.tiles.length > input.maxViewSheets) {
      const first = vsplit.tiles[0];
      viewCut = { ends: first.cols, picks: first.rows, fullSheets: vsplit.tiles.length };
      vsplit = { across: 1, down: 1, tiles: [first] };
    }
    const own = vsplit.tiles.length > 1;
    for (const tile of vsplit.tiles) {
      const cols = tile.cols.end - tile.cols.start;
      const rows = tile.rows.end - tile.rows.start;
      const at = place(viewTileSize(cols, rows, viewCell), own);
      if (countOnly) continue;
      // The back is seen turned over, so its ends run the other way across the page.
      const seen = view === 'back' ? { ...arrangement, endOneRight: !arrangement.endOneRight } : arrangement;
      const layout = placeViewTile(at.x, at.y, cols, rows, viewCell, seen);
      last().parts.push({ kind: 'view', view, tile, across: vsplit.across, down: vsplit.down, layout });
    }
    if (own) newRow();
  }

  newRow();
  let first = 0;
  while (first < input.legendRows) {
    let room = Math.floor((bottom - y - LEGEND_HEAD) / LEGEND_ROW);
    if (room < 1) {
      newPage();
      room = Math.floor((bottom - y - LEGEND_HEAD) / LEGEND_ROW);
    }
    const count = Math.min(room, input.legendRows - first);
    const height = LEGEND_HEAD + count * LEGEND_ROW;
    last().parts.push({ kind: 'legend', box: { x: body.x, y, width: body.width, height }, first, count });
    y += height + BLOCK_GAP;
    first += count;
  }
  return { pages, viewCut };
}
