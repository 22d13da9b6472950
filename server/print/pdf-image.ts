import zlib from 'node:zlib';
import { gridBounds, type GridPlacement } from '../../shared/print/draft-layout';
import type { Rect } from '../../shared/print/types';
import { fromIndices, orientCells, type CellImage } from './raster';

type Doc = PDFKit.PDFDocument;

/** An image stored once in the PDF and drawn on any number of pages. */
export interface PdfPixels {
  label: string;
  ref: PDFKit.PDFKitReference;
}

const counters = new WeakMap<Doc, number>();

/** Writes an image XObject with its pixels deflated at the fastest level (flat colour areas compress well even so). */
function store(doc: Doc, dict: Record<string, unknown>, data: Uint8Array): PdfPixels {
  const n = (counters.get(doc) ?? 0) + 1;
  counters.set(doc, n);
  const ref = doc.ref({ Type: 'XObject', Subtype: 'Image', ...dict, Interpolate: false, Filter: 'FlateDecode' });
  ref.end(zlib.deflateSync(data, { level: 1 }));
  return { label: `Cells${n}`, ref };
}

/**
 * Stores RGB pixels as an image XObject. /Interpolate false asks viewers and printers not to
 * smooth the pixels when they scale them up, so each cell keeps sharp edges (PDF 1.7,
 * ISO 32000-1 §8.9.5.1, Table 89). The pixels go in raw: a PNG would only be taken apart again
 * by pdfkit.
 */
export function embedPixels(doc: Doc, img: CellImage): PdfPixels {
  return store(doc, { Width: img.width, Height: img.height, BitsPerComponent: 8, ColorSpace: 'DeviceRGB' }, img.rgb);
}

/** Draws a stored image stretched over `r` (top-left origin, as pdfkit's page coordinates). */
export function drawPixels(doc: Doc, px: PdfPixels, r: Rect): void {
  doc.page.xobjects[px.label] ??= px.ref;
  const f = (v: number) => String(Math.round(v * 1e4) / 1e4);
  doc.addContent(`q ${f(r.width)} 0 0 ${f(-r.height)} ${f(r.x)} ${f(r.y + r.height)} cm /${px.label} Do Q`);
}

/** Stores and draws in one step, for an image used once. */
export function placePixels(doc: Doc, img: CellImage, r: Rect): void {
  drawPixels(doc, embedPixels(doc, img), r);
}

/** A one-bit picture: set bits are painted in the fill colour, the rest left clear. */
export interface BitImage {
  width: number;
  height: number;
  /** Rows top to bottom, each padded to a whole byte, most significant bit first. */
  bits: Uint8Array;
}

/**
 * Stores a one-bit picture as a stencil mask (ImageMask, PDF 1.7 ISO 32000-1 §8.9.6.2): one bit
 * per pixel, painted in whatever fill colour is current where it is drawn. Decode [1 0] paints
 * the set bits.
 */
export function embedMask(doc: Doc, img: BitImage): PdfPixels {
  return store(doc, { Width: img.width, Height: img.height, ImageMask: true, Decode: [1, 0] }, img.bits);
}

/**
 * Marks in a grid as they lie on the page, `scale` pixels a cell side, each mark leaving `inset`
 * pixels clear round it so the grid lines stay visible. `marked` takes (col, row) in the grid's
 * own order; the placement's negative steps flip the picture.
 */
export function markBits(g: GridPlacement, scale: number, inset: number, marked: (col: number, row: number) => boolean): BitImage {
  const width = g.cols * scale;
  const height = g.rows * scale;
  const rowBytes = Math.ceil(width / 8);
  const bits = new Uint8Array(rowBytes * height);
  for (let r = 0; r < g.rows; r++) {
    const row = g.stepY > 0 ? r : g.rows - 1 - r;
    const first = (r * scale + inset) * rowBytes;
    for (let c = 0; c < g.cols; c++) {
      if (!marked(g.stepX > 0 ? c : g.cols - 1 - c, row)) continue;
      for (let x = c * scale + inset; x < (c + 1) * scale - inset; x++) bits[first + (x >> 3)] |= 0x80 >> (x & 7);
    }
    // The other rows of the mark are the same.
    for (let k = inset + 1; k < scale - inset; k++) bits.copyWithin(first + (k - inset) * rowBytes, first, first + rowBytes);
  }
  return { width, height, bits };
}

/** Draws a stored stencil mask over `r` in the given colour. */
export function drawMask(doc: Doc, mask: PdfPixels, r: Rect, colour: string): void {
  doc.fillColor(colour);
  drawPixels(doc, mask, r);
}

/** Cells of a grid filled with palette colours, one pixel a cell, laid out as the grid lies on the page. */
export function gridPixels(g: GridPlacement, palette: readonly string[], indexAt: (col: number, row: number) => number): CellImage {
  const cells = fromIndices(g.cols, g.rows, palette, indexAt);
  return orientCells(cells, { start: 0, end: g.cols }, { start: 0, end: g.rows }, g.stepX < 0, g.stepY < 0);
}

/** Stores a grid's pixels and draws them over the grid. */
export function placeGrid(doc: Doc, g: GridPlacement, img: CellImage): void {
  if (g.cols === 0 || g.rows === 0) return;
  placePixels(doc, img, gridBounds(g));
}
