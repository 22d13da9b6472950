import { PassThrough, type Writable } from 'node:stream';
import { CLOTH_VIEW_NAMES } from '../../shared/words';
import PDFDocument from 'pdfkit';
import { hexToRgb, isLayered, pickCount, type Draft } from '../../shared/weave';
import { clothSett, computePlan, planBlocker, type ClothSett, type PlanDocument, type PlanOutputs } from '../../shared/plan';
import { cellOrigin, gridBounds, type DraftShape, type GridPlacement } from '../../shared/print/draft-layout';
import { PAGE_MARGIN, LEGEND_HEAD, LEGEND_ROW, PAGE_OVERLAP, planDraftPages, type PagePart, type PrintView, type ViewCut } from '../../shared/print/draft-pages';
import { printWindow, windowWords, type PrintWindow } from '../../shared/print/print-range';
import { LOOM_LIST_KINDS, pageSize, type LoomListKind, type PrintMeta, type PrintOptions, type Rect } from '../../shared/print/types';
import type { Span } from '../../shared/print/page-split';
import { fontData } from './fonts';
import { drawMask, embedMask, gridPixels, markBits, placeGrid, type PdfPixels } from './pdf-image';
import { BODY_SIZE, GRID_LINE, GRID_RULE, INK, LABEL_SIZE, MUTED, plural, swatch, text, type Doc } from './pdf-style';
import { writeText, type TextItem } from './pdf-text';
import { drawLoomLists, drawPlanPage, estimateLoomListPages, listOrientation, settText } from './plan-pages';
import { cellImage, clothSources, layerTint, orientCells, threadImage, threadPitch, type CellImage, type ClothSources } from './raster';

/**
 * A cloth view (two-tone drawdown, faces, layer map) needing more sheets than this prints its
 * first sheet only: hundreds of sheets repeating what the draft sheets already show help no one
 * and would take most of the printing time. Page 1 says so.
 */
export const MAX_VIEW_SHEETS = 12;

/** The longest stretch a print works without letting the server answer other requests. */
export const PRINT_SLICE_MS = 25;

/**
 * A function to await between steps of a long job: it lets the event loop run once every
 * PRINT_SLICE_MS, so a thousand-page print delays other requests by milliseconds, not seconds.
 * `check` runs at every step and may throw to stop the job.
 */
export function turnTaker(sliceMs = PRINT_SLICE_MS, check: () => void | Promise<void> = () => {}): () => Promise<void> {
  let since = performance.now();
  return async () => {
    await check();
    if (performance.now() - since < sliceMs) return;
    await new Promise<void>((resolve) => setImmediate(resolve));
    since = performance.now();
  };
}

/** Most pages a print may have, most cells its sheets may show, and longest it may take. */
export const PRINT_LIMITS = { pages: 300, cells: 4_000_000, ms: 60_000 };

/** Why a print was stopped part way. */
export class PrintStopped extends Error {
  constructor(readonly reason: 'client gone' | 'too long' | 'too many pages', readonly pages: number) {
    super(`The print stopped after ${pages} pages: ${reason}`);
    this.name = 'PrintStopped';
  }
}

/** What a print will be before it is made: its pages (the lists' estimated; null when not counted) and the cells its sheets show. */
export interface PrintExtent {
  pages: number | null;
  cells: number;
  window: PrintWindow;
}

export interface DraftPdfInput {
  draft: Draft;
  meta: PrintMeta;
  /** The draft's saved plan: its figures fill page 2 and its loom-side lists follow. */
  plan?: PlanDocument;
  /** The plan's outputs when the caller has them already; computed from `plan` otherwise. */
  outputs?: PlanOutputs;
  /**
   * Loom-side lists to print, in this order. Default: all of them with a plan; threading and
   * weaving (from the draft alone) without one.
   */
  lists?: readonly LoomListKind[];
  options: PrintOptions;
}

/**
 * Prints a draft: the draft itself (threading, tie-up, treadling or lift plan, colour orders,
 * drawdown in colour) split across as many pages as legibility needs, the cloth views (two tones,
 * both faces and the layer map of a layered cloth; first sheet only past MAX_VIEW_SHEETS), a
 * colour legend, the plan, then the loom-side lists in working order with boxes to tick. Grid
 * cells are embedded pixels and numbers are written straight into the page, so a 2000 × 2000
 * draft prints in about 1.5 s; the work yields to the event loop every PRINT_SLICE_MS.
 *
 * @example await renderDraftPdf({ draft, meta, options: { paper: 'a4', orientation: 'portrait', threadingAbove: true, treadlingRight: true, shaftsFromBottom: true, endOneRight: true, numberEvery: 4 } })
 */
