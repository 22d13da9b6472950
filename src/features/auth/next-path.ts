/**
 * Where to go after signing in. Only a path inside this site is accepted: `//evil.example`,
 * `/\evil.example` and absolute URLs would send a fresh session to someone else's page.
 */
export function safeNextPath(raw: string | null | undefined, fallback = '/drafts'): string {
  if (!raw || !raw.startsWith('/')) return fallback;
  if (raw.startsWith('//')) return fallback;
  // Browsers read `\` as `/` and drop tabs and newlines, which would turn `/\evil` or `/\t/evil` into `//evil`.
  // eslint-disable-next-line no-control-regex -- control characters are exactly what this refuses
  if (/[\u0000-\u001f\u007f\\]/.test(raw)) return fallback;
  if (raw === '/sign-in' || raw.startsWith('/sign-in?')) return fallback;
  return raw;
}

/** The sign-in address that brings the person back to `path` afterwards. */
export function signInPathFor(path: string): string {
  const next = safeNextPath(path, '');
  return next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in';
}
