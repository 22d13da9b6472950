import { checkThreading } from './check-threading';
import { computeDrawdown, type Drawdown } from './drawdown';
import { resolveLayers } from './layer-lists';
import type { Draft } from './types';

/** A layer per end and per pick (1-based); a shorter list repeats, an empty one means all layer 1. */
export interface LayerAssignment {
  warp: number[];
  weft: number[];
}

/** One face of the cloth at cell resolution: a palette index per cell. */
export interface FaceImage {
  width: number;
  height: number;
  /** Palette indices, row by row (`y * width + x`). */
  indices: Uint16Array;
  /** Palette index at column x, row y (both 0-based). */
  colorAt(x: number, y: number): number;
}

/** A rectangle of cells (0-based, inclusive) where one layer is on top. */
export interface LayerRegion {
  firstEnd: number;
  lastEnd: number;
  firstPick: number;
  lastPick: number;
  top: number;
}

export type LayerProblemKind = 'stitch' | 'crossed-end' | 'wrong-lift';

export interface LayerProblem {
  /**
   * 'stitch': one crossing ties the layers where they are otherwise separate; 'crossed-end': an end
   * threaded on a shaft of another layer; 'wrong-lift': a pick raises (or leaves down) a whole
   * shaft against the layer order there.
   */
  kind: LayerProblemKind;
  /** 0-based end, when the problem sits on one end. */
  end?: number;
  /** 0-based pick, when the problem sits on one pick. */
  pick?: number;
  /** 1-based shaft, when one shaft is to blame. */
  shaft?: number;
  /**
   * Where the layers are tied by it, 0-based: for a crossed end the picks, for a wrong lift the
   * ends, that cross against the layer order there.
   */
  tied?: number[];
  /** For a wrong lift: true when the shaft's ends are up over the pick against the order, false when they stay down. */
  raised?: boolean;
  /** In a weaver's words, with 1-based end, pick and shaft numbers. */
  message: string;
}

export interface LayerSimulation {
  ends: number;
  picks: number;
  warpLayers: Uint8Array;
  weftLayers: Uint8Array;
  /** Top layer per cell (`pick * ends + end`). */
  top: Uint8Array;
  /** Bottom layer per cell, the one the back shows. */
  bottom: Uint8Array;
  /** Layer on top at a 0-based end and pick. */
  topLayerAt(end: number, pick: number): number;
  /** The front as woven. */
  front: FaceImage;
  /** The back as the weaver sees it turned over: mirrored left to right, so x = 0 is the last end. */
  back: FaceImage;
  /** The layer map: rectangles of cells with the same top layer, covering the cloth. */
  regions: LayerRegion[];
  /** Problems found, at most `maxProblems`: crossed ends first, then wrong lifts, then stitches. */
  problems: LayerProblem[];
  /** How many problems were found in all, including those left out of `problems`. */
  problemCount: number;
}

export interface LayerOptions {
  /** A drawdown already computed for the draft, to avoid computing it twice. */
  drawdown?: Drawdown;
  /**
   * Without block links, each cell's layer order is judged from crossings within this many ends
   * and picks of it. Default 2: a 5 × 5 window covers one double-weave unit wherever it sits.
   */
  radius?: number;
  /** Cap on the problems listed. Default 200. */
  maxProblems?: number;
}


/**
 * Where the threads of each layer lie: which layer is on top at every cell, both faces, the layer
 * map, and the crossings, ends and picks that break the layers apart.
 *
 * How a cell gets its top layer: every crossing of an end of layer a with a pick of layer b (a ≠ b)
 * is a vote — end up means a above b, end down means b above a. A cell's order for each pair of
 * layers is the majority of the votes in its area: the rectangle of its warp block and weft block
 * when the draft keeps block links (an expanded profile), otherwise a window of `radius` around it.
 * A tie goes to the cell's own crossing, then to the lower-numbered layer. With more than two
 * layers the top is the layer that is above the most others (ties to the lower number). An area
 * whose crossings agree at least three to one counts as cleanly separated, and only there are the
 * crossings that disagree flagged.
 *
 * A face shows only the top layer's threads: at each cell, the interlacement of the nearest end and
 * nearest pick of that layer (so a double-weave face reads as its layer's plain weave).
 *
 * @example simulateLayers(doubleWeaveDraft).topLayerAt(0, 0) // 1 where block A has layer 1 up
 */