export async function renderDraftPdf(input: DraftPdfInput): Promise<Buffer> {
  const out = new PassThrough();
  const chunks: Buffer[] = [];
  out.on('data', (c: Buffer) => chunks.push(c));
  const ended = new Promise<void>((resolve, reject) => {
    out.on('end', resolve);
    out.on('error', reject);
  });
  await streamDraftPdf(input, out);
  await ended;
  return Buffer.concat(chunks);
}

/** A PDF document of the print's page size with its fonts, no page yet. */
function printDocument(page: { width: number; height: number }, meta: PrintMeta): Doc {
  const doc = new PDFDocument({
    size: [page.width, page.height],
    margin: PAGE_MARGIN,
    autoFirstPage: false,
    info: { Title: meta.title, Author: meta.author, Creator: 'Shedwright' },
  });
  doc.registerFont('regular', fontData('regular'));
  doc.registerFont('semibold', fontData('semibold'));
  doc.font('regular');
  return doc;
}

const yarnNamesOf = (legend: LegendRow[]) => (colour: number) => legend.find((r) => r.colour === colour)?.yarns ?? 'no yarn named';

/** The views a draft's print shows after the draft sheets. */
function printViews(draft: Draft): PrintView[] {
  return isLayered(draft) ? ['structure', 'front', 'back', 'layers'] : ['structure'];
}

/**
 * Sizes up a print without making it: the cells its sheets show and, when those are no more than
 * `maxCells`, its pages: the draft sheets and cloth views exactly, the plan page, and the loom-side
 * lists from their rows (pages is null past maxCells). No cloth is computed; the lists' rows are
 * measured taking turns with other work.
 * @throws RangeError for a range outside the draft (as the print would).
 */
export async function printExtent(input: DraftPdfInput, maxCells = Infinity): Promise<PrintExtent> {
  const { draft, options } = input;
  const page = pageSize(options.paper, options.orientation);
  const window = printWindow(draft, options.range);
  const cells = (window.ends.end - window.ends.start) * (window.picks.end - window.picks.start);
  if (cells > maxCells) return { pages: null, cells, window };
  const legend = legendRows(draft);
  const layout = planDraftPages({
    page, shape: draftShape(draft), arrangement: options, views: printViews(draft), legendRows: legend.length,
    maxViewSheets: MAX_VIEW_SHEETS, window, fitWidth: options.fitWidth,
  });
  const outputs = planOutputs(input);
  // A document never written, for the font's measures.
  const measure = printDocument(page, input.meta);
  const lists = await estimateLoomListPages(measure, draft, yarnNamesOf(legend), listKinds(input, outputs), listOrientation(draft, input.plan, options.workingOrder), outputs, page, window.picks, turnTaker());
  return { pages: layout.pages.length + 1 + lists, cells, window };
}

const planOutputs = (input: DraftPdfInput) =>
  // An empty draft has nothing to count: its plan page says so instead of showing figures.
  (input.plan && !planBlocker(input.draft) ? (input.outputs ?? computePlan(input.draft, input.plan)) : undefined);
const listKinds = (input: DraftPdfInput, outputs: PlanOutputs | undefined): readonly LoomListKind[] =>
  input.lists ?? (outputs ? LOOM_LIST_KINDS : (['threading', 'weaving'] as const));

/** How a print is watched while it is made: a signal to stop it, its time and page limits. */
export interface PrintControl {
  signal?: AbortSignal;
  /** performance.now() past which the print stops. */
  deadline?: number;
  /** Pages past which the print stops (the estimate of the lists can be short). */
  maxPages?: number;
}

/**
 * As renderDraftPdf, writing the PDF to `out` page by page as it is made (waiting while `out` is
 * full), so memory does not grow with the pages. Ends `out` when done; rejects with PrintStopped
 * (leaving `out` to the caller) when the signal fires or a limit is passed.
 */
