/**
 * A lone UTF-16 surrogate is half of a character: JSON and JavaScript strings can carry one, but it
 * is not text in any encoding, so MariaDB's JSON columns (and any file it would be written to) refuse
 * it. In a `u` regular expression a well-formed pair is one code point, so only a lone half matches.
 */
const LONE_SURROGATE = /\p{Surrogate}/u;

/** What a weaver is told about such a string. */
export const BROKEN_TEXT_MESSAGE = 'contains a broken character (half of a UTF-16 pair); retype it';

/** True when `text` holds half of a UTF-16 surrogate pair without its other half. */
export function hasLoneSurrogate(text: string): boolean {
  return LONE_SURROGATE.test(text);
}

/**
 * The path to the first string (or object key) with a lone surrogate in a parsed JSON-like value,
 * or null when every string is well formed.
 *
 * @example brokenTextPath({ tags: ['ok', '\uD800'] }) // ['tags', 1]
 */
export function brokenTextPath(value: unknown, path: (string | number)[] = []): (string | number)[] | null {
  if (typeof value === 'string') return hasLoneSurrogate(value) ? path : null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = brokenTextPath(value[i], [...path, i]);
      if (found) return found;
    }
    return null;
  }
  if (value !== null && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) {
      if (hasLoneSurrogate(key)) return [...path, key];
      const found = brokenTextPath(item, [...path, key]);
      if (found) return found;
    }
  }
  return null;
}
