// Working on a draft without losing it or losing your place: selection from the keyboard, the
// question before a large deletion, wheel scrolling, edits sent when leaving, kept through a reload
// without network, undo after a reload, and Compare of an insertion. Real server, MariaDB and
// headless Chromium.
import { describe, expect, it } from 'vitest';
import type { Dialog, Page } from 'playwright-core';
import { createDraft, type Draft } from '../../shared/weave';
import { screenshot, signIn, useAppAndBrowser } from '../helpers/e2e';

const app = useAppAndBrowser();

/** An 8-shaft straight twill, wide and long enough to scroll at the starting zoom. */
function bigTwill(name: string): Draft {
  return createDraft({
    name,
    shafts: 8,
    treadles: 8,
    threading: Array.from({ length: 160 }, (_, e) => [(e % 8) + 1]),
    tieup: Array.from({ length: 8 }, (_, t) => [(t % 8) + 1, ((t + 1) % 8) + 1, ((t + 2) % 8) + 1, ((t + 3) % 8) + 1]),
    treadling: Array.from({ length: 120 }, (_, p) => [(p % 8) + 1]),
    palette: ['#1d3557', '#f1e9da'],
    warpColors: Array.from({ length: 160 }, () => 0),
    weftColors: Array.from({ length: 120 }, () => 1),
  });
}

/** Calls the API from the page, with its session and a CSRF token, as the app does. */
async function callApi<T>(page: Page, method: string, path: string, body?: unknown): Promise<{ status: number; body: T }> {
  return page.evaluate(async ({ method, path, body }) => {
    const headers: Record<string, string> = { accept: 'application/json', 'content-type': 'application/json' };
    if (method !== 'GET') headers['x-csrf-token'] = ((await (await fetch('/api/csrf')).json()) as { token: string }).token;
    const res = await fetch(path, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    return { status: res.status, body: (await res.json()) as T };
  }, { method, path, body });
}

interface ServerDraft {
  version: number;
  ends: number;
  picks: number;
  document: Draft;
}

async function serverDraft(page: Page, id: number): Promise<ServerDraft> {
  return (await callApi<{ draft: ServerDraft }>(page, 'GET', `/api/drafts/${id}`)).body.draft;
}

/** A fresh draft of the lead's, opened in the editor; returns its id. */
async function openNewDraft(page: Page, name: string): Promise<number> {
  if (!page.url().startsWith(app.server.url)) await signIn(page, app.server, 'lead@shedwright.test');
  const created = await callApi<{ draft: { id: number } }>(page, 'POST', '/api/drafts', { name, document: bigTwill(name) });
  expect(created.status).toBe(201);
  await page.goto(`${app.server.url}/drafts/${created.body.draft.id}`);
  await page.getByTestId('draft-canvas').waitFor();
  await page.getByTestId('draft-canvas').focus();
  return created.body.draft.id;
}

/** A fingerprint of the grids' pictures: equal pictures give equal fingerprints. */
async function gridPicture(page: Page): Promise<string> {
  return page.evaluate(() => {
    let h = 2166136261;
    for (const c of document.querySelectorAll<HTMLCanvasElement>('[data-testid="draft-canvas"] canvas')) {
      const data = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
      for (let i = 0; i < data.length; i += 4) h = Math.imul(h ^ ((data[i] << 16) | (data[i + 1] << 8) | data[i + 2]), 16777619) >>> 0;
    }
    return h.toString(16);
  });
}

/** Two animation frames: the canvas repaints at most once a frame. */
const frames = (page: Page) => page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r))));

const message = (page: Page) => page.getByTestId('editor-message');