export async function streamDraftPdf(input: DraftPdfInput, out: Writable, control: PrintControl = {}): Promise<{ pages: number }> {
  const { draft, meta, options } = input;
  const page = pageSize(options.paper, options.orientation);
  const doc = printDocument(page, meta);
  doc.pipe(out);
  // Numbered as each page opens: keeping every page open until the end to print "of N" costs
  // more memory than a thousand-page draft can spare.
  let pageNumber = 0;
  doc.on('pageAdded', () => {
    pageNumber++;
    const { x, y } = doc;
    text(doc, `${meta.title} · page ${pageNumber}`, PAGE_MARGIN, page.height - PAGE_MARGIN + 10, LABEL_SIZE + 1, MUTED);
    doc.x = x;
    doc.y = y;
  });
  const finished = new Promise<void>((resolve, reject) => {
    out.on('finish', resolve);
    out.on('close', resolve);
    doc.on('error', reject);
  });
  const check = async () => {
    if (control.signal?.aborted) throw new PrintStopped('client gone', pageNumber);
    if (control.deadline !== undefined && performance.now() > control.deadline) throw new PrintStopped('too long', pageNumber);
    if (control.maxPages !== undefined && pageNumber > control.maxPages) throw new PrintStopped('too many pages', pageNumber);
    // A slow reader: wait for it rather than hold the pages in memory.
    if (out.writableNeedDrain) {
      await new Promise<void>((resolve) => {
        const done = () => { out.off('drain', done); out.off('close', done); control.signal?.removeEventListener('abort', done); resolve(); };
        out.on('drain', done);
        out.on('close', done);
        control.signal?.addEventListener('abort', done);
      });
      if (control.signal?.aborted) throw new PrintStopped('client gone', pageNumber);
    }
  };
  const breathe = turnTaker(PRINT_SLICE_MS, check);
  try {
    const shape = draftShape(draft);
    const views = printViews(draft);
    const legend = legendRows(draft);
    const window = printWindow(draft, options.range);
    const layout = planDraftPages({ page, shape, arrangement: options, views, legendRows: legend.length, maxViewSheets: MAX_VIEW_SHEETS, window, fitWidth: options.fitWidth });
    const tiled = layout.pages.flatMap((p) => p.parts).some((p) => p.kind === 'draft' && p.across * p.down > 1);
    // The cloth is computed for the ends and picks the sheets show only: a range of a huge draft costs what the range does.
    const sources = clothSources(windowDraft(draft, window), input.plan);
    const ctx: DrawContext = {
      doc, draft, sett: clothSett(draft, input.plan), options, shape, legend, sources, images: new Map(), ink: new GridInk(doc), tiled, viewCut: layout.viewCut, window,
    };
    for (const [i, p] of layout.pages.entries()) {
      await breathe();
      doc.addPage();
      if (i === 0) drawTitleBlock(ctx, meta);
      else drawRunningHead(ctx, meta.title, p.parts);
      for (const part of p.parts) drawPart(ctx, part);
    }

    const outputs = planOutputs(input);
    const yarnNames = yarnNamesOf(legend);
    await breathe();
    drawPlanPage(doc, draft, yarnNames, input.plan && outputs ? { doc: input.plan, outputs } : undefined);
    await drawLoomLists(doc, draft, yarnNames, listKinds(input, outputs), listOrientation(draft, input.plan, options.workingOrder), outputs, breathe, { ...window.picks, repeat: window.part === 'repeat' });
    await check();
  } catch (err) {
    doc.unpipe(out);
    throw err;
  }
  doc.end();
  await finished;
  return { pages: pageNumber };
}

/** The ends and picks of the window as a draft of their own (blocks dropped: they describe the whole). */
function windowDraft(draft: Draft, w: PrintWindow): Draft {
  if (w.ends.start === 0 && w.picks.start === 0 && w.ends.end === draft.threading.length && w.picks.end === pickCount(draft)) return draft;
  const { blocks: _blocks, ...rest } = draft;
  const ends = <T,>(list: T[]) => list.slice(w.ends.start, w.ends.end);
  const picks = <T,>(list: T[]) => list.slice(w.picks.start, w.picks.end);
  return {
    ...rest,
    threading: ends(draft.threading), warpColors: ends(draft.warpColors), warpLayers: ends(draft.warpLayers),
    treadling: picks(draft.treadling), liftplan: picks(draft.liftplan), weftColors: picks(draft.weftColors), weftLayers: picks(draft.weftLayers),
  };
}

interface LegendRow {
  colour: number;
  hex: string;
  yarns: string;
  ends: number;
  picks: number;
}

