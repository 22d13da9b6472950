import { liftMasks } from './drawdown';
import { MAX_TREADLES, type Draft } from './types';

/** Bit mask (bit 0 = shaft 1) → ascending 1-based shaft numbers. */
export function maskShafts(mask: number): number[] {
  const shafts: number[] = [];
  for (let s = 0; s < 32; s++) if ((mask >>> s) & 1) shafts.push(s + 1);
  return shafts;
}

/**
 * The shafts lifted on every pick, read from the lift plan or worked out from the tie-up of the
 * treadles pressed. These are the lists as written: with a sinking shed they name the shafts that sink.
 */
export function liftPlanOf(draft: Draft): number[][] {
  return Array.from(liftMasks(draft), maskShafts);
}

export type TreadlingResult =
  | {
      ok: true;
      /** Per treadle: the shafts tied to it. */
      tieup: number[][];
      /** Per pick: the treadles pressed together (empty for a pick that lifts nothing). */
      treadling: number[][];
      /** Treadles used (the tie-up's length), never more than asked. */
      treadles: number;
      /** Most treadles pressed together on any pick. */
      feet: number;
    }
  | { ok: false; reason: string };

export interface TreadlingOptions {
  /** Most treadles pressed together on one pick; two feet is common practice. 1–4, default 2. */
  maxFeet?: number;
}

/**
 * Finds a tie-up and treadling for at most `maxTreadles` treadles that lift exactly what the draft
 * lifts on every pick. One treadle per different lift when they fit; otherwise treadles pressed
 * together, each pick's lift being the union of its treadles' tie-ups, trying one more foot at a
 * time up to `maxFeet` and, for that many feet, the fewest treadles found. Every pick presses as few
 * treadles as the tie-up allows. When no tie-up is found the reason says so plainly; it proves
 * impossibility when there are more lifts than ways to press the treadles.
 *
 * @example treadlingFor(draft, 6) // { ok: true, tieup, treadling, treadles: 6, feet: 2 } or { ok: false, reason }
 */
export function treadlingFor(draft: Draft, maxTreadles: number, options: TreadlingOptions = {}): TreadlingResult {
  const maxFeet = options.maxFeet ?? 2;
  if (!Number.isInteger(maxTreadles) || maxTreadles < 0 || maxTreadles > MAX_TREADLES) {
    return { ok: false, reason: `The number of treadles must be a whole number from 0 to ${MAX_TREADLES}.` };
  }
  if (!Number.isInteger(maxFeet) || maxFeet < 1 || maxFeet > 4) {
    return { ok: false, reason: 'Treadles pressed together must be a whole number from 1 to 4.' };
  }
  const masks = liftMasks(draft);
  const lifts = distinctLifts(masks);
  if (lifts.length <= maxTreadles) return build(masks, lifts, 1);

  let best = Number.POSITIVE_INFINITY;
  for (let feet = 2; feet <= maxFeet; feet++) {
    if (combinations(maxTreadles, feet) < lifts.length) continue;
    const split = bestShaftGroups(lifts, feet).flat();
    // Searching past maxTreadles costs little and lets the reason say how many treadles would do.
    const searched = searchTieup(lifts, feet, split.length - 1);
    const tieup = searched ?? split;
    if (tieup.length <= maxTreadles) return build(masks, tieup, feet);
    best = Math.min(best, tieup.length);
  }
  const combos = combinations(maxTreadles, maxFeet);
  const feetWords = maxFeet === 1 ? 'one treadle per pick' : `at most ${maxFeet} treadles pressed together`;
  if (combos < lifts.length) {
    return {
      ok: false,
      reason: `Cannot be done with ${maxTreadles} treadles: the draft has ${lifts.length} different lifts, and ${maxTreadles} treadles with ${feetWords} give only ${combos} different presses.`,
    };
  }
  return {
    ok: false,
    reason: `Cannot be done with ${maxTreadles} treadles: no tie-up was found for the draft's ${lifts.length} different lifts with ${feetWords}; the best found needs ${best} treadles. Use more treadles or weave from the lift plan.`,
  };
}

/** Different non-empty lifts in order of first use. */
function distinctLifts(masks: Uint32Array): number[] {
  return [...new Set(masks)].filter((m) => m !== 0);
}

