/** A run of cells [start, end) along one axis of a grid. */
export interface Span {
  start: number;
  end: number;
}

/** One page's share of a grid that is too big for one page. */
export interface Tile {
  /** 0-based position in reading order (across first, then down). */
  index: number;
  /** 0-based column and row of the tile among the tiles. */
  across: number;
  down: number;
  cols: Span;
  rows: Span;
}

export interface GridSplit {
  across: number;
  down: number;
  tiles: Tile[];
}

/**
 * Splits `total` cells into spans of at most `capacity` cells. Every span after the first
 * begins `overlap` cells before the previous one ends, so a weaver can line the pages up by
 * the repeated cells. A grid of zero cells still gets one (empty) span, so its frame prints.
 *
 * @example splitSpan(10, 4, 1) // [0,4) [3,7) [6,10)
 * @throws RangeError when the capacity cannot hold the overlap plus at least one new cell.
 */
export function splitSpan(total: number, capacity: number, overlap: number): Span[] {
  if (!Number.isInteger(total) || total < 0) throw new RangeError(`cannot split ${total} cells`);
  if (!Number.isInteger(overlap) || overlap < 0) throw new RangeError(`overlap ${overlap} is not a whole number of cells`);
  if (!Number.isInteger(capacity) || capacity <= overlap) {
    throw new RangeError(`a page holding ${capacity} cells cannot repeat ${overlap} and still move on`);
  }
  const spans: Span[] = [];
  let start = 0;
  for (;;) {
    const end = Math.min(total, start + capacity);
    spans.push({ start, end });
    if (end >= total) return spans;
    start = end - overlap;
  }
}

/** Splits a cols × rows grid into page tiles, each at most capCols × capRows cells. */
export function splitGrid(cols: number, rows: number, capCols: number, capRows: number, overlap: number): GridSplit {
  const colSpans = splitSpan(cols, capCols, overlap);
  const rowSpans = splitSpan(rows, capRows, overlap);
  const tiles: Tile[] = [];
  rowSpans.forEach((r, down) =>
    colSpans.forEach((c, across) => tiles.push({ index: tiles.length, across, down, cols: c, rows: r })),
  );
  return { across: colSpans.length, down: rowSpans.length, tiles };
}