describe('selection and deletion', () => {
  it('Shift+arrow after plain arrows selects from the cursor, not from the old anchor', async () => {
    const { page } = app.browser;
    await openNewDraft(page, 'Selection from the cursor');
    for (const k of ['Shift+ArrowRight', 'Shift+ArrowRight', 'ArrowRight', 'ArrowRight', 'ArrowRight', 'Shift+ArrowRight']) await page.keyboard.press(k);
    await page.keyboard.press('Delete');
    // The cursor was on end 6: only ends 6 and 7 go.
    await expect.poll(() => message(page).textContent()).toBe('Deleted ends 6–7.');
  });

  it('deleting every end asks first; saying no keeps them and nothing is saved', async () => {
    const { page } = app.browser;
    const id = await openNewDraft(page, 'Delete everything');
    const questions: string[] = [];
    const answer = (d: Dialog) => {
      questions.push(d.message());
      void d.dismiss();
    };
    page.on('dialog', answer);
    await page.getByRole('textbox', { name: 'Go to' }).fill('ends 1-160');
    await page.keyboard.press('Enter');
    await expect.poll(() => message(page).textContent()).toBe('Ends 1–160 selected.');
    await page.keyboard.press('Delete');
    await expect.poll(() => questions).toEqual(['This removes all 160 ends. Remove them?']);
    page.off('dialog', answer);
    await expect.poll(() => message(page).textContent()).toBe('Nothing deleted.');
    const saved = await serverDraft(page, id);
    expect(saved).toMatchObject({ version: 1, ends: 160 });
  });
});

describe('wheel and trackpad', () => {
  it('a wheel over the threading scrolls it sideways, and the scroll is not thrown back to the cursor', async () => {
    const { page } = app.browser;
    await openNewDraft(page, 'Wheel scrolling');
    const box = (await page.getByTestId('draft-canvas').boundingBox())!;
    // The threading strip: below the end numbers and the warp colours.
    await page.mouse.move(box.x + 200, box.y + 60);
    await frames(page);
    const before = await gridPicture(page);
    await page.mouse.wheel(0, 300);
    await page.keyboard.down('Shift');
    await page.mouse.wheel(0, 200);
    await page.keyboard.up('Shift');
    await expect.poll(() => gridPicture(page)).not.toBe(before);
    const scrolled = await gridPicture(page);
    await frames(page);
    expect(await gridPicture(page)).toBe(scrolled);
    await screenshot(page, 'editor-wheel-scrolled');
    // The cursor stayed on end 1: one step right is end 2 (and brings it back into view).
    await page.keyboard.press('ArrowRight');
    await expect.poll(() => message(page).textContent()).toMatch(/^Threading, end 2,/);
    await expect.poll(() => gridPicture(page)).not.toBe(scrolled);
  });

  it('Ctrl+wheel zooms', async () => {
    const { page } = app.browser;
    await openNewDraft(page, 'Wheel zoom');
    const box = (await page.getByTestId('draft-canvas').boundingBox())!;
    await page.mouse.move(box.x + 300, box.y + 300);
    const zoom = page.getByRole('slider', { name: 'Zoom' });
    const before = Number(await zoom.inputValue());
    await page.keyboard.down('Control');
    await page.mouse.wheel(0, -200);
    await page.keyboard.up('Control');
    await expect.poll(async () => Number(await zoom.inputValue())).toBeGreaterThan(before);
  });
});

const status = (page: Page) => page.getByTestId('save-status');

/** The cell under the cursor in the editor's words, after a step right and back. */
async function cursorCell(page: Page): Promise<string | null> {
  await page.getByTestId('draft-canvas').focus();
  await page.keyboard.press('ArrowRight');
  await page.keyboard.press('ArrowLeft');
  return message(page).textContent();
}

