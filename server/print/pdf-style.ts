import { formatNumber } from '../../shared/words';
import { writeText } from './pdf-text';

/** Inks, sizes and the one-line text call the print pages share. */
export const INK = '#1d1d22';
export const MUTED = '#5b5b66';
export const GRID_LINE = '#a4a4ae';
export const GRID_RULE = '#4a4a55';
export const LABEL_SIZE = 6;
export const BODY_SIZE = 9;
export const ROW_HEIGHT = 14;

export type Doc = PDFKit.PDFDocument;
export type FontStyle = 'regular' | 'semibold';

/** One line of text with its top-left corner at (x, y). */
export function text(doc: Doc, s: string, x: number, y: number, size: number, colour = INK, font: FontStyle = 'regular'): void {
  writeText(doc, [{ s, x, y }], size, colour, font);
}

/** A colour swatch with a fine border, so pale colours still show on white paper. */
export function swatch(doc: Doc, hex: string, x: number, y: number): void {
  doc.rect(x, y, 16, 10).fillColor(hex).fill();
  doc.rect(x, y, 16, 10).lineWidth(0.4).strokeColor(GRID_RULE).stroke();
}

/** "1 end", "2,000 ends". */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${formatNumber(n)} ${n === 1 ? one : many}`;
}
