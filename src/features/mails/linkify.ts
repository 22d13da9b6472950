export type TextPart = { kind: 'text'; text: string } | { kind: 'link'; text: string };

// http(s) URLs up to whitespace or an angle bracket; trailing sentence punctuation is not part of the link.
const URL_PATTERN = /https?:\/\/[^\s<>"]+/g;
const TRAILING = /[.,;:!?)\]'"]+$/;

/**
 * Splits plain mail text into text and http(s) links, so a mail's links can be made clickable
 * without ever rendering the mail's own HTML. Joining the parts' text gives back the input.
 */
export function linkify(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const url = match[0].replace(TRAILING, '');
    const start = match.index;
    if (url.length <= 'https://'.length) continue;
    if (start > last) parts.push({ kind: 'text', text: text.slice(last, start) });
    parts.push({ kind: 'link', text: url });
    last = start + url.length;
  }
  if (last < text.length) parts.push({ kind: 'text', text: text.slice(last) });
  return parts;
}
