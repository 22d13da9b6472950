import type { Draft } from '../../../../shared/weave';
import { MAX_SHAFTS, MAX_TREADLES } from '../../../../shared/weave';
import { NAMES } from '../../../../shared/words';

/**
 * The grids a weaver draws in. Each is a list indexed by end, treadle or pick (the "index"), whose
 * entries name 1-based shafts or treadles (the "value"); the colour orders hold one palette index each.
 */
export type GridId = 'threading' | 'tieup' | 'treadling' | 'liftplan' | 'warpColors' | 'weftColors' | 'warpLayers' | 'weftLayers';

/** The rows beside the threads that hold one value each: colours and layers. */
export type ThreadRowId = 'warpColors' | 'weftColors' | 'warpLayers' | 'weftLayers';

export type ListGridId = 'threading' | 'tieup' | 'treadling' | 'liftplan';

/** What each step along a grid's list is, in the weaver's words. */
export type Axis = 'ends' | 'picks' | 'treadles';

export const GRID_LABELS: Record<GridId, string> = {
  threading: 'Threading',
  tieup: 'Tie-up',
  treadling: 'Treadling',
  liftplan: 'Lift plan',
  warpColors: NAMES.warpColourOrder,
  weftColors: NAMES.weftColourOrder,
  warpLayers: 'Warp layers',
  weftLayers: 'Weft layers',
};

export function isListGrid(grid: GridId): grid is ListGridId {
  return !isThreadRow(grid);
}

/** Colour and layer rows: one value per end or pick, painted rather than marked. */
export function isThreadRow(grid: GridId): grid is ThreadRowId {
  return grid === 'warpColors' || grid === 'weftColors' || grid === 'warpLayers' || grid === 'weftLayers';
}

/** Whether the layer rows show: once the draft has layers, or when the weaver asks for them. */
export function showsLayerRows(draft: Draft, asked: boolean): boolean {
  return asked || draft.warpLayers.length > 0 || draft.weftLayers.length > 0;
}

export function axisOf(grid: GridId): Axis {
  if (grid === 'threading' || grid === 'warpColors' || grid === 'warpLayers') return 'ends';
  if (grid === 'tieup') return 'treadles';
  return 'picks';
}

/** How many values a cell of the grid can take: shafts, treadles, or 1 for a colour order. */
export function valueCount(draft: Draft, grid: GridId): number {
  if (grid === 'treadling') return draft.treadles;
  if (isThreadRow(grid)) return 1;
  return draft.shafts;
}

/** The largest value a weaver may grow the grid to (the loom's limits). */
export function valueLimit(grid: GridId): number {
  return grid === 'treadling' ? MAX_TREADLES : MAX_SHAFTS;
}

/** The grids the draft shows: tie-up and treadling, or a lift plan. */
export function visibleGrids(draft: Draft, layerRows = false): GridId[] {
  const grids: GridId[] =
    draft.control === 'liftplan' ? ['warpColors', 'threading', 'liftplan', 'weftColors'] : ['warpColors', 'threading', 'tieup', 'treadling', 'weftColors'];
  return showsLayerRows(draft, layerRows) ? ['warpLayers', ...grids, 'weftLayers'] : grids;
}

/** Number of ends, picks or treadles the grid's list holds. */
export function lengthOf(draft: Draft, grid: GridId): number {
  switch (grid) {
    case 'threading':
      return draft.threading.length;
    case 'warpColors':
      return draft.warpColors.length;
    case 'tieup':
      return draft.treadles;
    case 'treadling':
      return draft.treadling.length;
    case 'liftplan':
      return draft.liftplan.length;
    case 'weftColors':
      return draft.weftColors.length;
    case 'warpLayers':
      return draft.warpLayers.length;
    case 'weftLayers':
      return draft.weftLayers.length;
  }
}