describe('never lose work', () => {
  it('a cell painted just before going to another page is on the server after a reload', async () => {
    const { page } = app.browser;
    const id = await openNewDraft(page, 'Leave at once');
    const draftUrl = page.url();
    // The cursor starts on end 1, top row (shaft 8); the draft has end 1 on shaft 1. Mark it and
    // follow a link in the same task: well within 100 ms, and before any autosave pause is over.
    await page.evaluate(() => {
      document.querySelector('[data-testid="draft-canvas"]')!.dispatchEvent(new KeyboardEvent('keydown', { key: ' ', bubbles: true }));
      [...document.querySelectorAll('a')].find((a) => a.textContent === 'Plan')!.click();
    });
    await page.waitForURL(/\/plan$/);
    // The weaver reloads once the Plan section is open: the editor has closed and sent its unsent
    // edit on the way out (a request that outlives the page).
    await page.getByTestId('draft-canvas').waitFor({ state: 'detached' });
    await page.goto(draftUrl);
    await page.getByTestId('draft-canvas').waitFor();
    await expect.poll(async () => (await serverDraft(page, id)).document.threading[0]).toEqual([8]);
    expect(await cursorCell(page)).toBe('Threading, end 1, shaft 8: marked.');
  });

  it('an edit made offline survives a reload without network, says so, and is saved when the network returns', async () => {
    const { page, context } = app.browser;
    const id = await openNewDraft(page, 'Offline edit');
    // The app itself comes from the service worker's cache when offline: let it take the page first.
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    await page.reload();
    await page.getByTestId('draft-canvas').waitFor();
    await context.setOffline(true);
    await page.getByTestId('draft-canvas').focus();
    await page.keyboard.press('Space');
    await status(page).getByText('Offline — edits kept on this device').waitFor({ timeout: 20_000 });

    // Reloading with edits that cannot be sent asks first.
    const asked: string[] = [];
    const answer = (d: Dialog) => {
      asked.push(d.type());
      void d.accept();
    };
    page.on('dialog', answer);
    await page.reload();
    await page.getByTestId('draft-canvas').waitFor();
    page.off('dialog', answer);
    expect(asked).toEqual(['beforeunload']);
    await page.getByTestId('restored-notice').waitFor();
    expect(await cursorCell(page)).toBe('Threading, end 1, shaft 8: marked.');
    await screenshot(page, 'editor-restored-offline');

    await context.setOffline(false);
    await status(page).getByText('Saved').waitFor({ timeout: 30_000 });
    const saved = await serverDraft(page, id);
    expect(saved.document.threading[0]).toEqual([8]);
  });

  it('undo works after a reload', async () => {
    const { page } = app.browser;
    const id = await openNewDraft(page, 'Undo after reload');
    await page.keyboard.press('Space');
    await status(page).getByText('Saved').waitFor({ timeout: 20_000 });
    await page.reload();
    await page.getByTestId('draft-canvas').waitFor();
    await page.getByRole('button', { name: /^Undo draw/ }).waitFor();
    await page.getByTestId('draft-canvas').focus();
    await page.keyboard.press('Control+z');
    await expect.poll(() => message(page).textContent()).toBe('Undid draw.');
    await expect.poll(async () => (await serverDraft(page, id)).document.threading[0], { timeout: 20_000 }).toEqual([1]);
  });
});

describe('Compare', () => {
  it('reports 48 ends put into the middle as 48 ends inserted, not every end after them changed', async () => {
    const { page } = app.browser;
    const id = await openNewDraft(page, 'Widened twill');
    const before = (await serverDraft(page, id)).document;
    const widened = structuredClone(before);
    // 48 ends in the weft colour after end 80, threaded on as a straight draw.
    widened.threading.splice(80, 0, ...Array.from({ length: 48 }, (_, i) => [(i % 8) + 1]));
    widened.warpColors.splice(80, 0, ...Array.from({ length: 48 }, () => 1));
    const saved = await callApi<{ version: number }>(page, 'PUT', `/api/drafts/${id}`, { document: widened, baseVersion: 1, named: true, message: 'Wider' });
    expect(saved.status).toBe(200);

    await page.goto(`${app.server.url}/drafts/${id}/history`);
    await page.getByRole('checkbox', { name: 'Compare version 1' }).check();
    await page.getByRole('checkbox', { name: `Compare version ${saved.body.version}` }).check();
    await page.getByRole('button', { name: 'Compare' }).click();
    const result = page.getByRole('region', { name: `Version 1 compared with version ${saved.body.version}` });
    await result.waitFor();
    expect(await result.getByTestId('aligned-ends').textContent()).toBe(`48 inserted (81–128 in version ${saved.body.version}); none removed; none changed`);
    expect(await result.getByTestId('aligned-picks').textContent()).toBe('none inserted; none removed; none changed');
  });
});

