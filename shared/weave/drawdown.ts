import type { Draft } from './types';

/**
 * The interlacement of a draft: which warp end lies over which pick on the face.
 * Rows are bit-packed (one Uint32 word per 32 ends) so thousands of ends × picks stay small.
 */
export interface Drawdown {
  readonly ends: number;
  readonly picks: number;
  /** Words per pick row. */
  readonly stride: number;
  /** picks × stride words; bit (end % 32) of word (pick * stride + end >> 5) is set when the end is up. */
  readonly bits: Uint32Array;
  /** 0-based end and pick; true when the end is over the pick on the face. */
  isUp(end: number, pick: number): boolean;
}

/** Number of picks in the list that controls the draft. */
export function pickCount(draft: Draft): number {
  return draft.control === 'liftplan' ? draft.liftplan.length : draft.treadling.length;
}

/** Bit mask of shafts (bit 0 = shaft 1) lifted on every pick, as the lists say (before shed inversion). */
export function liftMasks(draft: Draft): Uint32Array {
  const picks = pickCount(draft);
  const masks = new Uint32Array(picks);
  if (draft.control === 'liftplan') {
    for (let p = 0; p < picks; p++) masks[p] = shaftMask(draft.liftplan[p]);
  } else {
    const treadleMasks = draft.tieup.map(shaftMask);
    for (let p = 0; p < picks; p++) {
      let m = 0;
      for (const t of draft.treadling[p]) m |= treadleMasks[t - 1] ?? 0;
      masks[p] = m >>> 0;
    }
  }
  return masks;
}

/** 1-based shaft numbers → bit mask (bit 0 = shaft 1). */
export function shaftMask(shafts: readonly number[]): number {
  let m = 0;
  for (const s of shafts) if (s >= 1 && s <= 32) m |= 1 << (s - 1);
  return m >>> 0;
}

/**
 * Computes the drawdown. Rising shed: an end is up when one of its shafts is lifted.
 * Sinking shed: the lists name the shafts that sink, so every cell is the complement.
 *
 * @example computeDrawdown(plainWeave).isUp(0, 0) // true: end 1 on shaft 1, pick 1 lifts shaft 1
 */
export function computeDrawdown(draft: Draft): Drawdown {
  const ends = draft.threading.length;
  const picks = pickCount(draft);
  const stride = (ends + 31) >>> 5;
  const bits = new Uint32Array(picks * stride);
  const masks = liftMasks(draft);
  let used = 0;
  for (let p = 0; p < picks; p++) used |= masks[p];
  // Shafts in groups of 8: for each group a table of the end rows of all 256 ways to lift its
  // shafts, so a pick's row is the OR of at most 4 table rows instead of up to 32 shaft rows.
  const groups = used === 0 ? 0 : ((31 - Math.clz32(used)) >>> 3) + 1;
  const table = new Uint32Array(Math.max(groups, 1) * 256 * stride);
  for (let e = 0; e < ends; e++) {
    for (const s of draft.threading[e]) {
      if (s >= 1 && s <= groups * 8) table[((((s - 1) >>> 3) << 8) | (1 << ((s - 1) & 7))) * stride + (e >>> 5)] |= 1 << (e & 31);
    }
  }
  for (let g = 0; g < groups; g++) {
    for (let v = 3; v < 256; v++) {
      const rest = v & (v - 1);
      if (rest === 0) continue; // a single shaft: its row was filled from the threading
      const dst = ((g << 8) | v) * stride;
      const a = ((g << 8) | rest) * stride;
      const b = ((g << 8) | (v & -v)) * stride;
      for (let w = 0; w < stride; w++) table[dst + w] = table[a + w] | table[b + w];
    }
  }
  const tailMask = ends % 32 === 0 ? 0xffffffff : (1 << ends % 32) - 1;
  const sinking = draft.shed === 'sinking';
  // Picks with the same lift share a row: compute each distinct lift once.
  const firstPickOfMask = new Map<number, number>();
  for (let p = 0; p < picks; p++) {
    const m = masks[p];
    const row = p * stride;
    const seen = firstPickOfMask.get(m);
    if (seen !== undefined) {
      bits.copyWithin(row, seen * stride, seen * stride + stride);
      continue;
    }
    firstPickOfMask.set(m, p);
    // Row v = 0 of each group is all zeros, and offset 0 is such a row, so groups the draft does
    // not use cost a read of zeros instead of a branch; one write per word.
    const o0 = (m & 255) * stride;
    const o1 = groups > 1 ? ((1 << 8) | ((m >>> 8) & 255)) * stride : 0;
    const o2 = groups > 2 ? ((2 << 8) | ((m >>> 16) & 255)) * stride : 0;
    const o3 = groups > 3 ? ((3 << 8) | (m >>> 24)) * stride : 0;
    for (let w = 0; w < stride; w++) bits[row + w] = table[o0 + w] | table[o1 + w] | table[o2 + w] | table[o3 + w];
    if (sinking) {
      for (let w = 0; w < stride; w++) bits[row + w] = ~bits[row + w];
      if (stride > 0) bits[row + stride - 1] &= tailMask;
    }
  }
  return {
    ends,
    picks,
    stride,
    bits,
    isUp(end: number, pick: number): boolean {
      if (end < 0 || end >= ends || pick < 0 || pick >= picks) return false;
      return ((bits[pick * stride + (end >>> 5)] >>> (end & 31)) & 1) === 1;
    },
  };
}
