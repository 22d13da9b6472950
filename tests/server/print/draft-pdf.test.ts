import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { expandProfile, hexToRgb, type Draft } from '../../../shared/weave';
import { defaultPlan } from '../../../shared/plan';
import { cellCentre } from '../../../shared/print/draft-layout';
import { planDraftPages } from '../../../shared/print/draft-pages';
import { pageSize, type PrintOptions } from '../../../shared/print/types';
import { PassThrough } from 'node:stream';
import { PrintStopped, renderDraftPdf, streamDraftPdf } from '../../../server/print/draft-pdf';
import { doubleWeaveProfile } from '../../helpers/draft-fixtures';
import { bigPointTwill, checkerboard, HARBOUR, MUSTARD } from '../../helpers/print-fixtures';
import { renderPdfPage, type Raster } from '../../helpers/pdf-raster';
import { doubleWeaveTableMat } from '../../../server/db/seeders/demo-drafts';

const work = mkdtempSync(join(tmpdir(), 'shedwright-print-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const meta = { title: 'Checkerboard sampler', author: 'Wren Example', studio: 'Invented Studio', date: '2 March 2025', version: 7 };
const options: PrintOptions = { paper: 'a4', orientation: 'portrait', threadingAbove: true, treadlingRight: true, shaftsFromBottom: true, endOneRight: true, numberEvery: 4, range: { part: 'whole' } };

async function readBack(pdf: Buffer): Promise<{ total: number; pages: string[]; text: string }> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    const t = await parser.getText();
    return { total: t.total, pages: t.pages.map((p) => p.text), text: t.text };
  } finally {
    await parser.destroy();
  }
}

/** A page rendered by poppler's pdftoppm. */
function renderPage(pdf: Buffer, page: number, dpi: number): Raster {
  return renderPdfPage(pdf, page, dpi, work);
}

function expectColour(actual: number[], hex: string): void {
  const want = hexToRgb(hex);
  for (let k = 0; k < 3; k++) expect(Math.abs(actual[k] - want[k])).toBeLessThanOrEqual(4);
}

function planFor(draft: Draft, opts: PrintOptions, views: ('structure' | 'front' | 'back' | 'layers')[] = ['structure'], legendRows = 2) {
  return planDraftPages({
    page: pageSize(opts.paper, opts.orientation),
    shape: { ends: draft.threading.length, picks: draft.treadling.length, shafts: draft.shafts, pickColumns: draft.treadles, liftPlan: false },
    arrangement: opts,
    views,
    legendRows,
  });
}

