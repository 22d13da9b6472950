// One truth from screen to paper: the editor's drawdown (pixels read from its canvas in headless
// Chromium) and the printed drawdown (the PDF rasterised by poppler's pdftoppm) show the same cloth
// column for column, with end 1 on the left and, after the weaver ticks "End 1 on the right" in the
// editor, on the right. The draft is a 2/2 straight twill, whose diagonal turns the other way when
// mirrored, so a print that mirrored the screen would fail.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { computeDrawdown, hexToRgb, parseDraft, pickCount, type Draft } from '../../shared/weave';
import { gridBounds } from '../../shared/print/draft-layout';
import { planDraftPages } from '../../shared/print/draft-pages';
import { pageSize, printArrangementOf } from '../../shared/print/types';
import { arrangementOf } from '../../shared/weave';
import { arrangementFromDraft, computeLayout, regionOf } from '../../src/features/editor/canvas/layout';
import { DEFAULT_VIEW } from '../../src/features/editor/store/editor';
import { screenshot, signIn, useAppAndBrowser } from '../helpers/e2e';
import { renderPdfPage } from '../helpers/pdf-raster';

const app = useAppAndBrowser();
const work = mkdtempSync(join(tmpdir(), 'shedwright-screen-paper-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

type Rgb = [number, number, number];
/** Colours of the drawdown as seen, row by row (pick 1's row first) and left to right across. */
type Seen = Rgb[][];

const close = (a: Rgb, b: Rgb, tolerance = 8) => a.every((v, k) => Math.abs(v - b[k]) <= tolerance);

/** What the engine says each cell shows, laid out left to right as the arrangement puts the ends. */
function expected(draft: Draft): Seen {
  const dd = computeDrawdown(draft);
  const right = arrangementOf(draft).endOne === 'right';
  return Array.from({ length: dd.picks }, (_, p) =>
    Array.from({ length: dd.ends }, (_, k) => {
      const e = right ? dd.ends - 1 - k : k;
      return hexToRgb(draft.palette[dd.isUp(e, p) ? draft.warpColors[e] : draft.weftColors[p]]) as Rgb;
    }),
  );
}

async function openedDraft(page: Page, id: string): Promise<Draft> {
  const res = await page.request.get(`${app.server.url}/api/drafts/${id}`);
  expect(res.status()).toBe(200);
  return parseDraft(((await res.json()) as { draft: { document: unknown } }).draft.document);
}

/**
 * The editor's drawdown as seen: the stage's grids are laid out with the editor's own layout for the
 * stage's size; the columns are read across the whole band the ends' grids share, left to right,
 * and the drawdown is the `ends` columns at the side end 1 is on (the grow margin is the rest).
 */
async function editorSeen(page: Page, draft: Draft): Promise<Seen> {
  const host = page.getByTestId('draft-canvas');
  const box = await host.evaluate((el) => {
    const r = el.getBoundingClientRect();
    return { width: Math.max(200, Math.floor(r.width)), height: Math.max(200, Math.floor(r.height)) };
  });
  const layout = computeLayout(draft, arrangementFromDraft(draft), DEFAULT_VIEW.cell, box.width, box.height);
  const dd = regionOf(layout, 'drawdown')!;
  const band = layout.endRuler;
  const ends = draft.threading.length;
  const picks = pickCount(draft);
  const bandCols = Math.round(band.width / layout.cell);
  expect(bandCols).toBeGreaterThanOrEqual(ends);
  const points = Array.from({ length: picks }, (_, p) =>
    Array.from({ length: bandCols }, (_, k) => ({ x: band.x + (k + 0.5) * layout.cell, y: dd.y + (p + 0.5) * layout.cell })),
  );
  const colours = await host.evaluate((el, pts) => {
    const canvas = el.querySelector('canvas')!;
    const ratio = canvas.width / canvas.getBoundingClientRect().width;
    const data = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height).data;
    return pts.map((row) => row.map(({ x, y }) => {
      const i = (Math.floor(y * ratio) * canvas.width + Math.floor(x * ratio)) * 4;
      return [data[i], data[i + 1], data[i + 2]];
    }));
  }, points);
  const right = arrangementOf(draft).endOne === 'right';
  return colours.map((row) => (right ? row.slice(bandCols - ends) : row.slice(0, ends)) as Rgb[]);
}

/** The printed drawdown as seen on page 1, rasterised at 150 dpi, cells read left to right. */
function paperSeen(pdf: Buffer, draft: Draft): Seen {
  const dpi = 150;
  const page = renderPdfPage(pdf, 1, dpi, work);
  // Where the draft's drawdown lies on page 1 (its bounds do not depend on the side end 1 is on).
  const ends = draft.threading.length;
  const picks = pickCount(draft);
  const laid = planDraftPages({
    page: pageSize('a4', 'portrait'),
    shape: { ends, picks, shafts: draft.shafts, pickColumns: draft.control === 'liftplan' ? draft.shafts : draft.treadles, liftPlan: draft.control === 'liftplan' },
    arrangement: printArrangementOf(arrangementOf(draft)),
    views: ['structure'],
    legendRows: new Set([...draft.warpColors, ...draft.weftColors]).size,
  });
  const part = laid.pages[0].parts.find((p) => p.kind === 'draft');
  if (part?.kind !== 'draft') throw new Error('no draft on page 1');
  expect(part.across * part.down).toBe(1);
  const b = gridBounds(part.layout.drawdown);
  const k = dpi / 72;
  return Array.from({ length: picks }, (_, p) =>
    Array.from({ length: ends }, (_, c) => {
      const x = Math.floor((b.x + (c + 0.5) * laid.cell) * k);
      const y = Math.floor((b.y + (p + 0.5) * laid.cell) * k);
      return page.at(x, y) as Rgb;
    }),
  );
}

/** Every cell alike, or the first that differs. */
function firstDifference(a: Seen, b: Seen): string | null {
  for (let p = 0; p < a.length; p++) {
    for (let c = 0; c < a[p].length; c++) if (!close(a[p][c], b[p][c])) return `pick ${p + 1}, column ${c + 1} from the left: ${a[p][c].join(',')} against ${b[p][c].join(',')}`;
  }
  return a.length === b.length ? null : `${a.length} rows against ${b.length}`;
}

describe('the editor and the print show the same drawdown', () => {
  it('column for column, with end 1 on the left and then on the right', async () => {
    const { page } = app.browser;
    await signIn(page, app.server, 'student1@shedwright.test');
    await page.getByRole('link', { name: /Straight twill trial/ }).click();
    await page.getByTestId('draft-canvas').waitFor();
    const id = /\/drafts\/(\d+)/.exec(page.url())![1];

    for (const endOne of ['left', 'right'] as const) {
      if (endOne === 'right') {
        await page.getByLabel('End 1 on the right').check();
        await page.getByTestId('save-status').getByText('Saved').waitFor({ timeout: 20_000 });
      }
      // Two frames for the repaint after the change.
      await page.waitForTimeout(500);
      const draft = await openedDraft(page, id);
      expect(arrangementOf(draft).endOne).toBe(endOne);
      const want = expected(draft);
      // The twill's diagonal makes the two sides tell apart: the mirror of the cloth is not the cloth.
      expect(firstDifference(want, want.map((row) => [...row].reverse()))).not.toBeNull();

      const screen = await editorSeen(page, draft);
      expect(firstDifference(screen, want), `the editor, end 1 on the ${endOne}`).toBeNull();

      // The print follows the draft's arrangement without being told.
      const res = await page.request.get(`${app.server.url}/api/drafts/${id}/print.pdf?part=whole&lists=`);
      expect(res.status()).toBe(200);
      const paper = paperSeen(Buffer.from(await res.body()), draft);
      expect(firstDifference(paper, screen), `the print against the screen, end 1 on the ${endOne}`).toBeNull();
      await screenshot(page, `screen-and-paper-end-1-${endOne}`);
    }
  });
});