interface DrawContext {
  doc: Doc;
  draft: Draft;
  /** The plan's sett when there is a plan, else the draft's: the same figures the plan page prints. */
  sett: ClothSett;
  options: PrintOptions;
  shape: DraftShape;
  legend: LegendRow[];
  /** The cloth of the window's ends and picks only: index it through inWindow. */
  sources: ClothSources;
  /** Cell images made on first use. */
  images: Map<PrintView | 'colour', CellImage>;
  ink: GridInk;
  /** The tie-up is the same on every sheet: stored once. */
  tieup?: PdfPixels;
  /** The draft needs more than one sheet. */
  tiled: boolean;
  viewCut?: ViewCut;
  /** The ends and picks this print shows. */
  window: PrintWindow;
}

function draftShape(draft: Draft): DraftShape {
  const liftPlan = draft.control === 'liftplan';
  return {
    ends: draft.threading.length,
    picks: pickCount(draft),
    shafts: draft.shafts,
    pickColumns: liftPlan ? draft.shafts : draft.treadles,
    liftPlan,
  };
}

/** Palette colours the draft uses, with their yarns and how many ends and picks show them. */
function legendRows(draft: Draft): LegendRow[] {
  const ends = new Map<number, number>();
  const picks = new Map<number, number>();
  for (const c of draft.warpColors) ends.set(c, (ends.get(c) ?? 0) + 1);
  for (const c of draft.weftColors.slice(0, pickCount(draft))) picks.set(c, (picks.get(c) ?? 0) + 1);
  const used = [...new Set([...ends.keys(), ...picks.keys()])].sort((a, b) => a - b);
  return used.map((colour) => ({
    colour,
    hex: draft.palette[colour] ?? '#000000',
    yarns: draft.yarns.filter((y) => y.color === colour).map((y) => y.name).join(', ') || 'no yarn named',
    ends: ends.get(colour) ?? 0,
    picks: picks.get(colour) ?? 0,
  }));
}


function summary(ctx: DrawContext): string {
  const { draft, shape, sett } = ctx;
  const loom = shape.liftPlan ? 'lift plan' : plural(draft.treadles, 'treadle');
  return `${plural(shape.ends, 'end')} × ${plural(shape.picks, 'pick')} · ${plural(draft.shafts, 'shaft')} · ${loom} · ${draft.shed} shed · sett ${settText(sett)}`;
}

function drawTitleBlock(ctx: DrawContext, meta: PrintMeta): void {
  const { doc, viewCut } = ctx;
  text(doc, meta.title, PAGE_MARGIN, PAGE_MARGIN, 16, INK, 'semibold');
  const by = [meta.author && `By ${meta.author}`, meta.studio, meta.date, `version ${meta.version}`].filter(Boolean).join(' · ');
  text(doc, by, PAGE_MARGIN, PAGE_MARGIN + 20, BODY_SIZE, MUTED);
  text(doc, summary(ctx), PAGE_MARGIN, PAGE_MARGIN + 31, BODY_SIZE);
  const notes: string[] = [windowNote(ctx.window, ctx.shape)].filter(Boolean);
  if (ctx.shape.ends + ctx.shape.picks > 0 && ctx.tiled) {
    notes.push(`The draft is split into sheets; dark bars in the margins mark the ${PAGE_OVERLAP} ends or picks each sheet repeats from its neighbour, to line them up.`);
  }
  if (viewCut) notes.push(viewCutNote(viewCut));
  notes.forEach((n, i) => text(doc, n, PAGE_MARGIN, PAGE_MARGIN + 42 + i * 8, LABEL_SIZE + 1, MUTED));
}

/** Says which part of the draft the sheets show, and where the rest is; empty when they show it all. */
export function windowNote(w: PrintWindow, shape: { ends: number; picks: number }): string {
  const what = windowWords(w, shape);
  if (what === 'every end and pick') return '';
  return `The draft sheets and cloth views show ${w.part === 'repeat' ? `one repeat, ${what}` : what}; the threading, sleying and tying-on lists cover the whole warp.`;
}

/** Says which ends and picks the cut views show, and that the draft sheets show them all. */
export function viewCutNote(cut: ViewCut): string {
  return `The cloth views after the draft show ends ${spanText(cut.ends)} and picks ${spanText(cut.picks)} only (the whole cloth would take ${cut.fullSheets} sheets each); the draft sheets show every end and pick.`;
}

function spanText(s: Span): string {
  return s.end - s.start <= 1 ? `${s.start + 1}` : `${s.start + 1}–${s.end}`;
}

