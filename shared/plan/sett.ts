/**
 * Sett: how closely to space the ends, from the yarn's size and the weave's interlacing.
 * All setts here are per inch (Ashenhurst's diameters are per inch); convert with `convertDensity`.
 */
import type { Drawdown } from '../weave/drawdown';

/** One repeat of a weave along a thread: threads crossed and times the thread changes face. */
export interface WeaveRepeat {
  threads: number;
  intersections: number;
}

/** Common repeats along one thread (textbook definitions). */
export const WEAVES = {
  plain: { threads: 2, intersections: 2 },
  twill21: { threads: 3, intersections: 2 },
  twill22: { threads: 4, intersections: 2 },
  twill31: { threads: 4, intersections: 2 },
  basket22: { threads: 4, intersections: 2 },
  satin5: { threads: 5, intersections: 2 },
} as const satisfies Record<string, WeaveRepeat>;

/** Ashenhurst's constant for most yarns; about 0.84 for soft woollens. */
export const ASHENHURST_CONSTANT = 0.9;
export const ASHENHURST_CONSTANT_SOFT_WOOL = 0.84;

/** Working sett as a share of the maximum (75–80 %, a widely taught range). */
export const WORKING_SETT_RANGE = { low: 0.75, high: 0.8 } as const;

/** The fraction of a closely packed sett a weave allows: threads ÷ (threads + intersections). */
export function interlacingFactor(weave: WeaveRepeat): number {
  return weave.threads / (weave.threads + weave.intersections);
}

/**
 * Sett from wraps per inch. Plain weave gives WPI/2 and 2/2 twill 2/3 WPI, the common practice
 * rules, which are the interlacing factor applied to the wraps.
 */
export function settFromWraps(wrapsPerInch: number, weave: WeaveRepeat): number {
  return wrapsPerInch * interlacingFactor(weave);
}

/** Yarn diameters per inch by Ashenhurst's rule: D ≈ constant × √(yd/lb). */
export function diametersPerInch(yardsPerPound: number, constant = ASHENHURST_CONSTANT): number {
  return constant * Math.sqrt(yardsPerPound);
}

/** Ashenhurst's maximum sett (per inch) for D diameters per inch in a weave. */
export function maximumSett(diameters: number, weave: WeaveRepeat): number {
  return diameters * interlacingFactor(weave);
}

/** The working sett range for a maximum sett. */
export function workingSettRange(maximum: number): { low: number; high: number } {
  return { low: maximum * WORKING_SETT_RANGE.low, high: maximum * WORKING_SETT_RANGE.high };
}

/** How far a sett lies outside a working range, and which way; absent when it is inside. */
export interface SettOutside {
  direction: 'above' | 'below';
  /** Ends per unit beyond the nearer end of the range. */
  by: number;
}

/**
 * Whether a sett lies outside its working range. Above it the cloth packs stiff (or will not
 * beat in); below it the cloth is loose and shifts. @example settOutside(24, { low: 19.5, high: 20.8 }) // { direction: 'above', by: 3.2 }
 */
export function settOutside(sett: number, working: { low: number; high: number }): SettOutside | undefined {
  if (sett > working.high) return { direction: 'above', by: sett - working.high };
  if (sett < working.low) return { direction: 'below', by: working.low - sett };
  return undefined;
}

/** Two or more cloths woven at once share the reed, so the sett multiplies by the layer count. */
export function layeredSett(singleLayerSett: number, layers: number): number {
  return singleLayerSett * layers;
}

/**
 * The repeats Ashenhurst's rule needs, averaged over a drawdown. The ends per inch depend on a
 * pick's path across the ends (ends crossed, times it changes face between them); the picks per
 * inch on an end's path across the picks. The drawdown is taken as one repeat that wraps round,
 * so draw it as whole repeats. Sinking-shed cells are complements and count the same.
 */
export function interlacingFromDrawdown(dd: Drawdown): { ends: WeaveRepeat; picks: WeaveRepeat } {
  let alongPicks = 0;
  let alongEnds = 0;
  for (let p = 0; p < dd.picks; p++) {
    const nextPick = (p + 1) % dd.picks;
    for (let e = 0; e < dd.ends; e++) {
      const up = dd.isUp(e, p);
      if (up !== dd.isUp(e, nextPick)) alongEnds++;
      if (up !== dd.isUp((e + 1) % dd.ends, p)) alongPicks++;
    }
  }
  return {
    ends: { threads: dd.ends, intersections: dd.picks ? alongPicks / dd.picks : 0 },
    picks: { threads: dd.picks, intersections: dd.ends ? alongEnds / dd.ends : 0 },
  };
}