export function simulateLayers(draft: Draft, layers?: LayerAssignment, options: LayerOptions = {}): LayerSimulation {
  const dd = options.drawdown ?? computeDrawdown(draft);
  const W = dd.ends;
  const H = dd.picks;
  const { bits, stride } = dd;
  const wl = resolveLayers(layers?.warp ?? draft.warpLayers, W);
  const pl = resolveLayers(layers?.weft ?? draft.weftLayers, H);
  const radius = Math.max(0, Math.floor(options.radius ?? 2));
  const maxProblems = options.maxProblems ?? 200;

  // Layers in use, and an index for each pair of them that actually cross.
  let L = 1;
  for (let i = 0; i < W; i++) if (wl[i] > L) L = wl[i];
  for (let i = 0; i < H; i++) if (pl[i] > L) L = pl[i];
  const inWarp = new Uint8Array(L + 1);
  const inWeft = new Uint8Array(L + 1);
  for (let i = 0; i < W; i++) inWarp[wl[i]] = 1;
  for (let i = 0; i < H; i++) inWeft[pl[i]] = 1;
  const present: number[] = [];
  for (let a = 1; a <= L; a++) if (inWarp[a] || inWeft[a]) present.push(a);
  const pairOf = new Int16Array((L + 1) * (L + 1)).fill(-1);
  const pairA: number[] = [];
  const pairB: number[] = [];
  for (const a of present) {
    for (const b of present) {
      if (a < b && ((inWarp[a] && inWeft[b]) || (inWarp[b] && inWeft[a]))) {
        pairOf[a * (L + 1) + b] = pairOf[b * (L + 1) + a] = pairA.length;
        pairA.push(a);
        pairB.push(b);
      }
    }
  }
  const nPairs = pairA.length;

  // The area each cell is judged in: its block run where blocks are known, else a window.
  const xSegments = areaSegments(draft.blocks?.warp, W, radius);
  const ySegments = areaSegments(draft.blocks?.weft, H, radius);
  const blockAreas = xSegments.linked && ySegments.linked;
  const layerMasks = layerBits(wl, L, stride);

  // Votes for "lower-numbered layer above" per pair, countable over any area. With block areas,
  // each area's count is summed 32 ends at a time; otherwise a summed-area table per pair (pair k
  // at offset k * size) gives any window's count in four reads. The number of votes needs no
  // table: it follows from how many ends and picks of each layer the area holds.
  const W1 = W + 1;
  const size = blockAreas ? 0 : W1 * (H + 1);
  const satPlus = new Int32Array(nPairs * size);
  const xCount = xSegments.count;
  const yCount = ySegments.count;
  const areaPlus = new Int32Array(blockAreas ? nPairs * yCount * xCount : 0);
  for (let k = 0; k < nPairs; k++) {
    const off = k * size;
    for (let y = 0, yRun = 0; y < H; y++) {
      if (yRun + 1 < yCount && ySegments.first[yRun + 1] === y) yRun++;
      const b = pl[y];
      const base = off + (y + 1) * W1;
      const prev = off + y * W1;
      if (b !== pairA[k] && b !== pairB[k]) {
        if (!blockAreas) satPlus.copyWithin(base, prev, prev + W1);
        continue;
      }
      const other = b === pairA[k] ? pairB[k] : pairA[k];
      const flip = other < b ? 0 : 1; // an end of the lower layer votes "above" when up
      const row = y * stride;
      if (blockAreas) {
        const flipWord = flip ? 0xffffffff : 0;
        const areaRow = (k * yCount + yRun) * xCount;
        for (let seg = 0; seg < xCount; seg++) {
          const first = xSegments.first[seg];
          const last = xSegments.last[seg];
          let plus = 0;
          for (let w = first >>> 5; w <= last >>> 5; w++) {
            plus += popcount((bits[row + w] ^ flipWord) & layerMasks[other * stride + w] & wordRange(w, first, last));
          }
          areaPlus[areaRow + seg] += plus;
        }
        continue;
      }
      let plus = 0;
      for (let x = 0; x < W; x++) {
        if (wl[x] === other) plus += ((bits[row + (x >>> 5)] >>> (x & 31)) & 1) ^ flip;
        satPlus[base + x + 1] = satPlus[prev + x + 1] + plus;
      }
    }
  }
  const endsBefore = countsBefore(wl, L);
  const picksBefore = countsBefore(pl, L);

  const top = new Uint8Array(W * H);
  const bottom = new Uint8Array(W * H);
  const expect = new Int8Array(nPairs); // +1 lower layer above, -1 higher above, 0 unknown
  const clean = new Uint8Array(nPairs);
  const score = new Int8Array(L + 1);
  const twoLayers = present.length === 2 && nPairs === 1;
  const conflictCells: number[] = [];
  const picksOfPair = new Int32Array(2 * nPairs); // picks of each layer of each pair in the row's area

  for (let y = 0, yRun = 0; y < H; y++) {
    if (yRun + 1 < yCount && ySegments.first[yRun + 1] === y) yRun++;
    const y0 = ySegments.lo[y];
    const y1 = ySegments.hi[y] + 1;
    const b = pl[y];
    const row = y * stride;
    const rowStart = y * W;
    const y0W = y0 * W1;
    const y1W = y1 * W1;
    for (let k = 0; k < nPairs; k++) {
      picksOfPair[2 * k] = picksBefore[pairA[k] * (H + 1) + y1] - picksBefore[pairA[k] * (H + 1) + y0];
      picksOfPair[2 * k + 1] = picksBefore[pairB[k] * (H + 1) + y1] - picksBefore[pairB[k] * (H + 1) + y0];
    }
    for (let s = 0; s < xSegments.count; s++) {
      // Cells sharing an area share its counts: [first, last] all judge within [lo, hi).
      const first = xSegments.first[s];
      const last = xSegments.last[s];
      const lo = xSegments.areaLo[s];
      const hi = xSegments.areaHi[s] + 1;
      for (let k = 0, off = 0; k < nPairs; k++, off += size) {
        const P = blockAreas
          ? areaPlus[(k * yCount + yRun) * xCount + s]
          : satPlus[off + y1W + hi] - satPlus[off + y0W + hi] - satPlus[off + y1W + lo] + satPlus[off + y0W + lo];
        const A = pairA[k] * W1;
        const B = pairB[k] * W1;
        const C =
          (endsBefore[A + hi] - endsBefore[A + lo]) * picksOfPair[2 * k + 1] + (endsBefore[B + hi] - endsBefore[B + lo]) * picksOfPair[2 * k];
        const d = 2 * P - C;
        expect[k] = d > 0 ? 1 : d < 0 ? -1 : 0;
        clean[k] = C > 0 && (d < 0 ? -d : d) * 2 >= C ? 1 : 0;
      }
      if (twoLayers && expect[0] !== 0) {
        const lowerAbove = expect[0] > 0;
        if (first === last) {
          top[rowStart + first] = lowerAbove ? pairA[0] : pairB[0];
          bottom[rowStart + first] = lowerAbove ? pairB[0] : pairA[0];
        } else {
          top.fill(lowerAbove ? pairA[0] : pairB[0], rowStart + first, rowStart + last + 1);
          bottom.fill(lowerAbove ? pairB[0] : pairA[0], rowStart + first, rowStart + last + 1);
        }
        if (!clean[0]) continue;
        // Crossings that go against the area's order, 32 ends at a time: an end of the other layer
        // whose vote ("up" for the lower layer, "down" for the higher) differs from the area's.
        const other = b === pairA[0] ? pairB[0] : pairA[0];
        const against = (other < b ? 0 : 0xffffffff) ^ (lowerAbove ? 0xffffffff : 0);
        for (let w = first >>> 5; w <= last >>> 5; w++) {
          let m = ((bits[row + w] ^ against) & layerMasks[other * stride + w] & wordRange(w, first, last)) >>> 0;
          while (m !== 0) {
            const low = m & -m;
            conflictCells.push(rowStart + w * 32 + 31 - Math.clz32(low));
            m = (m ^ low) >>> 0;
          }
        }
        continue;
      }
      for (let x = first; x <= last; x++) {
        const a = wl[x];
        const cellPair = a !== b ? pairOf[a * (L + 1) + b] : -1;
        // The cell's own vote: 1 when it puts the lower-numbered layer above.
        const own = cellPair >= 0 ? ((bits[row + (x >>> 5)] >>> (x & 31)) & 1) ^ (a < b ? 0 : 1) : -1;
        score.fill(0);
        for (let k = 0; k < nPairs; k++) {
          const lowerAbove = expect[k] !== 0 ? expect[k] > 0 : k === cellPair ? own === 1 : true;
          score[lowerAbove ? pairA[k] : pairB[k]]++;
        }
        let t = present[0];
        let u = present[0];
        for (const l of present) {
          if (score[l] > score[t]) t = l;
          if (score[l] <= score[u]) u = l;
        }
        top[rowStart + x] = t;
        bottom[rowStart + x] = u;
        if (cellPair >= 0 && clean[cellPair] && expect[cellPair] !== (own === 1 ? 1 : -1)) conflictCells.push(rowStart + x);
      }
    }
  }

  const problems = layerProblems(draft, dd, wl, pl, conflictCells);
  const nearEnd = nearestOfLayer(wl, present, L, draft.blocks?.warp);
  const nearPick = nearestOfLayer(pl, present, L, draft.blocks?.weft);
  const frontIdx = new Uint16Array(W * H);
  const backIdx = new Uint16Array(W * H);
  const warpColors = Uint16Array.from({ length: W }, (_, e) => draft.warpColors[e] ?? 0);
  const weftColors = Uint16Array.from({ length: H }, (_, p) => draft.weftColors[p] ?? 0);
  // What each layer shows across a whole row depends only on that layer's nearest pick, so each
  // layer's front and back rows are worked out once per pick and copied a run at a time.
  const frontRows = new Uint16Array((L + 1) * W);
  const backRows = new Uint16Array((L + 1) * W);
  const rowKey = new Int32Array(L + 1).fill(-1);
  for (let y = 0; y < H; y++) {
    for (const l of present) {
      const near = nearPick[l * H + y];
      const p = near < 0 ? y : near;
      if (rowKey[l] === p) continue;
      rowKey[l] = p;
      const row = p * stride;
      for (let x = 0, i = l * W; x < W; x++, i++) {
        const nearE = nearEnd[i];
        const e = nearE < 0 ? x : nearE;
        const up = (bits[row + (e >>> 5)] >>> (e & 31)) & 1;
        // Front: the layer's own interlacement as woven; back: seen from below, so an end up is
        // hidden. The back row is kept mirrored, ready to copy.
        frontRows[i] = up ? warpColors[e] : weftColors[p];
        backRows[l * W + W - 1 - x] = up ? weftColors[p] : warpColors[e];
      }
    }
    const rowStart = y * W;
    copyRuns(top, frontRows, frontIdx, rowStart, W, false);
    copyRuns(bottom, backRows, backIdx, rowStart, W, true);
  }

  return {
    ends: W,
    picks: H,
    warpLayers: wl,
    weftLayers: pl,
    top,
    bottom,
    topLayerAt: (end, pick) => (end >= 0 && end < W && pick >= 0 && pick < H ? top[pick * W + end] : 0),
    front: faceImage(frontIdx, W, H),
    back: faceImage(backIdx, W, H),
    regions: layerRegions(top, W, H),
    problems: problems.slice(0, maxProblems),
    problemCount: problems.length,
  };
}