/** Ways to press between 1 and `feet` of `n` treadles together. */
function combinations(n: number, feet: number): number {
  let total = 0;
  let c = 1;
  for (let k = 1; k <= feet && k <= n; k++) {
    c = (c * (n - k + 1)) / k;
    total += c;
  }
  return total;
}

/**
 * The fewest treadles (indices into `tieup`) whose union is exactly `lift`, at most `maxFeet` of
 * them, or null. Only treadles inside the lift can take part, and one of them must hold the lowest
 * shaft still missing, which keeps the search small.
 */
function coverOf(lift: number, tieup: readonly number[], maxFeet: number): number[] | null {
  if (lift === 0) return [];
  const inside: number[] = [];
  for (let i = 0; i < tieup.length; i++) if (tieup[i] !== 0 && (tieup[i] & ~lift) === 0) inside.push(i);
  const chosen: number[] = [];
  const extend = (missing: number, feetLeft: number): boolean => {
    if (missing === 0) return true;
    if (feetLeft === 0) return false;
    const lowest = missing & -missing;
    for (const i of inside) {
      if ((tieup[i] & lowest) === 0) continue;
      chosen.push(i);
      if (extend(missing & ~tieup[i], feetLeft - 1)) return true;
      chosen.pop();
    }
    return false;
  };
  for (let feet = 1; feet <= maxFeet; feet++) if (extend(lift, feet)) return chosen;
  return null;
}

/** Tie-up and treadling from chosen treadle masks; treadles are numbered in the order first pressed. */
function build(masks: Uint32Array, tieupMasks: readonly number[], maxFeet: number): TreadlingResult {
  const coverByLift = new Map<number, number[]>();
  const covers = Array.from(masks, (lift) => {
    let cover = coverByLift.get(lift);
    if (!cover) {
      const found = coverOf(lift, tieupMasks, maxFeet);
      if (!found) throw new Error('tie-up search returned a tie-up that misses a lift');
      coverByLift.set(lift, (cover = found));
    }
    return cover;
  });
  const number = new Map<number, number>();
  for (const cover of covers) for (const i of cover) if (!number.has(i)) number.set(i, number.size + 1);
  const tieup = [...number.keys()].map((i) => maskShafts(tieupMasks[i]));
  const treadling = covers.map((cover) => cover.map((i) => number.get(i) as number).sort((a, b) => a - b));
  const feet = covers.reduce((most, c) => Math.max(most, c.length), 0);
  return { ok: true, tieup, treadling, treadles: tieup.length, feet };
}

const popcount = (m: number) => {
  let n = 0;
  for (let v = m >>> 0; v; v &= v - 1) n++;
  return n;
};

/**
 * Depth-first search for a tie-up of at most `limit` treadles covering every lift with at most
 * `feet` treadles, fewest treadles first. Candidate treadles are single shafts, the lifts, and
 * the common and different parts of pairs of lifts. Gives up (null) past a fixed amount of work,
 * so it stays quick; the shaft-group split is the fallback.
 */
function searchTieup(lifts: readonly number[], feet: number, limit: number): number[] | null {
  if (lifts.length > 120 || limit < 1) return null;
  const order = [...lifts].sort((a, b) => popcount(a) - popcount(b));
  const pool = new Set<number>(lifts);
  const used = lifts.reduce((u, l) => u | l, 0);
  for (let s = 0; s < 32; s++) if ((used >>> s) & 1) pool.add((1 << s) >>> 0);
  if (lifts.length <= 40) {
    for (const a of lifts) {
      for (const b of lifts) {
        for (const part of [(a & b) >>> 0, (a & ~b) >>> 0]) if (part !== 0) pool.add(part);
      }
    }
  }
  // Pieces found inside many lifts first: they are the ones worth a treadle.
  const usefulness = (c: number) => lifts.reduce((n, l) => n + ((c & ~l) === 0 ? 1 : 0), 0);
  const candidates = [...pool]
    .map((c) => ({ c, u: usefulness(c) }))
    .sort((x, y) => y.u - x.u || popcount(y.c) - popcount(x.c))
    .map((x) => x.c);
  const inside = new Map(order.map((l) => [l, candidates.filter((c) => (c & ~l) === 0)]));
  let budget = 1_000;
  const tieup: number[] = [];
  const dfs = (from: number, size: number): boolean => {
    // Treadles are only added, so lifts already covered stay covered.
    let i = from;
    while (i < order.length && coverOf(order[i], tieup, feet) !== null) i++;
    if (i === order.length) return true;
    if (tieup.length === size || --budget < 0) return false;
    const lift = order[i];
    for (const c of inside.get(lift) as number[]) {
      if (tieup.includes(c)) continue;
      tieup.push(c);
      if (dfs(i, size)) return true;
      tieup.pop();
      if (budget < 0) return false;
    }
    return false;
  };
  let size = 1;
  while (combinations(size, feet) < lifts.length) size++;
  for (; size <= limit && budget >= 0; size++) {
    if (dfs(0, size)) return [...tieup];
    tieup.length = 0;
  }
  return null;
}

