import { pickCount } from '../weave/drawdown';
import type { Draft } from '../weave/types';
import type { Span } from './page-split';

/** What part of the draft a print shows: all of it, one repeat, or the ends and picks the weaver names. */
export type PrintPart = 'whole' | 'repeat' | 'range';

/** 1-based, inclusive, as the weaver names them: ends 1–80. */
export interface NumberRange {
  from: number;
  to: number;
}

export interface PrintRangeChoice {
  /** Omitted: one repeat for a draft that repeats, else the whole draft. */
  part?: PrintPart;
  /** For `range`: the ends and picks to print; a missing one means all of them. */
  ends?: NumberRange;
  picks?: NumberRange;
}

/** The ends and picks a print shows, 0-based [start, end), with the part they came from. */
export interface PrintWindow {
  part: PrintPart;
  ends: Span;
  picks: Span;
}

/**
 * The shortest run that repeats through the whole list: the smallest p with item i equal to item
 * i + p everywhere (the last time through may stop part way). A list that does not repeat at
 * least twice gives its own length.
 *
 * @example repeatLength(5, (i, j) => 'abcab'[i] === 'abcab'[j]) // 5: "abc" is not there twice
 */
export function repeatLength(length: number, same: (i: number, j: number) => boolean): number {
  if (length < 2) return length;
  // The shortest period is length − (the longest proper prefix that is also a suffix), found in
  // linear time (Knuth–Morris–Pratt's failure function): trying every period would take
  // length² / 2 comparisons for a list like 1 1 1 … 1 2, seconds for 20 000 ends.
  const border = new Int32Array(length);
  for (let i = 1, k = 0; i < length; i++) {
    while (k > 0 && !same(i, k)) k = border[k - 1];
    if (same(i, k)) k++;
    border[i] = k;
  }
  const p = length - border[length - 1];
  return p * 2 <= length ? p : length;
}

const sameList = (a: readonly number[] | undefined, b: readonly number[] | undefined): boolean =>
  (a ?? []).length === (b ?? []).length && (a ?? []).every((v, k) => v === b?.[k]);

/**
 * The draft's repeat: the fewest ends whose threading, colours and layers repeat across the warp,
 * and the fewest picks whose lifts (or treadles), colours and layers repeat through the picks.
 * Equal to the draft's own size along a side that does not repeat.
 *
 * @example draftRepeat(straightTwill) // { ends: 4, picks: 4 } for a 4-shaft straight draw treadled straight
 */
export function draftRepeat(draft: Draft): { ends: number; picks: number } {
  const picks = draft.control === 'liftplan' ? draft.liftplan : draft.treadling;
  return {
    ends: repeatLength(draft.threading.length, (i, j) =>
      sameList(draft.threading[i], draft.threading[j]) && draft.warpColors[i] === draft.warpColors[j] && draft.warpLayers[i] === draft.warpLayers[j]),
    picks: repeatLength(picks.length, (i, j) =>
      sameList(picks[i], picks[j]) && draft.weftColors[i] === draft.weftColors[j] && draft.weftLayers[i] === draft.weftLayers[j]),
  };
}

/** True when the draft repeats along its ends or its picks. */
export function hasRepeat(draft: Draft): boolean {
  const r = draftRepeat(draft);
  return r.ends < draft.threading.length || r.picks < pickCount(draft);
}

/**
 * Which ends and picks a print shows. A range past the draft is refused with a RangeError saying
 * what the draft has, so the weaver can correct it.
 *
 * @example printWindow(draft, { part: 'range', ends: { from: 1, to: 80 } }) // ends 0–80, every pick
 */
export function printWindow(draft: Draft, choice: PrintRangeChoice = {}): PrintWindow {
  const ends = draft.threading.length;
  const picks = pickCount(draft);
  const part = choice.part ?? (hasRepeat(draft) ? 'repeat' : 'whole');
  if (part === 'whole') return { part, ends: { start: 0, end: ends }, picks: { start: 0, end: picks } };
  if (part === 'repeat') {
    const r = draftRepeat(draft);
    return { part, ends: { start: 0, end: r.ends }, picks: { start: 0, end: r.picks } };
  }
  const span = (r: NumberRange | undefined, total: number, word: string): Span => {
    if (!r) return { start: 0, end: total };
    if (!Number.isInteger(r.from) || !Number.isInteger(r.to) || r.from < 1 || r.to < r.from) {
      throw new RangeError(`${word} ${r.from}–${r.to} is not a range: give the first and last ${word}, first ≤ last`);
    }
    if (r.to > total) throw new RangeError(`the draft has ${total} ${word}, so ${word} ${r.from}–${r.to} cannot be printed`);
    return { start: r.from - 1, end: r.to };
  };
  return { part, ends: span(choice.ends, ends, 'ends'), picks: span(choice.picks, picks, 'picks') };
}

/** "ends 1–80 and picks 1–80", as page 1 says what it shows. */
export function windowWords(w: PrintWindow, total: { ends: number; picks: number }): string {
  const run = (s: Span) => (s.end - s.start === 1 ? `${s.start + 1}` : `${s.start + 1}–${s.end}`);
  const whole = (s: Span, n: number) => s.start === 0 && s.end === n;
  if (whole(w.ends, total.ends) && whole(w.picks, total.picks)) return 'every end and pick';
  return `ends ${run(w.ends)} of ${total.ends} and picks ${run(w.picks)} of ${total.picks}`;
}
