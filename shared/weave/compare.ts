import { computeDrawdown, liftMasks, type Drawdown } from './drawdown';
import type { Draft } from './types';

/** One tie-up cell (1-based treadle and shaft) that is tied in one draft and not in the other. */
export interface TieupCell {
  treadle: number;
  shaft: number;
}

/** What changed between two drafts, as a weaver counts it. Ends and picks are 0-based. */
export interface DraftComparison {
  /** Ends whose shafts, colour or layer differ, or that exist in only one draft. */
  ends: number[];
  /** Picks whose lifted shafts, treadles, colour or layer differ, or that exist in only one draft. */
  picks: number[];
  tieup: TieupCell[];
  /** Drawdown cells (over the larger of the two sizes) where the end is up in one draft and down in the other. */
  cells: number;
}

const sameList = (a: readonly number[] | undefined, b: readonly number[] | undefined): boolean => {
  if (a === undefined || b === undefined) return a === b;
  if (a.length !== b.length) return false;
  const sa = [...a].sort((x, y) => x - y);
  const sb = [...b].sort((x, y) => x - y);
  return sa.every((v, i) => v === sb[i]);
};

const layerAt = (layers: readonly number[], i: number) => layers[i] ?? 1;

function changedEnds(a: Draft, b: Draft): number[] {
  const out: number[] = [];
  const n = Math.max(a.threading.length, b.threading.length);
  for (let e = 0; e < n; e++) {
    const inA = e < a.threading.length;
    const inB = e < b.threading.length;
    if (
      inA !== inB
      || !sameList(a.threading[e], b.threading[e])
      // Colours compare as seen (hex), so a recoloured palette shows up end by end.
      || a.palette[a.warpColors[e]] !== b.palette[b.warpColors[e]]
      || layerAt(a.warpLayers, e) !== layerAt(b.warpLayers, e)
    ) out.push(e);
  }
  return out;
}

function changedPicks(a: Draft, b: Draft): number[] {
  const out: number[] = [];
  const liftsA = liftMasks(a);
  const liftsB = liftMasks(b);
  const sinkA = a.shed === 'sinking';
  const sinkB = b.shed === 'sinking';
  const bothTreadled = a.control === 'treadling' && b.control === 'treadling';
  const n = Math.max(liftsA.length, liftsB.length);
  for (let p = 0; p < n; p++) {
    const inA = p < liftsA.length;
    const inB = p < liftsB.length;
    if (
      inA !== inB
      || liftsA[p] !== liftsB[p]
      || sinkA !== sinkB
      || (bothTreadled && !sameList(a.treadling[p], b.treadling[p]))
      || a.palette[a.weftColors[p]] !== b.palette[b.weftColors[p]]
      || layerAt(a.weftLayers, p) !== layerAt(b.weftLayers, p)
    ) out.push(p);
  }
  return out;
}

function changedTieup(a: Draft, b: Draft): TieupCell[] {
  const out: TieupCell[] = [];
  const treadles = Math.max(a.tieup.length, b.tieup.length);
  const shafts = Math.max(a.shafts, b.shafts);
  for (let t = 0; t < treadles; t++) {
    const ta = new Set(a.tieup[t] ?? []);
    const tb = new Set(b.tieup[t] ?? []);
    for (let s = 1; s <= shafts; s++) if (ta.has(s) !== tb.has(s)) out.push({ treadle: t + 1, shaft: s });
  }
  return out;
}

/** How two drawdowns differ cell by cell, over the larger of their sizes (missing cells count as down). */
export type CellChange = 'same-up' | 'same-down' | 'now-up' | 'now-down';

function cellChange(da: Drawdown, db: Drawdown, end: number, pick: number): CellChange {
  const a = da.isUp(end, pick);
  const b = db.isUp(end, pick);
  if (a === b) return a ? 'same-up' : 'same-down';
  return b ? 'now-up' : 'now-down';
}

/**
 * Compares draft `a` (older) with draft `b` (newer): the ends, picks and tie-up cells that changed,
 * and how many drawdown cells changed.
 *
 * @example compareDrafts(d, d) // { ends: [], picks: [], tieup: [], cells: 0 }
 */
export function compareDrafts(a: Draft, b: Draft, drawdowns: [Drawdown, Drawdown] = [computeDrawdown(a), computeDrawdown(b)]): DraftComparison {
  const [da, db] = drawdowns;
  let cells = 0;
  const ends = Math.max(da.ends, db.ends);
  const picks = Math.max(da.picks, db.picks);
  for (let p = 0; p < picks; p++) {
    // Word by word where both rows exist: XOR and count bits, so large drafts compare quickly.
    const shared = p < da.picks && p < db.picks ? Math.min(da.ends, db.ends) : 0;
    const words = shared >>> 5;
    for (let w = 0; w < words; w++) cells += popcount(da.bits[p * da.stride + w] ^ db.bits[p * db.stride + w]);
    for (let e = words << 5; e < ends; e++) if (da.isUp(e, p) !== db.isUp(e, p)) cells++;
  }
  return { ends: changedEnds(a, b), picks: changedPicks(a, b), tieup: changedTieup(a, b), cells };
}