/**
 * Turns the crossings that go against their area's order into problems: those on crossed ends are
 * the threading's fault; where most of one shaft's judged ends go wrong on one pick, the lift is
 * at fault; the rest are single stitches.
 */
function layerProblems(draft: Draft, dd: Drawdown, wl: Uint8Array, pl: Uint8Array, conflictCells: readonly number[]): LayerProblem[] {
  const W = dd.ends;
  const { bits, stride } = dd;
  const upAt = (x: number, y: number) => (bits[y * stride + (x >>> 5)] >>> (x & 31)) & 1;
  const threadingCheck = checkThreading(draft, Array.from(wl));
  const crossed = new Uint8Array(W);
  const problems: LayerProblem[] = [];
  const crossedAt = new Map<number, LayerProblem>();
  for (const p of threadingCheck.problems) {
    if (p.kind !== 'layer') continue;
    crossed[p.end] = 1;
    const problem: LayerProblem = { kind: 'crossed-end', end: p.end, shaft: p.shaft, message: p.message, tied: [] };
    crossedAt.set(p.end, problem);
    problems.push(problem);
  }
  const shaftsOf = (x: number) => (draft.threading[x] ?? []).filter((s) => s >= 1 && s <= 32);

  // Per pick with conflicts: how many of each shaft's cross-layer ends go against the order.
  const against = new Map<number, Int32Array>();
  const kept: number[] = [];
  for (const cell of conflictCells) {
    // A crossed end's wrong crossings are its threading's fault: they belong to that one problem.
    if (crossed[cell % W]) crossedAt.get(cell % W)?.tied?.push(Math.floor(cell / W));
    else kept.push(cell);
  }
  for (const p of crossedAt.values()) p.tied?.sort((a, b) => a - b);
  for (const cell of kept) {
    const y = Math.floor(cell / W);
    let row = against.get(y);
    if (!row) against.set(y, (row = new Int32Array(33)));
    for (const s of shaftsOf(cell % W)) row[s]++;
  }
  // A shaft's lift is at fault when at least two of its ends, and most of those on a crossing, go wrong.
  const wrong = new Map<number, Set<number>>();
  for (const [y, row] of against) {
    const crossing = new Int32Array(33);
    for (let x = 0; x < W; x++) if (wl[x] !== pl[y] && !crossed[x]) for (const s of shaftsOf(x)) crossing[s]++;
    for (let s = 1; s <= 32; s++) {
      if (row[s] >= 2 && row[s] * 2 > crossing[s]) wrong.set(y, (wrong.get(y) ?? new Set()).add(s));
    }
  }
  const stitches: LayerProblem[] = [];
  const reported = new Map<number, LayerProblem>();
  for (const cell of kept) {
    const y = Math.floor(cell / W);
    const x = cell % W;
    const a = wl[x];
    const b = pl[y];
    const up = upAt(x, y);
    const faulty = shaftsOf(x).filter((s) => wrong.get(y)?.has(s));
    for (const s of faulty) {
      const seen = reported.get(y * 33 + s);
      if (seen) {
        seen.tied?.push(x);
        continue;
      }
      const n = against.get(y)?.[s] ?? 0;
      const problem: LayerProblem = {
        kind: 'wrong-lift',
        pick: y,
        shaft: s,
        tied: [x],
        raised: up === 1,
        message: up
          ? `Pick ${y + 1} (layer ${b}) raises shaft ${s}, putting its ${n} layer-${a} ends over the pick where layer ${b} should be on top: the layers are stitched together.`
          : `Pick ${y + 1} (layer ${b}) leaves shaft ${s} down, so the pick passes over its ${n} layer-${a} ends where layer ${a} should be on top: the layers are stitched together.`,
      };
      reported.set(y * 33 + s, problem);
      problems.push(problem);
    }
    if (faulty.length > 0) continue;
    stitches.push({
      kind: 'stitch',
      end: x,
      pick: y,
      message: up
        ? `End ${x + 1} (layer ${a}) is raised over pick ${y + 1} (layer ${b}) where layer ${b} is on top: a stitch that ties the layers together.`
        : `Pick ${y + 1} (layer ${b}) passes over end ${x + 1} (layer ${a}) where layer ${a} is on top: a stitch that ties the layers together.`,
    });
  }
  return [...problems, ...stitches];
}

