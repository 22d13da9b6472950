import { computeDrawdown, type Drawdown } from './drawdown';
import type { Draft } from './types';

/** One float: a thread passing over (or under) several threads of its own layer in a row. */
export interface Float {
  /** 'warp': an end floating along picks; 'weft': a pick floating across ends. */
  kind: 'warp' | 'weft';
  /** 0-based end (warp float) or pick (weft float). */
  thread: number;
  /** 0-based pick (warp float) or end (weft float) of the first crossing floated past. */
  start: number;
  /** 0-based pick or end of the last crossing; below `start` when the float wraps round the repeat. */
  last: number;
  /** Crossings floated past, counting only threads of the same layer. */
  length: number;
  /** 'over': on top of the crossing threads (a warp end up, a pick over the ends); 'under': beneath them. */
  side: 'over' | 'under';
  /** 1-based layer of the thread. */
  layer: number;
}

export interface LayerFloats {
  layer: number;
  warp: Float | null;
  weft: Float | null;
}

export interface FloatReport {
  /** Longest warp float of the whole draft (first found when tied), or null with no ends or picks. */
  warp: Float | null;
  weft: Float | null;
  /** The same per layer, for every layer that has ends or picks. */
  layers: LayerFloats[];
  /** Every float longer than `limit`, warp floats first, by thread then start. Empty without a limit. */
  overLimit: Float[];
}

export interface FloatOptions {
  /** The weaver's longest acceptable float, in crossings. */
  limit?: number;
  /**
   * Treat the draft as one repeat of a longer cloth, so a float running off the last pick (or end)
   * continues from the first. Off by default: the draft is measured as the piece it shows.
   */
  wrap?: boolean;
}

/**
 * Finds the longest warp and weft floats, per layer and overall, and the floats over the limit.
 * In a multi-layer draft an end of layer a is measured only across picks of layer a (crossings
 * with other layers are where layers pass each other, not part of the float), and likewise for picks.
 *
 * @example findFloats(draft, { limit: 5 }).overLimit // floats longer than 5 crossings
 */
export function findFloats(draft: Draft, options: FloatOptions = {}, drawdown: Drawdown = computeDrawdown(draft)): FloatReport {
  const { ends, picks } = drawdown;
  const limit = options.limit ?? Number.POSITIVE_INFINITY;
  const wrap = options.wrap ?? false;
  const warpLayer = (e: number) => draft.warpLayers[e] ?? 1;
  const weftLayer = (p: number) => draft.weftLayers[p] ?? 1;

  // Positions of the crossing threads of each layer, so a thread walks only its own layer.
  const picksOfLayer = groupByLayer(picks, weftLayer);
  const endsOfLayer = groupByLayer(ends, warpLayer);
  const layers = new Map<number, LayerFloats>();
  const layerEntry = (layer: number) => {
    let entry = layers.get(layer);
    if (!entry) layers.set(layer, (entry = { layer, warp: null, weft: null }));
    return entry;
  };
  const overLimit: Float[] = [];
  const record = (f: Float) => {
    const entry = layerEntry(f.layer);
    const best = f.kind === 'warp' ? entry.warp : entry.weft;
    if (!best || f.length > best.length) {
      if (f.kind === 'warp') entry.warp = f;
      else entry.weft = f;
    }
    if (f.length > limit) overLimit.push(f);
  };

  const { bits, stride } = drawdown;
  const up = (e: number, p: number) => ((bits[p * stride + (e >>> 5)] >>> (e & 31)) & 1) === 1;

  for (let e = 0; e < ends; e++) {
    const layer = warpLayer(e);
    const along = picksOfLayer.get(layer) ?? [];
    if (along.length > 0) layerEntry(layer);
    scanRuns(along, (p) => up(e, p), wrap, (start, last, length, isUp) =>
      record({ kind: 'warp', thread: e, start, last, length, side: isUp ? 'over' : 'under', layer }),
    );
  }
  for (let p = 0; p < picks; p++) {
    const layer = weftLayer(p);
    const across = endsOfLayer.get(layer) ?? [];
    if (across.length > 0) layerEntry(layer);
    // The pick is over where the end is down.
    scanRuns(across, (e) => !up(e, p), wrap, (start, last, length, isOver) =>
      record({ kind: 'weft', thread: p, start, last, length, side: isOver ? 'over' : 'under', layer }),
    );
  }

  const layerList = [...layers.values()].sort((a, b) => a.layer - b.layer);
  const longest = (kind: 'warp' | 'weft') =>
    layerList.reduce<Float | null>((best, l) => {
      const f = l[kind];
      return f && (!best || f.length > best.length) ? f : best;
    }, null);
  overLimit.sort((a, b) => (a.kind === b.kind ? a.thread - b.thread || a.start - b.start : a.kind === 'warp' ? -1 : 1));
  return { warp: longest('warp'), weft: longest('weft'), layers: layerList, overLimit };
}

function groupByLayer(count: number, layerOf: (i: number) => number): Map<number, number[]> {
  const groups = new Map<number, number[]>();
  for (let i = 0; i < count; i++) {
    const layer = layerOf(i);
    let list = groups.get(layer);
    if (!list) groups.set(layer, (list = []));
    list.push(i);
  }
  return groups;
}

/**
 * Calls `emit` for every maximal run of equal values along `positions`. With `wrap`, a run that
 * reaches the end joins the one at the start; a thread that never changes is one run of the whole length.
 */
function scanRuns(
  positions: readonly number[],
  value: (position: number) => boolean,
  wrap: boolean,
  emit: (start: number, last: number, length: number, value: boolean) => void,
): void {
  const n = positions.length;
  if (n === 0) return;
  const values = positions.map(value);
  let from = 0;
  if (wrap) {
    // Begin at a change of value so no run is cut in two by the edge of the draft.
    from = values.findIndex((v, i) => v !== values[(i + n - 1) % n]);
    if (from < 0) {
      emit(positions[0], positions[n - 1], n, values[0]);
      return;
    }
  }
  let runStart = from;
  let length = 1;
  for (let k = 1; k <= n; k++) {
    const i = (from + k) % n;
    if (k < n && values[i] === values[runStart]) {
      length++;
      continue;
    }
    emit(positions[runStart], positions[(runStart + length - 1) % n], length, values[runStart]);
    if (k === n) break;
    runStart = i;
    length = 1;
  }
}