function popcount(v: number): number {
  let x = v >>> 0;
  x -= (x >>> 1) & 0x55555555;
  x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
  return (Math.imul((x + (x >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24);
}

/**
 * Colours of the difference image. Unchanged cells are faint (so the structure still reads);
 * changed cells are strong and differ in lightness as well as hue, so they part in grey too: every
 * pair but the two unchanged tones is at least 3:1 apart by the WCAG contrast formula (SC 1.4.11),
 * which one pixel per cell leaves no room to mark otherwise.
 */
export const COMPARE_COLOURS: Readonly<Record<CellChange, readonly [number, number, number]>> = {
  'same-up': [0xc9, 0xc4, 0xb9],
  'same-down': [0xf7, 0xf5, 0xf0],
  'now-up': [0x0b, 0x10, 0x33],
  'now-down': [0xa6, 0x50, 0x00],
};

/** RGB pixels, 3 bytes per pixel, row p = pick p, column e = end e. */
export interface RgbImage {
  width: number;
  height: number;
  rgb: Uint8Array;
}

/**
 * The drawdown difference as one pixel per cell, cropped to `maxEnds` × `maxPicks` from the first
 * end and pick: faint where nothing changed, near-black blue where an end now lies over the pick,
 * dark orange where it now lies under.
 */
export function comparisonImage(a: Draft, b: Draft, maxEnds = 2000, maxPicks = 2000): RgbImage {
  const da = computeDrawdown(a);
  const db = computeDrawdown(b);
  const width = Math.max(1, Math.min(maxEnds, Math.max(da.ends, db.ends)));
  const height = Math.max(1, Math.min(maxPicks, Math.max(da.picks, db.picks)));
  const rgb = new Uint8Array(width * height * 3);
  for (let p = 0; p < height; p++) {
    for (let e = 0; e < width; e++) {
      const c = COMPARE_COLOURS[cellChange(da, db, e, p)];
      rgb.set(c, (p * width + e) * 3);
    }
  }
  return { width, height, rgb };
}

/** How the threads of one draft line up with another's: numbers are 0-based, inserted and changed counted in the newer draft, removed in the older. */
export interface ThreadAlignment {
  inserted: number[];
  removed: number[];
  /** Threads that stand where a different thread stood (as many as both sides of a gap have). */
  changed: number[];
}

/** Above this many cells (ends of one × ends of the other, after the common start and end) the middle is compared place by place. */
const MAX_ALIGNMENT_CELLS = 4_000_000;

/**
 * Lines two sequences of thread keys up by a longest common subsequence, so an insertion reads as
 * an insertion: threads in neither the common start, the common end nor the subsequence are paired
 * off gap by gap as changed, and what is left over is inserted or removed.
 *
 * @example alignThreads(['a', 'b'], ['a', 'x', 'b']) // { inserted: [1], removed: [], changed: [] }
 */
export function alignThreads(a: readonly string[], b: readonly string[]): ThreadAlignment {
  let start = 0;
  while (start < a.length && start < b.length && a[start] === b[start]) start++;
  let endA = a.length;
  let endB = b.length;
  while (endA > start && endB > start && a[endA - 1] === b[endB - 1]) {
    endA--;
    endB--;
  }
  const n = endA - start;
  const m = endB - start;
  const matches: [number, number][] = [];
  if (n > 0 && m > 0 && n * m <= MAX_ALIGNMENT_CELLS) {
    // lcs[i * (m + 1) + j]: the longest common subsequence of a[start + i ..] and b[start + j ..].
    const w = m + 1;
    const lcs = new Uint32Array((n + 1) * w);
    for (let i = n - 1; i >= 0; i--) {
      for (let j = m - 1; j >= 0; j--) {
        lcs[i * w + j] = a[start + i] === b[start + j] ? lcs[(i + 1) * w + j + 1] + 1 : Math.max(lcs[(i + 1) * w + j], lcs[i * w + j + 1]);
      }
    }
    let i = 0;
    let j = 0;
    while (i < n && j < m) {
      if (a[start + i] === b[start + j]) {
        matches.push([start + i, start + j]);
        i++;
        j++;
      } else if (lcs[(i + 1) * w + j] >= lcs[i * w + j + 1]) i++;
      else j++;
    }
  }
  const out: ThreadAlignment = { inserted: [], removed: [], changed: [] };
  let i = start;
  let j = start;
  const gap = (toA: number, toB: number) => {
    const paired = Math.min(toA - i, toB - j);
    for (let t = 0; t < toB - j; t++) (t < paired ? out.changed : out.inserted).push(j + t);
    for (let t = paired; t < toA - i; t++) out.removed.push(i + t);
  };
  for (const [x, y] of matches) {
    gap(x, y);
    i = x + 1;
    j = y + 1;
  }
  gap(endA, endB);
  return out;
}

/** An end as the comparison sees it: its shafts, its colour as seen, its layer. */
const endKeys = (d: Draft): string[] =>
  d.threading.map((shafts, e) => `${[...shafts].sort((x, y) => x - y).join(',')}|${d.palette[d.warpColors[e]]}|${layerAt(d.warpLayers, e)}`);

/** A pick as the comparison sees it: the shed and the shafts it lifts, its treadles when both drafts are treadled, its colour and layer. */
function pickKeys(d: Draft, bothTreadled: boolean): string[] {
  return Array.from(liftMasks(d), (mask, p) => {
    const treadles = bothTreadled ? [...(d.treadling[p] ?? [])].sort((x, y) => x - y).join(',') : '';
    return `${d.shed}|${mask}|${treadles}|${d.palette[d.weftColors[p]]}|${layerAt(d.weftLayers, p)}`;
  });
}

/**
 * The ends and picks of draft `b` (newer) lined up with those of `a` (older) by content (see
 * {@link alignThreads}): 48 ends put in the middle are 48 inserted, not every end after them changed.
 */
export function alignDrafts(a: Draft, b: Draft): { ends: ThreadAlignment; picks: ThreadAlignment } {
  const bothTreadled = a.control === 'treadling' && b.control === 'treadling';
  return { ends: alignThreads(endKeys(a), endKeys(b)), picks: alignThreads(pickKeys(a, bothTreadled), pickKeys(b, bothTreadled)) };
}
