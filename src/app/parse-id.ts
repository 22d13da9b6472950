/** A positive whole-number id from a route param, or null for anything else (`12abc`, `-1`, `1e3`). */
export function parseId(raw: string | undefined): number | null {
  if (!raw || !/^[1-9]\d{0,15}$/.test(raw)) return null;
  const id = Number(raw);
  return Number.isSafeInteger(id) ? id : null;
}
