import type { Draft } from './types';

/*
 * Drafting helpers. Sequences are 1-based shaft (or treadle) numbers, one per end (or pick);
 * `asLists` turns them into the per-thread lists a Draft holds. All functions are pure.
 */

/** Consecutive numbers from `from` to `to` inclusive, rising or falling: straightRun(4, 1) = [4, 3, 2, 1]. */
export function straightRun(from: number, to: number): number[] {
  const step = to >= from ? 1 : -1;
  return Array.from({ length: Math.abs(to - from) + 1 }, (_, i) => from + i * step);
}

/** Straight draw: 1, 2, …, shafts, `repeats` times. straightDraw(4) = [1, 2, 3, 4]. */
export function straightDraw(shafts: number, repeats = 1): number[] {
  return repeat(straightRun(1, shafts), repeats);
}

/**
 * Point draw: up from 1 to `shafts` and back down, the turning shafts not doubled, so the repeat
 * is 2·shafts − 2 ends and repeats join smoothly. pointDraw(4) = [1, 2, 3, 4, 3, 2].
 */
export function pointDraw(shafts: number, repeats = 1): number[] {
  const unit = shafts <= 2 ? straightRun(1, shafts) : [...straightRun(1, shafts), ...straightRun(shafts - 1, 2)];
  return repeat(unit, repeats);
}

/**
 * Broken draw: runs of `runLength` consecutive shafts that change direction, each new run starting
 * one shaft past where a point would turn (a shaft is skipped), so no point forms. Starts at shaft 1
 * rising; `runs` runs in all (an even number repeats cleanly). Needs at least 4 shafts: on 3 the
 * skip lands back where a point would be.
 * brokenDraw(4, 2) = [1, 2, 4, 3] (the 4-shaft broken twill threading); brokenDraw(4, 4) = [1, 2, 3, 4, 2, 1, 4, 3].
 */
export function brokenDraw(shafts: number, runLength = shafts, runs = 2): number[] {
  const wrap = (s: number) => ((((s - 1) % shafts) + shafts) % shafts) + 1;
  const out: number[] = [];
  let shaft = 1;
  let step = 1;
  for (let r = 0; r < runs; r++) {
    for (let i = 0; i < runLength; i++) out.push(wrap(shaft + i * step));
    const last = shaft + (runLength - 1) * step;
    step = -step;
    shaft = last + 2 * step;
  }
  return out;
}

/** The sequence `times` times over. */
export function repeat<T>(seq: readonly T[], times: number): T[] {
  const out: T[] = [];
  for (let i = 0; i < times; i++) out.push(...seq);
  return out;
}

/** The sequence backwards (a new array). */
export function reverse<T>(seq: readonly T[]): T[] {
  return [...seq].reverse();
}

/**
 * The sequence followed by its mirror image. By default the last element is the centre and is not
 * doubled ([1, 2, 3] → [1, 2, 3, 2, 1]); with `shareCentre: false` it is ([1, 2, 3] → [1, 2, 3, 3, 2, 1]).
 */
export function mirror<T>(seq: readonly T[], options: { shareCentre?: boolean } = {}): T[] {
  const back = reverse(seq);
  return [...seq, ...(options.shareCentre === false ? back : back.slice(1))];
}

/** One-shaft-per-thread numbers → the per-thread lists a Draft holds: [1, 2] → [[1], [2]]. */
export function asLists(seq: readonly number[]): number[][] {
  return seq.map((n) => [n]);
}

/**
 * Twill tie-up from an up/down pattern read along a shaft column: [2, 2] is 2/2 twill, [1, 3] is
 * 1/3, [2, 1, 1, 2] lifts 2, sinks 1, lifts 1, sinks 2. Shafts = the pattern's sum; treadle t
 * lifts the pattern shifted by t − 1, so treadling 1, 2, 3, … on a straight draw steps one end per pick.
 */
export function twillTieup(pattern: readonly number[]): number[][] {
  const cells: boolean[] = pattern.flatMap((n, i) => new Array<boolean>(n).fill(i % 2 === 0));
  const shafts = cells.length;
  return Array.from({ length: shafts }, (_, t) =>
    cells.flatMap((lifted, s) => (lifted ? [((s + t) % shafts) + 1] : [])).sort((a, b) => a - b),
  );
}

/**
 * Treadle as drawn in: pick i presses the treadles numbered like the shafts of end i, so the
 * treadling follows the threading (ends on no shaft give picks pressing nothing).
 */
export function treadleAsDrawnIn(threading: readonly (readonly number[])[]): number[][] {
  return threading.map((shafts) => [...shafts]);
}

/**
 * The draft treadled as drawn in. The tie-up is the one given (a matching tie-up, e.g. `twillTieup([2, 2])`)
 * or else the draft's own, widened with empty treadles so every shaft has its treadle.
 * Weft colours follow the warp colours end for pick, which is how colour orders are woven as drawn in.
 */
export function treadleDraftAsDrawnIn(draft: Draft, options: { tieup?: number[][] } = {}): Draft {
  const treadling = treadleAsDrawnIn(draft.threading);
  const base = options.tieup ?? draft.tieup;
  const tieup = [...base.map((t) => [...t]), ...Array.from({ length: Math.max(0, draft.shafts - base.length) }, () => [])];
  const result: Draft = {
    ...draft,
    control: 'treadling',
    treadles: tieup.length,
    tieup,
    treadling,
    weftColors: [...draft.warpColors],
    weftLayers: [...draft.warpLayers],
  };
  if (draft.blocks) result.blocks = { warp: draft.blocks.warp, weft: [...draft.blocks.warp] };
  return result;
}

/** How "Repeat with a change" alters the run for its changed copies. */
export type RunChange = 'reverse' | 'swap';

/**
 * The run changed: 'reverse' reads it backwards; 'swap' exchanges its first two different values
 * (two colours of a colour order, two shafts of a threading) wherever they occur.
 *
 * @example changedRun(['dark', 'light', 'dark', 'light'], 'reverse') // ['light', 'dark', 'light', 'dark']
 */
export function changedRun<T>(run: readonly T[], change: RunChange): T[] {
  if (change === 'reverse') return reverse(run);
  const a = run[0];
  const i = run.findIndex((v) => v !== a);
  if (i < 0) return [...run];
  const b = run[i];
  return run.map((v) => (v === a ? b : v === b ? a : v));
}

/**
 * "Repeat with a change": the run `times` times, then its changed copy `times` times, that pair
 * `pairs` times over. A four-end colour unit that reverses every 12 repeats is
 * `repeatWithChange(unit, 12, 'reverse')`.
 */
export function repeatWithChange<T>(run: readonly T[], times: number, change: RunChange, pairs = 1): T[] {
  const pair = [...repeat(run, times), ...repeat(changedRun(run, change), times)];
  return repeat(pair, pairs);
}