function faceImage(indices: Uint16Array, width: number, height: number): FaceImage {
  return {
    width,
    height,
    indices,
    colorAt: (x, y) => (x >= 0 && x < width && y >= 0 && y < height ? indices[y * width + x] : 0),
  };
}

interface Segments {
  /** True when the areas are runs of block links, false for windows. */
  linked: boolean;
  /** Per thread: first and last index of the area it is judged in. */
  lo: Int32Array;
  hi: Int32Array;
  /** Runs of threads sharing one area: [first, last] judged within [areaLo, areaHi]. */
  count: number;
  first: Int32Array;
  last: Int32Array;
  areaLo: Int32Array;
  areaHi: Int32Array;
}

/**
 * The area each thread is judged in: the run of equal block links, or `radius` either side when
 * there are no usable links (each thread then is a run of its own).
 */
function areaSegments(links: readonly number[] | undefined, n: number, radius: number): Segments {
  const lo = new Int32Array(n);
  const hi = new Int32Array(n);
  const linked = links !== undefined && links.length === n && links.some((b) => b > 0);
  if (linked) {
    let start = 0;
    for (let i = 1; i <= n; i++) {
      if (i === n || links[i] !== links[start]) {
        lo.fill(start, start, i);
        hi.fill(i - 1, start, i);
        start = i;
      }
    }
  } else {
    for (let i = 0; i < n; i++) {
      lo[i] = Math.max(0, i - radius);
      hi[i] = Math.min(n - 1, i + radius);
    }
  }
  const first: number[] = [];
  for (let i = 0; i < n; i++) if (i === 0 || lo[i] !== lo[i - 1] || hi[i] !== hi[i - 1]) first.push(i);
  const starts = Int32Array.from(first);
  const last = Int32Array.from(first, (_, s) => (s + 1 < first.length ? first[s + 1] - 1 : n - 1));
  return {
    linked,
    lo,
    hi,
    count: starts.length,
    first: starts,
    last,
    areaLo: Int32Array.from(first, (i) => lo[i]),
    areaHi: Int32Array.from(first, (i) => hi[i]),
  };
}