function drawRunningHead(ctx: DrawContext, title: string, parts: PagePart[]): void {
  const { doc } = ctx;
  text(doc, title, PAGE_MARGIN, PAGE_MARGIN, 12, INK, 'semibold');
  const tiled = parts.find((p) => p.kind === 'draft' || (p.kind === 'view' && p.across * p.down > 1));
  if (tiled && (tiled.kind === 'draft' || tiled.kind === 'view')) {
    const what = tiled.kind === 'draft' ? 'Draft' : VIEW_CAPTIONS[tiled.view];
    text(doc, `${what}: sheet ${tiled.tile.index + 1} of ${tiled.across * tiled.down} · ends ${spanText(tiled.tile.cols)} · picks ${spanText(tiled.tile.rows)}`, PAGE_MARGIN, PAGE_MARGIN + 17, BODY_SIZE, MUTED);
  }
}

const VIEW_CAPTIONS: Record<PrintView, string> = {
  structure: `${CLOTH_VIEW_NAMES.structure}: drawdown in two tones (black: end up)`,
  front: `${CLOTH_VIEW_NAMES.front}: the front face`,
  back: `${CLOTH_VIEW_NAMES.back}: the back face, as seen turned over`,
  layers: `${CLOTH_VIEW_NAMES.layers} (the number in each area is the layer on top at the front)`,
};

/** A span of the draft's ends or picks as a span of the window's cloth (ctx.sources), which starts at the window. */
function inWindow(ctx: DrawContext, span: Span, side: 'ends' | 'picks'): Span {
  const start = ctx.window[side].start;
  return { start: span.start - start, end: span.end - start };
}

function image(ctx: DrawContext, view: PrintView | 'colour'): CellImage {
  let img = ctx.images.get(view);
  if (!img) {
    img = cellImage(ctx.sources, view);
    ctx.images.set(view, img);
  }
  return img;
}

function drawPart(ctx: DrawContext, part: PagePart): void {
  if (part.kind === 'draft') drawDraftTile(ctx, part);
  else if (part.kind === 'view') drawViewTile(ctx, part);
  else drawLegend(ctx, part);
}

/** The cells [cols] × [rows] of a cloth picture, one pixel per cell, over the grid. */
function placeImage(doc: Doc, img: CellImage, g: GridPlacement, cols: Span, rows: Span): void {
  placeGrid(doc, g, orientCells(img, cols, rows, g.stepX < 0, g.stepY < 0));
}

const mod = (a: number, m: number) => ((a % m) + m) % m;

/**
 * Grid lines drawn as tiling patterns: one filled rectangle per grid instead of a path per line,
 * which keeps a thousand-page print small and quick. A pattern is anchored to the page, so there
 * is one per spacing and phase; most sheets of a big draft share them.
 */
class GridInk {
  private readonly patterns = new Map<string, PDFKit.PDFTilingPattern>();
  constructor(private readonly doc: Doc) {}

  /** Lines every `step` points through (x, y), across the rectangle `r`. */
  private lines(r: Rect, step: number, x: number, y: number, width: number, colour: string): void {
    const { doc } = this;
    // Each tile holds one line a hair inside its left and top edges, so a line is never cut
    // in half where tiles meet (some renderers also mishandle a box that does not start at 0).
    const h = 1;
    const px = mod(x - h, step);
    const py = mod(y - h, step);
    const key = `${step.toFixed(4)} ${px.toFixed(3)} ${py.toFixed(3)} ${width}`;
    let pattern = this.patterns.get(key);
    if (!pattern) {
      pattern = doc.pattern([0, 0, step, step], step, step, `${width} w ${h} 0 m ${h} ${step} l S 0 ${h} m ${step} ${h} l S`);
      this.patterns.set(key, pattern);
    }
    // The pattern takes its anchor from the transformation in force when it is first used.
    doc.save().translate(px, py);
    doc.rect(r.x - px, r.y - py, r.width, r.height).fill([pattern, colour]);
    doc.restore();
  }

