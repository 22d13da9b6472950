import type { CellBox } from './bitmap';
import { mirrorX, regionOf, type Layout, type RegionId } from './layout';

/** A box on the stage, in stage pixels. */
export interface StageRect {
  x: number;
  y: number;
  width: number;
  height: number;
}

const union = (a: StageRect, b: StageRect): StageRect => {
  const x = Math.min(a.x, b.x);
  const y = Math.min(a.y, b.y);
  return { x, y, width: Math.max(a.x + a.width, b.x + b.width) - x, height: Math.max(a.y + a.height, b.y + b.height) - y };
};

const area = (r: StageRect) => r.width * r.height;

/** Touching, or so close that one box costs hardly more to draw than two (a column of threading and drawdown). */
const worthMerging = (a: StageRect, b: StageRect) => {
  const touch = a.x <= b.x + b.width && b.x <= a.x + a.width && a.y <= b.y + b.height && b.y <= a.y + a.height;
  return touch || area(union(a, b)) <= 1.25 * (area(a) + area(b));
};

/**
 * The stage boxes that show the changed cells of each grid: widened by a pixel for the grid lines
 * on their edges, cut to the grid's box, snapped outward to whole device pixels (a clip on a
 * fractional edge would blend the old pixels into the new) and merged where they touch or nearly
 * do (one draw instead of two costs less than the few pixels between). Cells out
 * of view give no box. Redrawing only these keeps a drag's work, and the browser's compositing, to
 * the cells that changed instead of the whole stage.
 */
export function changedRects(
  layout: Layout,
  changes: readonly { id: RegionId; box: CellBox }[],
  scrollX: number,
  scrollY: number,
  pixelRatio = 1,
): StageRect[] {
  const { cell } = layout;
  const rects: StageRect[] = [];
  for (const { id, box } of changes) {
    const r = regionOf(layout, id);
    if (!r) continue;
    const sx = r.scrollsX ? scrollX : 0;
    const sy = r.scrollsY ? scrollY : 0;
    let left = Math.max(r.x - 1, r.x + box.x0 * cell - sx - 1);
    const top = Math.max(r.y - 1, r.y + box.y0 * cell - sy - 1);
    let right = Math.min(r.x + r.width + 1, r.x + (box.x1 + 1) * cell - sx + 1);
    const bottom = Math.min(r.y + r.height + 1, r.y + (box.y1 + 1) * cell - sy + 1);
    if (right <= left || bottom <= top) continue;
    // Mirrored grids (end 1 on the right): the same box, reflected in the ends' band.
    if (layout.mirrored && r.scrollsX) [left, right] = [mirrorX(layout, right), mirrorX(layout, left)];
    const x = Math.floor(left * pixelRatio) / pixelRatio;
    const y = Math.floor(top * pixelRatio) / pixelRatio;
    let rect: StageRect = { x, y, width: Math.ceil(right * pixelRatio) / pixelRatio - x, height: Math.ceil(bottom * pixelRatio) / pixelRatio - y };
    // Merging can bring a box near one merged earlier, so keep merging until none are.
    for (let i = rects.findIndex((o) => worthMerging(o, rect)); i >= 0; i = rects.findIndex((o) => worthMerging(o, rect))) {
      rect = union(rect, rects[i]);
      rects.splice(i, 1);
    }
    rects.push(rect);
  }
  return rects;
}