/**
 * Fills one face row from the per-layer rows, a run of cells with the same layer at a time.
 * `mirrored`: the face and its layer rows run right to left (the back).
 */
function copyRuns(layerAt: Uint8Array, layerRows: Uint16Array, face: Uint16Array, rowStart: number, W: number, mirrored: boolean): void {
  let start = 0;
  for (let x = 1; x <= W; x++) {
    if (x < W && layerAt[rowStart + x] === layerAt[rowStart + start]) continue;
    const from = mirrored ? W - x : start;
    const l = layerAt[rowStart + start] * W;
    // A plain loop: runs are short, and a subarray per run costs more than the copy.
    for (let i = from, end = from + x - start; i < end; i++) face[rowStart + i] = layerRows[l + i];
    start = x;
  }
}

/** For each layer l, at l * stride: a bit row of its ends (bit e % 32 of word e >> 5). */
function layerBits(layerOf: Uint8Array, L: number, stride: number): Uint32Array {
  const out = new Uint32Array((L + 1) * stride);
  for (let e = 0; e < layerOf.length; e++) out[layerOf[e] * stride + (e >>> 5)] |= 1 << (e & 31);
  return out;
}

/** Bits of word w that fall within ends first..last. */
function wordRange(w: number, first: number, last: number): number {
  const lo = w === first >>> 5 ? first & 31 : 0;
  const hi = w === last >>> 5 ? last & 31 : 31;
  return ((0xffffffff >>> (31 - hi)) & (0xffffffff << lo)) >>> 0;
}