describe('renderDraftPdf', () => {
  it('prints the title, the counts, the yarn table, then the plan and the lists', async () => {
    const draft = checkerboard(24, 20);
    const pdf = await renderDraftPdf({ draft, meta, options });
    const { total, pages, text } = await readBack(pdf);
    // A small draft: the draft page, the plan page, the threading list and the treadling list.
    expect(planFor(draft, options).pages).toHaveLength(1);
    expect(total).toBe(4);
    expect(pages[0]).toContain('Checkerboard sampler');
    expect(pages[0]).toContain('By Wren Example · Invented Studio · 2 March 2025 · version 7');
    expect(pages[0]).toContain('24 ends × 20 picks');
    expect(pages[0]).toMatch(/Harbour blue 8\/2 cotton\s+24 ends\s+0 picks/);
    expect(pages[0]).toMatch(/Mustard 8\/2 cotton\s+0 ends\s+20 picks/);
    expect(pages[1]).toContain('Plan');
    expect(pages[1]).toContain('No plan has been saved');
    expect(pages[2]).toContain('Threading');
    expect(pages[2]).toContain('Group 1 of');
    expect(pages[3]).toContain('Weaving: treadling');
    expect(pages[3]).toContain('Pick 20');
    // Every page carries its number.
    expect(text).toContain('Checkerboard sampler · page 4');
    // IBM Plex Sans is embedded (a subset), not a standard PDF font.
    expect(pdf.toString('latin1')).toMatch(/\/BaseFont \/[A-Z]{6}\+IBMPlexSans-Regular/);
  });

  it.each([
    ['threading above, treadling right', options],
    ['threading below, treadling left, landscape Letter', { ...options, paper: 'letter', orientation: 'landscape', threadingAbove: false, treadlingRight: false, endOneRight: false } as PrintOptions],
  ])('puts each drawdown cell where the layout says, in its colour (%s)', async (_name, opts) => {
    const draft = checkerboard(24, 20);
    const pdf = await renderDraftPdf({ draft, meta, options: opts });
    const plan = planFor(draft, opts);
    const part = plan.pages[0].parts[0];
    if (part.kind !== 'draft') throw new Error('the draft comes first on page 1');
    const dpi = 100;
    const img = renderPage(pdf, 1, dpi);
    const size = pageSize(opts.paper, opts.orientation);
    expect(img.width).toBe(Math.ceil((size.width * dpi) / 72 - 1e-6));
    for (const [e, p] of [[0, 0], [1, 0], [0, 1], [5, 7], [23, 19], [22, 19], [12, 3]]) {
      const c = cellCentre(part.layout.drawdown, e, p);
      const colour = (e + p) % 2 === 0 ? HARBOUR : MUSTARD;
      expectColour(img.at(Math.round((c.x * dpi) / 72), Math.round((c.y * dpi) / 72)), colour);
    }
    // The warp colour row is all blue over every end.
    const w = cellCentre(part.layout.warpColours, 23, 0);
    expectColour(img.at(Math.round((w.x * dpi) / 72), Math.round((w.y * dpi) / 72)), HARBOUR);
  });

  it('marks the threading, tie-up and treadling in ink where the draft says, and nowhere else', async () => {
    // Plain weave on 2 shafts: end e on shaft (e mod 2) + 1, pick p on treadle (p mod 2) + 1, treadle t lifts shaft t.
    const draft = checkerboard(12, 10);
    const opts: PrintOptions = { ...options, shaftsFromBottom: false, treadlingRight: false, endOneRight: false };
    const pdf = await renderDraftPdf({ draft, meta, options: opts, lists: [] });
    // Grid cells are drawn as pixels that viewers must not smooth (PDF 1.7 §8.9.5.1).
    expect(pdf.toString('latin1')).toContain('/Interpolate false');
    const part = planFor(draft, opts).pages[0].parts[0];
    if (part.kind !== 'draft') throw new Error('the draft comes first on page 1');
    const dpi = 150;
    const img = renderPage(pdf, 1, dpi);
    const px = (x: number, y: number) => img.at(Math.round((x * dpi) / 72), Math.round((y * dpi) / 72));
    const l = part.layout;
    for (let e = 0; e < 12; e++) {
      for (let s = 0; s < 2; s++) {
        const c = cellCentre(l.threading, e, s);
        expectColour(px(c.x, c.y), draft.threading[e].includes(s + 1) ? '#1d1d22' : '#ffffff');
      }
    }
    for (let p = 0; p < 10; p++) {
      for (let t = 0; t < 2; t++) {
        const c = cellCentre(l.treadling, t, p);
        expectColour(px(c.x, c.y), draft.treadling[p].includes(t + 1) ? '#1d1d22' : '#ffffff');
      }
    }
    for (let t = 0; t < 2; t++) {
      for (let s = 0; s < 2; s++) {
        const c = cellCentre(l.tieup!, t, s);
        expectColour(px(c.x, c.y), draft.tieup[t].includes(s + 1) ? '#1d1d22' : '#ffffff');
      }
    }
  });

  it('prints the cloth views of a very large draft for its first sheet only, and says so on page 1', async () => {
    const draft = checkerboard(900, 700);
    const pdf = await renderDraftPdf({ draft, meta, options, lists: [] });
    const { pages } = await readBack(pdf);
    expect(pages[0]).toMatch(/The cloth views after the draft show ends 1–\d+ and picks 1–\d+ only \(the whole cloth would take \d+ sheets each\); the draft sheets show every end and pick\./);
    const structure = pages.filter((p) => p.includes('Structure: drawdown in two tones'));
    expect(structure).toHaveLength(1);
    expect(structure[0]).toMatch(/Structure: drawdown in two tones \(black: end up\) \(ends 1–\d+, picks 1–\d+ only\)/);
    // Every end and pick is still on a draft sheet: the last sheet's running head names the last end and pick.
    expect(pages.some((p) => /Draft: sheet \d+ of \d+ · ends \d+–900 · picks \d+–700/.test(p))).toBe(true);
  });

  it('splits a wide and long draft into sheets that each say which ends and picks they hold', async () => {
    const draft = checkerboard(180, 150);
    const plan = planFor(draft, options);
    const sheets = plan.pages.flatMap((p) => p.parts).filter((p) => p.kind === 'draft');
    expect(sheets.length).toBeGreaterThan(3);
    const { pages } = await readBack(await renderDraftPdf({ draft, meta, options, lists: [] }));
    // Draft pages, then the plan page.
    expect(pages.length).toBe(plan.pages.length + 1);
    for (const s of sheets.slice(1)) {
      if (s.kind !== 'draft') continue;
      const range = (a: number, b: number) => `${a + 1}–${b}`;
      const head = `Draft: sheet ${s.tile.index + 1} of ${sheets.length} · ends ${range(s.tile.cols.start, s.tile.cols.end)} · picks ${range(s.tile.rows.start, s.tile.rows.end)}`;
      expect(pages[plan.pages.findIndex((p) => p.parts.includes(s))]).toContain(head);
    }
    expect(pages[0]).toContain('180 ends × 150 picks');
  });

  it('prints both faces and the layer map of a double weave, and the plan with every list for the loom', async () => {
    const draft: Draft = {
      ...expandProfile(doubleWeaveProfile(), 'double-weave'),
      yarns: [
        { id: 'n', name: 'Deep navy', color: 0 },
        { id: 'c', name: 'Oat cream', color: 1 },
        { id: 'r', name: 'Brick rust', color: 2 },
      ],
    };
    const plan = { ...defaultPlan('inch'), warpYarn: { text: '8/2 cotton', byColor: {} }, weftYarn: { text: '8/2 cotton', byColor: {} } };
    const pdf = await renderDraftPdf({ draft, meta: { ...meta, title: 'Two-block mat' }, plan, options: { ...options, paper: 'letter' } });
    expect(pdf.toString('latin1')).toContain('/MediaBox [0 0 612 792]');
    const { pages, text } = await readBack(pdf);
    expect(pages[0]).toContain('Front: the front face');
    expect(pages[0]).toContain('Back: the back face, as seen turned over');
    expect(pages[0]).toContain('Layer map');
    expect(pages[0]).toContain('lift plan');
    expect(pages[1]).toContain('Reed and dents');
    expect(pages[1]).toMatch(/Warp yarn per colour[\s\S]*Deep navy/);
    for (const heading of ['Threading', 'Sleying', 'Tying on', 'Weaving: lift plan']) expect(text).toContain(heading);
    expect(text).toContain('Working from the front of the loom, right to left');
  });

  it('prints the demo double-weave mat by default (one repeat) in at most 12 A4 pages, with everything the loom needs', async () => {
    const mat = doubleWeaveTableMat('harbour');
    const plan = { ...defaultPlan('inch'), warpYarn: { text: '8/2 cotton', byColor: {} }, weftYarn: { text: '8/2 cotton', byColor: {} } };
    const { range: _whole, ...defaults } = options;
    const { total, pages, text } = await readBack(await renderDraftPdf({ draft: mat, meta: { ...meta, title: mat.name }, plan, options: defaults }));
    console.log(`demo mat, default print: ${total} A4 pages`);
    expect(total).toBeLessThanOrEqual(12);
    expect(pages[0]).toContain('one repeat, ends 1–80 of 440 and picks 1–80 of 560');
    for (const heading of ['Front: the front face', 'Back: the back face', 'Layer map', 'Colours and yarns', 'Reed and dents', 'Threading', 'Sleying', 'Tying on', 'Weaving: lift plan']) expect(text).toContain(heading);
    // The threading list covers the whole warp, to the last end.
    expect(text).toMatch(/Ends 440–|–440\b|\b440: /);
    // Each end's dent is on its own line of the threading list.
    expect(text).toMatch(/\b\d+: \d \(dent \d+\)/);
    // The lift plan lists the repeat once and says how often it is woven.
    expect(text).toContain("the draft's 560 picks are this repeat 7 times");
    expect(text).not.toContain('Pick 81 ');
    expect(text).toContain('Shaft 1 is the shaft nearest you at the front of the loom.');
  });

  it('prints a chosen range of ends and picks numbered as in the draft, and the whole draft on request', async () => {
    const draft = checkerboard(120, 90);
    const { pages: ranged } = await readBack(await renderDraftPdf({ draft, meta, options: { ...options, range: { part: 'range', ends: { from: 41, to: 60 }, picks: { from: 11, to: 30 } } }, lists: ['weaving'] }));
    expect(ranged[0]).toContain('ends 41–60 of 120 and picks 11–30 of 90');
    expect(ranged.join('\n')).toContain('This list shows picks 11–30 of the draft');
    const { pages: whole } = await readBack(await renderDraftPdf({ draft, meta, options, lists: [] }));
    expect(whole[0]).not.toContain('of 120');
  });

  it('follows the chosen working order in the lists', async () => {
    const draft = checkerboard(8, 4);
    const { text } = await readBack(await renderDraftPdf({ draft, meta, options: { ...options, workingOrder: { side: 'back' } }, lists: ['threading'] }));
    expect(text).toContain('Working from the back of the loom');
  });
});

