import { regionOf, type Layout } from './layout';

/** The part of the view that scrolling and zooming change. */
export interface ScrollView {
  cell: number;
  scrollX: number;
  scrollY: number;
}

export const MIN_CELL = 1;
export const MAX_CELL = 40;

/** The parts of a WheelEvent read here (so tests can pass plain objects). */
export interface WheelLike {
  deltaX: number;
  deltaY: number;
  /** 0 pixels, 1 lines, 2 pages (WheelEvent.DOM_DELTA_*). */
  deltaMode: number;
  shiftKey: boolean;
}

/**
 * A wheel turn or trackpad swipe in pixels across and down. Shift turns a plain mouse wheel
 * sideways (mice have no second wheel); line and page units become pixels.
 */
export function wheelPixels(e: WheelLike, page: { width: number; height: number }): { dx: number; dy: number } {
  const unit = e.deltaMode === 1 ? 16 : 1;
  let dx = e.deltaMode === 2 ? e.deltaX * page.width : e.deltaX * unit;
  let dy = e.deltaMode === 2 ? e.deltaY * page.height : e.deltaY * unit;
  if (e.shiftKey && dx === 0) [dx, dy] = [dy, 0];
  return { dx, dy };
}

const clamp = (v: number, low: number, high: number) => Math.max(low, Math.min(high, v));

/** Scroll offsets moved by a swipe, kept within the grids. */
export function scrolledBy(layout: Layout, view: ScrollView, dx: number, dy: number): { scrollX: number; scrollY: number } {
  return { scrollX: clamp(view.scrollX + dx, 0, layout.maxScrollX), scrollY: clamp(view.scrollY + dy, 0, layout.maxScrollY) };
}

/**
 * The zoom after a Ctrl+wheel turn or a pinch (which browsers report as Ctrl+wheel), as a
 * fractional cell size: a mouse notch (100 px) zooms by about a fifth, a pinch's small steps
 * smoothly. The caller rounds it for drawing and keeps the fraction between events.
 */
export function zoomedCell(cell: number, deltaY: number): number {
  return clamp(cell * Math.exp(-deltaY * 0.002), MIN_CELL, MAX_CELL);
}

/**
 * Scroll offsets after zooming from layout `before` to layout `after`, such that the thread under
 * the pointer stays under it: across when the pointer is over the columns of ends, down when it
 * is over the rows of picks. Elsewhere the first thread in view stays first.
 */
export function zoomedAbout(before: Layout, after: Layout, view: ScrollView, point: { x: number; y: number }): { scrollX: number; scrollY: number } {
  const from = regionOf(before, 'drawdown');
  const to = regionOf(after, 'drawdown');
  const ratio = after.cell / before.cell;
  if (!from || !to) return { scrollX: view.scrollX * ratio, scrollY: view.scrollY * ratio };
  const overEnds = point.x >= from.x && point.x < from.x + from.width;
  const overPicks = point.y >= from.y && point.y < from.y + from.height;
  const scrollX = overEnds ? (view.scrollX + point.x - from.x) * ratio - (point.x - to.x) : view.scrollX * ratio;
  const scrollY = overPicks ? (view.scrollY + point.y - from.y) * ratio - (point.y - to.y) : view.scrollY * ratio;
  return { scrollX: clamp(scrollX, 0, after.maxScrollX), scrollY: clamp(scrollY, 0, after.maxScrollY) };
}
