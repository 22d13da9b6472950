/**
 * The 1-based layer of each of `count` threads from a layer list: empty means every thread is in
 * layer 1, and a shorter list repeats (so [1, 2] alternates layers across the whole warp or weft).
 */
export function resolveLayers(list: readonly number[], count: number): Uint8Array {
  const out = new Uint8Array(count);
  if (list.length === 0) return out.fill(1);
  for (let i = 0; i < count; i++) out[i] = list[i % list.length];
  return out;
}

/** Layers alternating through `pattern` (1, 2 by default) over threads from..to; the rest keep theirs. */
export function alternateLayers(list: readonly number[], count: number, from: number, to: number, pattern: readonly number[] = [1, 2]): number[] {
  const out = Array.from(resolveLayers(list, count));
  for (let i = Math.max(0, from); i <= Math.min(to, count - 1); i++) out[i] = pattern[(i - from) % pattern.length];
  return out;
}

/** Every thread of colour `colour` (a palette index) in `layer`: "every end of this colour is layer 2". */
export function layersByColour(list: readonly number[], colours: readonly number[], colour: number, layer: number): number[] {
  const out = Array.from(resolveLayers(list, colours.length));
  colours.forEach((c, i) => {
    if (c === colour) out[i] = layer;
  });
  return out;
}

/** Every end threaded on a shaft from `low` to `high` in `layer`: "ends on shafts 1–4 are layer 1". */
export function layersByShaft(list: readonly number[], threading: readonly (readonly number[])[], low: number, high: number, layer: number): number[] {
  const out = Array.from(resolveLayers(list, threading.length));
  threading.forEach((shafts, i) => {
    if (shafts.some((s) => s >= low && s <= high)) out[i] = layer;
  });
  return out;
}