  /** Thin lines round every cell, and a darker rule every `every` cells counted from the grid's first cell. */
  grid(g: GridPlacement, colStart = 0, rowStart = 0, every = 0): void {
    if (g.cols === 0 || g.rows === 0) return;
    const b = gridBounds(g);
    const edge = 0.3;
    const outer = { x: b.x - edge, y: b.y - edge, width: b.width + 2 * edge, height: b.height + 2 * edge };
    this.lines(outer, g.cell, b.x, b.y, 0.25, GRID_LINE);
    if (!every) return;
    // A rule follows every `every`-th cell counted from the grid's origin side.
    const colsToRule = every - mod(colStart, every);
    const rowsToRule = every - mod(rowStart, every);
    const rx = g.stepX > 0 ? b.x + colsToRule * g.cell : b.x + b.width - colsToRule * g.cell;
    const ry = g.stepY > 0 ? b.y + rowsToRule * g.cell : b.y + b.height - rowsToRule * g.cell;
    const inner = { x: b.x + edge, y: b.y + edge, width: b.width - 2 * edge, height: b.height - 2 * edge };
    this.lines(inner, every * g.cell, rx, ry, 0.6, GRID_RULE);
  }
}

/** Pixels per cell side for marks, and the clear border of each: a mark fills the middle 4/6 of its cell. */
const MARK_SCALE = 6;
const MARK_INSET = 1;

/** Filled marks where `marked` says, inset so the grid stays visible. */
function marks(doc: Doc, g: GridPlacement, marked: (col: number, row: number) => boolean): void {
  if (g.cols === 0 || g.rows === 0) return;
  drawMask(doc, embedMask(doc, markBits(g, MARK_SCALE, MARK_INSET, marked)), gridBounds(g), INK);
}

/** Cells of a one-row or one-column grid filled with palette colours. */
function colourStrip(doc: Doc, draft: Draft, g: GridPlacement, colours: number[], across: boolean): void {
  placeGrid(doc, g, gridPixels(g, draft.palette, (c, r) => colours[across ? c : r]));
}

/** Shades the cells a sheet shares with its neighbours, in the number band beside them. */
function overlapMarks(doc: Doc, g: GridPlacement, cols: Span, rows: Span, window: { ends: Span; picks: Span }, band: { endY: number; pickX: number; pickWidth: number }): void {
  const shades: Rect[] = [];
  const endsShared: number[] = [];
  if (cols.start > window.ends.start) for (let i = 0; i < PAGE_OVERLAP; i++) endsShared.push(i);
  if (cols.end < window.ends.end) for (let i = 1; i <= PAGE_OVERLAP; i++) endsShared.push(cols.end - cols.start - i);
  for (const i of endsShared) shades.push({ x: cellOrigin(g, i, 0).x, y: band.endY, width: g.cell, height: 3 });
  const picksShared: number[] = [];
  if (rows.start > window.picks.start) for (let i = 0; i < PAGE_OVERLAP; i++) picksShared.push(i);
  if (rows.end < window.picks.end) for (let i = 1; i <= PAGE_OVERLAP; i++) picksShared.push(rows.end - rows.start - i);
  for (const i of picksShared) shades.push({ x: band.pickX + band.pickWidth - 3, y: cellOrigin(g, 0, i).y, width: 3, height: g.cell });
  if (!shades.length) return;
  for (const r of shades) doc.rect(r.x, r.y, r.width, r.height);
  doc.fillColor(GRID_RULE).fill();
}

/** Top of a label line whose middle is at cy. */
const labelTop = (cy: number) => cy - LABEL_SIZE * 0.62;

/** Every `every`-th end number over the grid, and the sheet's first end. */
function endNumbers(g: GridPlacement, cols: Span, bandY: number, every: number): TextItem[] {
  const items: TextItem[] = [];
  for (let e = cols.start; e < cols.end; e++) {
    if ((e + 1) % every !== 0 && e !== cols.start) continue;
    const o = cellOrigin(g, e - cols.start, 0);
    items.push({ s: String(e + 1), x: o.x + g.cell / 2, y: labelTop(bandY + 6), centred: true });
  }
  return items;
}

/** Every `every`-th pick number beside the grid, and the sheet's first pick. */
function pickNumbers(g: GridPlacement, rows: Span, x: number, every: number): TextItem[] {
  const items: TextItem[] = [];
  for (let p = rows.start; p < rows.end; p++) {
    if ((p + 1) % every !== 0 && p !== rows.start) continue;
    const o = cellOrigin(g, 0, p - rows.start);
    items.push({ s: String(p + 1), x: x + 3, y: labelTop(o.y + g.cell / 2) });
  }
  return items;
}

