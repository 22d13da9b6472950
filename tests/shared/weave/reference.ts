import { multiply } from 'mathjs';
import type { Draft } from '../../../shared/weave/types';

/** 0/1 matrix with rows × cols, cell (r, c) = 1 when `on(r, c)`. */
function incidence(rows: number, cols: number, on: (r: number, c: number) => boolean): number[][] {
  return Array.from({ length: rows }, (_, r) => Array.from({ length: cols }, (_, c) => (on(r, c) ? 1 : 0)));
}

/**
 * Independent reference: mathjs matrix product. up[e][p] for every end e and pick p, from
 * threading (ends × shafts) · tie-up (shafts × treadles) · treadling (treadles × picks), or
 * threading · lift plan (shafts × picks); a cell > 0 means a shaft of the end is lifted.
 * Shares no code with the engine: no bit masks, no liftMasks.
 */
export function mathjsDrawdown(draft: Draft): boolean[][] {
  const ends = draft.threading.length;
  const picks = draft.control === 'liftplan' ? draft.liftplan.length : draft.treadling.length;
  if (ends === 0 || picks === 0) return Array.from({ length: ends }, () => new Array<boolean>(picks).fill(false));
  const threading = incidence(ends, draft.shafts, (e, s) => draft.threading[e].includes(s + 1));
  let lifted: number[][];
  if (draft.control === 'liftplan') {
    const plan = incidence(draft.shafts, picks, (s, p) => draft.liftplan[p].includes(s + 1));
    lifted = multiply(threading, plan);
  } else if (draft.treadles === 0) {
    lifted = incidence(ends, picks, () => false);
  } else {
    const tieup = incidence(draft.shafts, draft.treadles, (s, t) => draft.tieup[t].includes(s + 1));
    const treadling = incidence(draft.treadles, picks, (t, p) => draft.treadling[p].includes(t + 1));
    lifted = multiply(multiply(threading, tieup), treadling);
  }
  const sinking = draft.shed === 'sinking';
  return lifted.map((row) => row.map((v) => (v > 0) !== sinking));
}
