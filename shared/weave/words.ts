/** "1 end", "3 ends": a count with its noun. */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** "1, 3, 5 … 199" from 0-based positions: every number up to five, else the first three and the last. */
export function numberList(indices: readonly number[]): string {
  const n = indices.map((i) => i + 1);
  return n.length <= 5 ? n.join(', ') : `${n.slice(0, 3).join(', ')} … ${n[n.length - 1]}`;
}