function drawDraftTile(ctx: DrawContext, part: Extract<PagePart, { kind: 'draft' }>): void {
  const { doc, draft, options, shape } = ctx;
  const { tile, layout: l } = part;
  const every = options.numberEvery;

  placeImage(doc, image(ctx, 'colour'), l.drawdown, inWindow(ctx, tile.cols, 'ends'), inWindow(ctx, tile.rows, 'picks'));
  colourStrip(doc, draft, l.warpColours, draft.warpColors.slice(tile.cols.start, tile.cols.end), true);
  colourStrip(doc, draft, l.weftColours, draft.weftColors.slice(tile.rows.start, tile.rows.end), false);
  const { cols, rows } = tile;
  marks(doc, l.threading, (c, s) => draft.threading[cols.start + c].includes(s + 1));
  const lists = shape.liftPlan ? draft.liftplan : draft.treadling;
  marks(doc, l.treadling, (t, p) => (lists[rows.start + p] ?? []).includes(t + 1));
  const tieupGrid = l.tieup;
  if (tieupGrid && tieupGrid.cols > 0 && tieupGrid.rows > 0) {
    ctx.tieup ??= embedMask(doc, markBits(tieupGrid, MARK_SCALE, MARK_INSET, (t, s) => (draft.tieup[t] ?? []).includes(s + 1)));
    drawMask(doc, ctx.tieup, gridBounds(tieupGrid), INK);
  }

  const { ink } = ctx;
  ink.grid(l.drawdown, tile.cols.start, tile.rows.start, every);
  ink.grid(l.threading, tile.cols.start, 0, every);
  ink.grid(l.treadling, 0, tile.rows.start, every);
  if (l.tieup) ink.grid(l.tieup);
  ink.grid(l.warpColours);
  ink.grid(l.weftColours);

  writeText(doc, [...endNumbers(l.threading, tile.cols, l.endLabels.y, every), ...pickNumbers(l.treadling, tile.rows, l.pickLabels.x, every)], LABEL_SIZE, INK);
  // Shaft numbers beside the threading; treadle (or shaft) numbers over the tie-up corner.
  const loom: TextItem[] = [];
  for (let s = 0; s < shape.shafts; s++) {
    loom.push({ s: String(s + 1), x: l.pickLabels.x + 3, y: labelTop(cellOrigin(l.threading, 0, s).y + l.cell / 2) });
  }
  for (let t = 0; t < shape.pickColumns; t++) {
    loom.push({ s: String(t + 1), x: cellOrigin(l.treadling, t, 0).x + l.cell / 2, y: labelTop(l.endLabels.y + 6), centred: true });
  }
  writeText(doc, loom, LABEL_SIZE, MUTED);
  overlapMarks(doc, l.drawdown, tile.cols, tile.rows, ctx.window, {
    endY: l.endLabels.y + l.endLabels.height - 3,
    pickX: l.pickLabels.x,
    pickWidth: l.pickLabels.width,
  });
}

function drawViewTile(ctx: DrawContext, part: Extract<PagePart, { kind: 'view' }>): void {
  const { doc, options } = ctx;
  const { tile, layout: l, view } = part;
  const cut = ctx.viewCut ? ` (ends ${spanText(tile.cols)}, picks ${spanText(tile.rows)} only)` : '';
  const sheet = part.across * part.down > 1 ? ` (sheet ${tile.index + 1} of ${part.across * part.down})` : cut;
  text(doc, VIEW_CAPTIONS[view] + sheet, l.caption.x, l.caption.y + 2, BODY_SIZE - 1, INK, 'semibold');
  if (view === 'front' || view === 'back') {
    // Both faces thread by thread; the cells' grid would hide the threads, so only the numbers frame them.
    placeGrid(doc, l.grid, facePixels(ctx.sources, view, l.grid, inWindow(ctx, tile.cols, 'ends'), inWindow(ctx, tile.rows, 'picks')));
  } else {
    placeImage(doc, image(ctx, view), l.grid, inWindow(ctx, tile.cols, 'ends'), inWindow(ctx, tile.rows, 'picks'));
    ctx.ink.grid(l.grid, tile.cols.start, tile.rows.start, options.numberEvery);
  }
  // Smaller view cells number fewer ends, so the numbers never run into each other.
  let every: number = options.numberEvery;
  while (every * l.grid.cell < VIEW_NUMBER_ROOM) every += options.numberEvery;
  writeText(doc, [...endNumbers(l.grid, tile.cols, l.endLabels.y, every), ...pickNumbers(l.grid, tile.rows, l.pickLabels.x, every)], LABEL_SIZE, INK);
  overlapMarks(doc, l.grid, tile.cols, tile.rows, ctx.window, {
    endY: l.endLabels.y + l.endLabels.height - 3,
    pickX: l.pickLabels.x,
    pickWidth: l.pickLabels.width,
  });
  if (view === 'layers') layerNumbers(ctx, l.grid, inWindow(ctx, tile.cols, 'ends'), inWindow(ctx, tile.rows, 'picks'));
}