describe('a print watched while it is made', () => {
  const options: PrintOptions = { paper: 'a4', orientation: 'portrait', threadingAbove: true, treadlingRight: true, shaftsFromBottom: true, endOneRight: true, numberEvery: 4, range: { part: 'whole' } };
  const meta = { title: 'Watched', author: '', studio: '', date: '', version: 1 };
  /** Streams a print of about 140 pages to a reader that takes everything, with `control`. */
  async function watched(control: Parameters<typeof streamDraftPdf>[2]) {
    const out = new PassThrough();
    let bytes = 0;
    out.on('data', (c: Buffer) => { bytes += c.length; });
    const outcome = await streamDraftPdf({ draft: bigPointTwill(800), meta, lists: [], options }, out, control).then((r) => r, (err: unknown) => err);
    return { outcome, bytes };
  }

  it('finding 2: a print past its time, or whose client has gone, stops part way', async () => {
    const late = await watched({ deadline: performance.now() });
    expect(late.outcome).toBeInstanceOf(PrintStopped);
    expect(late.outcome).toMatchObject({ reason: 'too long', pages: 0 });
    const gone = new AbortController();
    gone.abort();
    expect((await watched({ signal: gone.signal })).outcome).toMatchObject({ reason: 'client gone', pages: 0 });
    const runaway = await watched({ maxPages: 10 });
    expect(runaway.outcome).toMatchObject({ reason: 'too many pages' });
    expect((runaway.outcome as PrintStopped).pages).toBeLessThanOrEqual(12);
    // Unwatched, the same print runs to its end.
    const whole = await watched({});
    expect(whole.outcome).toMatchObject({ pages: expect.any(Number) });
    expect((whole.outcome as { pages: number }).pages).toBeGreaterThan(100);
    expect(whole.bytes).toBeGreaterThan(runaway.bytes);
  }, 60_000);
});
