/** Points per millimetre (1 pt = 1/72 inch, 1 inch = 25.4 mm exactly). */
export const PT_PER_MM = 72 / 25.4;

/**
 * Smallest cell the print uses: about the size of squared paper a weaver reads without a lens
 * (common practice). Drafts too big at this size are split across pages rather than shrunk.
 */
export const MIN_CELL_MM = 2.5;
/** Largest cell: bigger cells only spread a small draft out (common practice). */
export const MAX_CELL_MM = 5;
/** Candidate sizes go in quarter millimetres so the grid lines stay on round figures. */
export const CELL_STEP_MM = 0.25;

/**
 * Chooses the cell size (in points) for a print: the largest candidate between the minimum and
 * maximum that needs no more pages than the minimum does. `pagesAt` gives the page count at a
 * cell size; it is expected to grow (or stay) as cells grow.
 *
 * @example chooseCellSize(() => 1) // MAX_CELL_MM in points: a small draft gets big cells
 */
export function chooseCellSize(
  pagesAt: (cellPt: number) => number,
  minMm = MIN_CELL_MM,
  maxMm = MAX_CELL_MM,
  stepMm = CELL_STEP_MM,
): number {
  if (!(minMm > 0) || !(maxMm >= minMm) || !(stepMm > 0)) throw new RangeError('cell size bounds are not usable');
  const smallest = minMm * PT_PER_MM;
  const fewest = pagesAt(smallest);
  const steps = Math.floor((maxMm - minMm) / stepMm + 1e-9);
  for (let i = steps; i > 0; i--) {
    const cell = (minMm + i * stepMm) * PT_PER_MM;
    if (pagesAt(cell) <= fewest) return cell;
  }
  return smallest;
}
