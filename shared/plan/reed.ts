/**
 * Reeds and denting: how many ends go in each dent to reach a sett, and which ends share a dent.
 * Setts here are ends per inch; metric reeds are converted on the way in.
 */
import { CM_PER_INCH } from './units';

/** How a reed is quoted: dents per inch, per cm or per 10 cm. */
export type ReedUnit = 'inch' | 'cm' | '10cm';

export interface Reed {
  dents: number;
  per: ReedUnit;
}

/** Dents per inch of a reed however it is quoted. @example dentsPerInch({ dents: 50, per: '10cm' }) // 12.7 */
export function dentsPerInch(reed: Reed): number {
  if (reed.per === 'inch') return reed.dents;
  return reed.per === 'cm' ? reed.dents * CM_PER_INCH : (reed.dents / 10) * CM_PER_INCH;
}

/** The sett a denting pattern gives: ends in the repeat ÷ dents in the repeat × dents per inch. */
export function settFromDenting(reed: Reed, pattern: readonly number[]): number {
  return (pattern.reduce((a, b) => a + b, 0) / pattern.length) * dentsPerInch(reed);
}

/** A denting pattern written the trade's way: "2", "2-2-1", "1-0". */
export function dentingLabel(pattern: readonly number[]): string {
  return pattern.join('-');
}

/**
 * `ends` ends spread over `dents` dents as evenly as possible, fuller dents first
 * (5 over 3 → 2-2-1, 4 over 3 → 2-1-1).
 */
export function evenDenting(ends: number, dents: number): number[] {
  const pattern: number[] = [];
  for (let i = 0; i < dents; i++) pattern.push(Math.ceil(((i + 1) * ends) / dents) - Math.ceil((i * ends) / dents));
  return pattern;
}

export interface DentingPlan {
  pattern: number[];
  /** Ends per inch the pattern actually gives. */
  sett: number;
  /** Actual − target, ends per inch. */
  difference: number;
}

/**
 * The denting pattern, at most `maxRepeat` dents long, whose sett comes closest to the target
 * (shortest pattern on ties). @example planDenting(20, { dents: 12, per: 'inch' }).pattern // [2, 2, 1]
 */
export function planDenting(targetSett: number, reed: Reed, maxRepeat = 4): DentingPlan {
  const dpi = dentsPerInch(reed);
  let best: DentingPlan | undefined;
  for (let dents = 1; dents <= Math.max(1, maxRepeat); dents++) {
    const ends = Math.max(1, Math.round((targetSett / dpi) * dents));
    const sett = (ends / dents) * dpi;
    const difference = sett - targetSett;
    if (!best || Math.abs(difference) < Math.abs(best.difference) - 1e-9) {
      best = { pattern: evenDenting(ends, dents), sett, difference };
    }
  }
  return best as DentingPlan;
}

export interface SleyOptions {
  /** The layer (1-based) of each end, parallel to the ends. Turns the layer rule on. */
  layers?: readonly number[];
  /** The order the layers should follow within a dent, e.g. [1, 2]. */
  layerOrder?: readonly number[];
  /** Reverse `layerOrder` after every this many repeats of the denting pattern. */
  flipEvery?: number;
  /** Number of the first dent used (to centre the warp in the reed). Default 1. */
  firstDent?: number;
}

export interface Dent {
  /** 1-based dent number, counted from where sleying starts. */
  dent: number;
  /** The ends in this dent, as given (usually 1-based end numbers), in sleying order. */
  ends: number[];
  /** Ends the denting pattern planned for this dent; more than `ends.length` where the layer rule closed it early. */
  planned: number;
}

/**
 * Which ends share each dent. Ends are taken in the order given, each dent filled up to the
 * pattern's count. Under the layer rule a dent is closed early rather than take a second end of a
 * layer it already holds, or an end whose layer comes earlier in `layerOrder` than the last one in
 * the dent; so a dent holds at most one end per layer, in the weaver's order. Changing the order
 * (flipEvery) therefore costs one short dent where the ends realign.
 */
export function sleyingList(ends: readonly number[], pattern: readonly number[], options: SleyOptions = {}): Dent[] {
  if (pattern.length === 0 || !pattern.some((n) => n > 0)) throw new Error('A denting pattern needs at least one end.');
  const { layers, layerOrder, flipEvery } = options;
  const firstDent = options.firstDent ?? 1;
  const dents: Dent[] = [];
  let i = 0;
  for (let d = 0; i < ends.length; d++) {
    const planned = pattern[d % pattern.length];
    const dent: Dent = { dent: firstDent + d, ends: [], planned };
    dents.push(dent);
    if (planned === 0) continue;
    const repeat = Math.floor(d / pattern.length);
    const flipped = !!flipEvery && flipEvery > 0 && Math.floor(repeat / flipEvery) % 2 === 1;
    const order = layerOrder ? (flipped ? [...layerOrder].reverse() : layerOrder) : undefined;
    const rank = (layer: number) => {
      const at = order ? order.indexOf(layer) : -1;
      return at >= 0 ? at : (order?.length ?? 0) + layer;
    };
    const held = new Set<number>();
    let lastRank = -Infinity;
    while (i < ends.length && dent.ends.length < planned) {
      if (layers) {
        const layer = layers[i] ?? 1;
        if (held.has(layer) || (order && rank(layer) < lastRank)) break;
        held.add(layer);
        lastRank = rank(layer);
      }
      dent.ends.push(ends[i++]);
    }
  }
  return dents;
}

/** The dent to start at so `dentsUsed` dents sit in the middle of a reed of `reedDents` dents. */
export function centredFirstDent(reedDents: number, dentsUsed: number): number {
  return Math.max(0, Math.floor((reedDents - dentsUsed) / 2)) + 1;
}