/** Points between two numbers along a view's edge: room for four digits at the label size. */
const VIEW_NUMBER_ROOM = 16;

/** Pixels of cloth per point of a cell side on the page: about 150 per inch, at least 2 a cell. */
const FACE_PIXELS_PER_POINT = 150 / 72;

/**
 * The ends [cols] and picks [rows] of a face drawn thread by thread, laid out as the grid lies on
 * the page (column = end as in the other views; the page's own layout mirrors the back).
 */
function facePixels(src: ClothSources, face: 'front' | 'back', g: GridPlacement, cols: Span, rows: Span): CellImage {
  const perEnd = Math.max(2, Math.min(16, Math.round(g.cell * FACE_PIXELS_PER_POINT)));
  const pitch = threadPitch(src, perEnd);
  const x = Math.round(cols.start * pitch.x);
  const y = Math.round(rows.start * pitch.y);
  const window = { x, y, width: Math.max(1, Math.round(cols.end * pitch.x) - x), height: Math.max(1, Math.round(rows.end * pitch.y) - y) };
  // End for end like the cell views: the back drawn with the front's end 1 on the right is unmirrored.
  const img = threadImage(src, face, perEnd, { endOneRight: face === 'back', window });
  return orientCells(img, { start: 0, end: img.width }, { start: 0, end: img.height }, g.stepX < 0, g.stepY < 0);
}

/** The layer on top written in each area of the layer map, so the map never relies on colour alone. */
function layerNumbers(ctx: DrawContext, g: GridPlacement, cols: Span, rows: Span): void {
  const regions = ctx.sources.layers?.regions ?? [];
  ctx.doc.font('semibold').fontSize(Math.min(8, Math.max(6, g.cell * 1.2)));
  for (const r of regions) {
    const e0 = Math.max(r.firstEnd, cols.start);
    const e1 = Math.min(r.lastEnd, cols.end - 1);
    const p0 = Math.max(r.firstPick, rows.start);
    const p1 = Math.min(r.lastPick, rows.end - 1);
    // Too small an area to hold a number without covering its neighbours.
    if (e1 - e0 < 1 || p1 - p0 < 1) continue;
    const a = cellOrigin(g, e0 - cols.start, p0 - rows.start);
    const b = cellOrigin(g, e1 - cols.start, p1 - rows.start);
    const cx = (a.x + b.x) / 2 + g.cell / 2;
    const cy = (a.y + b.y) / 2 + g.cell / 2;
    const label = String(r.top);
    const [red, green, blue] = hexToRgb(layerTint(r.top));
    // Dark on light tints, white on dark ones (relative luminance, WCAG 2.2 definition, simplified to sRGB weights).
    const light = 0.2126 * red + 0.7152 * green + 0.0722 * blue > 140;
    ctx.doc.fillColor(light ? INK : '#ffffff').text(label, cx - ctx.doc.widthOfString(label) / 2, cy - 4, { lineBreak: false });
  }
}

function drawLegend(ctx: DrawContext, part: Extract<PagePart, { kind: 'legend' }>): void {
  const { doc } = ctx;
  const { box } = part;
  text(doc, part.first === 0 ? 'Colours and yarns' : 'Colours and yarns (continued)', box.x, box.y + 2, BODY_SIZE, INK, 'semibold');
  const cols = [box.x, box.x + 22, box.x + 72, box.x + box.width - 110, box.x + box.width - 50];
  for (let i = 0; i < part.count; i++) {
    const row = ctx.legend[part.first + i];
    const y = box.y + LEGEND_HEAD + i * LEGEND_ROW;
    swatch(doc, row.hex, cols[0], y);
    text(doc, row.hex, cols[1], y + 1, BODY_SIZE - 1, MUTED);
    text(doc, row.yarns, cols[2], y + 1, BODY_SIZE - 1);
    text(doc, plural(row.ends, 'end'), cols[3], y + 1, BODY_SIZE - 1);
    text(doc, plural(row.picks, 'pick'), cols[4], y + 1, BODY_SIZE - 1);
  }
}

