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
