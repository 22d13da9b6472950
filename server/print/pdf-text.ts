/**
 * One-line text written straight into the page's content stream. pdfkit's `doc.text` lays out,
 * measures and wraps every call (tens of microseconds each); a big draft prints tens of
 * thousands of numbers, so each distinct string is encoded once per font and reused.
 * The glyphs still go through pdfkit's embedded font, so the subset, widths and ToUnicode map
 * (copying and searching the text) stay pdfkit's.
 */
type Doc = PDFKit.PDFDocument;

/** The parts of pdfkit's current font object this module uses (pdfkit 0.20 `EmbeddedFont`). */
interface PdfkitFont {
  id: string;
  ascender: number;
  ref(): PDFKit.PDFKitReference;
  encode(text: string): [string[], { xAdvance: number; advanceWidth: number; xOffset: number; yOffset: number }[]];
}

interface Encoded {
  /** The TJ operand, with pdfkit's kerning adjustments. */
  tj: string;
  /** Advance in thousandths of the font size. */
  advance: number;
  /** The glyph ids in hex when the string needs no kerning, so it can be joined to others. */
  glyphs?: string;
}

/** A string at (x, y), y being the top of the line as with `doc.text`; `centred` centres it on x. */
export interface TextItem {
  s: string;
  x: number;
  y: number;
  centred?: boolean;
}

/** pdfkit writes numbers with at most this many decimals; so do we (`number` in pdfkit's object.js). */
const fixed = (n: number) => String(Math.round(n * 100) / 100);

function currentFont(doc: Doc, name: string): PdfkitFont {
  doc.font(name);
  // pdfkit keeps the selected font in a private field; the interface above lists what is used.
  return (doc as unknown as { _font: PdfkitFont })._font;
}

const cache = new WeakMap<PdfkitFont, Map<string, Encoded | null>>();

/** The string's glyphs as a TJ operand, or null when the font positions a glyph off the line (left to pdfkit). */
function encode(font: PdfkitFont, s: string): Encoded | null {
  let byText = cache.get(font);
  if (!byText) {
    byText = new Map();
    cache.set(font, byText);
  }
  let hit = byText.get(s);
  if (hit !== undefined) return hit;
  hit = s.length > 1 && /^[0-9]+$/.test(s) ? digits(font, s) : shaped(font, s);
  byText.set(s, hit);
  return hit;
}

/**
 * A number from its digits' glyphs: shaping each of thousands of distinct numbers costs more
 * than the rest of a big print. IBM Plex Sans has tabular figures with no kerning or
 * substitutions between digits (checked by `tests/server/print/pdf-text.test.ts`).
 */
function digits(font: PdfkitFont, s: string): Encoded | null {
  let run = '';
  let advance = 0;
  for (const ch of s) {
    const d = encode(font, ch);
    if (d?.glyphs === undefined) return shaped(font, s);
    run += d.glyphs;
    advance += d.advance;
  }
  return { tj: `[<${run}>] TJ`, advance, glyphs: run };
}

/** The string laid out by pdfkit's font (kerning, ligatures), or null when a glyph sits off the line. */
function shaped(font: PdfkitFont, s: string): Encoded | null {
  const [glyphs, positions] = font.encode(s);
  let advance = 0;
  const parts: string[] = [];
  let run = '';
  for (let i = 0; i < glyphs.length; i++) {
    const p = positions[i];
    if (p.xOffset || p.yOffset) return null;
    run += glyphs[i];
    advance += p.xAdvance;
    const kern = p.xAdvance - p.advanceWidth;
    if (kern !== 0) {
      parts.push(`<${run}> ${fixed(-kern)}`);
      run = '';
    }
  }
  if (parts.length === 0) return { tj: `[<${run}>] TJ`, advance, glyphs: run };
  if (run) parts.push(`<${run}>`);
  return { tj: `[${parts.join(' ')}] TJ`, advance };
}

/** Width of a one-line string in points. */
export function textWidth(doc: Doc, s: string, size: number, fontName = 'regular'): number {
  const font = currentFont(doc, fontName);
  const e = encode(font, s);
  return e ? (e.advance * size) / 1000 : doc.fontSize(size).widthOfString(s);
}

/** Writes the items in one text object, all in the same font, size and colour. */
export function writeText(doc: Doc, items: Iterable<TextItem>, size: number, colour: string, fontName = 'regular'): void {
  const font = currentFont(doc, fontName);
  doc.fontSize(size).fillColor(colour);
  const h = doc.page.height;
  const lines: string[] = [];
  const fallbacks: TextItem[] = [];
  const dy = (font.ascender / 1000) * size;
  for (const it of items) {
    if (!it.s) continue;
    const e = encode(font, it.s);
    if (!e) {
      fallbacks.push(it);
      continue;
    }
    const x = it.centred ? it.x - (e.advance * size) / 2000 : it.x;
    lines.push(`1 0 0 1 ${fixed(x)} ${fixed(h - it.y - dy)} Tm ${e.tj}`);
  }
  if (lines.length) {
    doc.page.fonts[font.id] ??= font.ref();
    // pdfkit's pages are flipped (y down); text needs y up, as in pdfkit's own text calls.
    doc.addContent(`q 1 0 0 -1 0 ${fixed(h)} cm BT /${font.id} ${fixed(size)} Tf\n${lines.join('\n')}\nET Q`);
  }
  for (const it of fallbacks) {
    const w = it.centred ? doc.widthOfString(it.s) : 0;
    doc.text(it.s, it.x - w / 2, it.y, { lineBreak: false });
  }
}