/** Small deterministic generator so the same draft always gets the same tie-up. */
function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Splits the shafts into `feet` groups so that the different parts of the lifts in each group are
 * as few as possible; each part becomes one treadle. Shafts that are always lifted together stay
 * together. Local search from a few starting splits; returns per group the distinct parts.
 */
function bestShaftGroups(lifts: readonly number[], feet: number): number[][] {
  const classes = shaftClasses(lifts);
  const k = classes.length;
  const group = new Int8Array(k);
  const cost = () => partsOf(lifts, classes, group, feet).reduce((s, g) => s + g.length, 0);
  const starts: ((c: number) => number)[] = [(c) => Math.floor((c * feet) / k), (c) => c % feet];
  const random = mulberry32(lifts.length * 7919 + k);
  // Keep the search to a few million lift visits so large drafts still answer quickly.
  const perClimb = Math.max(1, k * (feet - 1) * lifts.length * 4);
  const restarts = Math.max(starts.length, Math.min(24, Math.floor(1_000_000 / perClimb)));
  let best: Int8Array = group.slice();
  let bestCost = Number.POSITIVE_INFINITY;
  for (let r = 0; r < restarts; r++) {
    const start = starts[r] ?? (() => Math.floor(random() * feet));
    for (let c = 0; c < k; c++) group[c] = start(c);
    let current = cost();
    for (let improved = true; improved; ) {
      improved = false;
      for (let c = 0; c < k; c++) {
        const home = group[c];
        for (let g = 0; g < feet; g++) {
          if (g === home) continue;
          group[c] = g;
          const moved = cost();
          if (moved < current) {
            current = moved;
            improved = true;
            break;
          }
          group[c] = home;
        }
      }
    }
    if (current < bestCost) {
      bestCost = current;
      best = group.slice();
    }
  }
  return partsOf(lifts, classes, best, feet);
}

/** Masks of shafts that appear in exactly the same lifts. */
function shaftClasses(lifts: readonly number[]): number[] {
  const bySignature = new Map<string, number>();
  for (let s = 0; s < 32; s++) {
    const bit = 1 << s;
    let signature = '';
    let used = false;
    for (const l of lifts) {
      const on = (l & bit) !== 0;
      used ||= on;
      signature += on ? '1' : '0';
    }
    if (used) bySignature.set(signature, ((bySignature.get(signature) ?? 0) | bit) >>> 0);
  }
  return [...bySignature.values()];
}

function partsOf(lifts: readonly number[], classes: readonly number[], group: Int8Array, feet: number): number[][] {
  const spans = new Array<number>(feet).fill(0);
  classes.forEach((c, i) => (spans[group[i]] |= c));
  return spans.map((span) => [...new Set(lifts.map((l) => (l & span) >>> 0))].filter((m) => m !== 0));
}

/** The same cloth with its picks given as a lift plan (tie-up and treadling are kept for switching back). */
export function toLiftPlanDraft(draft: Draft): Draft {
  if (draft.control === 'liftplan') return draft;
  return { ...draft, control: 'liftplan', liftplan: liftPlanOf(draft) };
}

/**
 * The same cloth woven from treadles: a tie-up and treadling for at most `maxTreadles` treadles
 * (see {@link treadlingFor}), or the reason it cannot be done.
 */
export function toTreadlingDraft(
  draft: Draft,
  maxTreadles: number,
  options: TreadlingOptions = {},
): { ok: true; draft: Draft } | { ok: false; reason: string } {
  const result = treadlingFor(draft, maxTreadles, options);
  if (!result.ok) return result;
  return {
    ok: true,
    draft: { ...draft, control: 'treadling', treadles: result.treadles, tieup: result.tieup, treadling: result.treadling },
  };
}