function popcount(v: number): number {
  v = v - ((v >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return Math.imul((v + (v >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24;
}

/** For each layer l, at l * (n + 1) + i: how many of the first i threads are in layer l. */
function countsBefore(layerOf: Uint8Array, L: number): Int32Array {
  const n = layerOf.length;
  const out = new Int32Array((L + 1) * (n + 1));
  for (let l = 1; l <= L; l++) {
    const off = l * (n + 1);
    for (let i = 0; i < n; i++) out[off + i + 1] = out[off + i] + (layerOf[i] === l ? 1 : 0);
  }
  return out;
}

/**
 * For each layer, each position's nearest thread of that layer (itself if it is one), -1 if the
 * layer has none. Ties go to the thread in the same block, then to the earlier one.
 */
function nearestOfLayer(layerOf: Uint8Array, present: readonly number[], L: number, links: readonly number[] | undefined): Int32Array {
  const n = layerOf.length;
  const useLinks = links !== undefined && links.length === n;
  // Layer l's answers sit at l * n; layers not in use stay -1.
  const out = new Int32Array((L + 1) * n).fill(-1);
  for (const l of present) {
    const off = l * n;
    let last = -1;
    for (let i = 0; i < n; i++) {
      if (layerOf[i] === l) last = i;
      out[off + i] = last;
    }
    let next = -1;
    for (let i = n - 1; i >= 0; i--) {
      if (layerOf[i] === l) next = i;
      const prev = out[off + i];
      if (next < 0 || prev === i) continue;
      if (prev < 0) {
        out[off + i] = next;
        continue;
      }
      const dPrev = i - prev;
      const dNext = next - i;
      const nextSameBlock = useLinks && links[next] === links[i] && links[prev] !== links[i];
      if (dNext < dPrev || (dNext === dPrev && nextSameBlock)) out[off + i] = next;
    }
  }
  return out;
}

/** Rows of equal top layer, merged downwards into rectangles while they keep the same span. */
function layerRegions(top: Uint8Array, W: number, H: number): LayerRegion[] {
  const regions: LayerRegion[] = [];
  let open: LayerRegion[] = [];
  for (let y = 0; y < H; y++) {
    const rowStart = y * W;
    if (y > 0 && sameRow(top, rowStart - W, rowStart, W)) {
      for (const r of open) r.lastPick = y;
      continue;
    }
    const next: LayerRegion[] = [];
    let j = 0; // open is sorted by firstEnd, like this row's runs
    let start = 0;
    for (let x = 1; x <= W; x++) {
      if (x < W && top[rowStart + x] === top[rowStart + start]) continue;
      const t = top[rowStart + start];
      while (j < open.length && open[j].firstEnd < start) j++;
      const above = open[j];
      if (above && above.firstEnd === start && above.lastEnd === x - 1 && above.top === t) {
        above.lastPick = y;
        next.push(above);
      } else {
        const region = { firstEnd: start, lastEnd: x - 1, firstPick: y, lastPick: y, top: t };
        regions.push(region);
        next.push(region);
      }
      start = x;
    }
    open = next;
  }
  return regions;
}

function sameRow(a: Uint8Array, i: number, j: number, n: number): boolean {
  for (let k = 0; k < n; k++) if (a[i + k] !== a[j + k]) return false;
  return true;
}

/** Whether any end or pick of the draft is in a layer other than 1 (double weave and beyond). */
export function isLayered(draft: Draft): boolean {
  return draft.warpLayers.some((l) => l !== 1) || draft.weftLayers.some((l) => l !== 1);
}
