/**
 * What came off the loom, turned into allowances for the next plan. Definitions:
 *
 *   take-up   = (woven length on the loom − off-loom length) ÷ woven length on the loom
 *   draw-in   = (width in reed − off-loom width) ÷ width in reed
 *   shrinkage = (off-loom size − finished size) ÷ off-loom size   (length and width apart)
 *
 * These invert the plan's formulas: weaving the plan's on-loom length and width and losing exactly
 * the planned allowances gives back the same allowances here.
 */
import type { Allowances } from './warp';

export interface Measurements {
  widthInReed: number;
  /** Woven length measured on the loom, under tension. */
  lengthOnLoom: number;
  widthOffLoom: number;
  lengthOffLoom: number;
  /** After wet finishing; omit when the cloth is not finished yet. */
  widthFinished?: number;
  lengthFinished?: number;
}

/** The fraction lost going from `before` to `after`: (before − after) ÷ before. */
export function lossRate(before: number, after: number): number {
  if (!(before > 0)) throw new RangeError('The size before must be above zero.');
  return (before - after) / before;
}

/**
 * Measured allowances, in the shape the plan takes. Shrinkage is left out until the finished
 * sizes are known. @example measuredAllowances({ widthInReed: 20, widthOffLoom: 18, … }).drawIn // 0.1
 */
export function measuredAllowances(m: Measurements): Partial<Allowances> {
  return {
    takeUp: lossRate(m.lengthOnLoom, m.lengthOffLoom),
    drawIn: lossRate(m.widthInReed, m.widthOffLoom),
    ...(m.lengthFinished !== undefined ? { lengthShrinkage: lossRate(m.lengthOffLoom, m.lengthFinished) } : {}),
    ...(m.widthFinished !== undefined ? { widthShrinkage: lossRate(m.widthOffLoom, m.widthFinished) } : {}),
  };
}

/** The next plan's allowances: the measured ones where known, the current ones elsewhere. */
export function allowancesForNextPlan(current: Allowances, m: Measurements): Allowances {
  return { ...current, ...measuredAllowances(m) };
}
