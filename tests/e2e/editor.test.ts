// The editor as a weaver uses it: open the demo double-weave mat, change one threading cell from the
// keyboard, watch the drawdown and both faces change on the canvas, undo, redo, and find the saved
// state after a reload. Pixels are read from the real canvases in headless Chromium.
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, signIn, useAppAndBrowser } from '../helpers/e2e';

const app = useAppAndBrowser();

/** A fingerprint of every canvas under each test id: equal pictures give equal fingerprints. */
async function fingerprints(page: Page, ids: string[]): Promise<Record<string, string>> {
  return page.evaluate((testIds) => {
    const out: Record<string, string> = {};
    for (const id of testIds) {
      const canvases = [...document.querySelectorAll(`[data-testid="${id}"] canvas`)] as HTMLCanvasElement[];
      let h = 2166136261;
      let inked = 0;
      for (const c of canvases) {
        const data = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
        for (let i = 0; i < data.length; i += 4) {
          const v = (data[i] << 16) | (data[i + 1] << 8) | data[i + 2];
          h = Math.imul(h ^ v, 16777619) >>> 0;
          if (data[i + 3] > 0) inked++;
        }
      }
      out[id] = `${canvases.length}:${inked}:${h.toString(16)}`;
    }
    return out;
  }, ids);
}

const VIEWS = ['draft-canvas', 'view-front', 'view-back'];

/** Waits until the canvases stop changing (the cloth views repaint once edits settle). */
async function settled(page: Page): Promise<Record<string, string>> {
  // Stable for two seconds: the heavier views wait for edits to pause before they repaint.
  let last = await fingerprints(page, VIEWS);
  let stableSince = Date.now();
  const deadline = Date.now() + 20_000;
  while (Date.now() < deadline) {
    await page.waitForTimeout(250);
    const next = await fingerprints(page, VIEWS);
    if (JSON.stringify(next) !== JSON.stringify(last)) {
      last = next;
      stableSince = Date.now();
    } else if (Date.now() - stableSince >= 2000) {
      return next;
    }
  }
  return last;
}

/** Shows the front and back faces beside the drawdown (the view buttons toggle). */
async function showBothFaces(page: Page) {
  for (const name of ['Front', 'Back']) {
    const button = page.getByRole('group', { name: 'Views to show' }).getByRole('button', { name, exact: true });
    if ((await button.getAttribute('aria-pressed')) !== 'true') await button.click();
  }
  await page.getByTestId('view-front').locator('canvas').first().waitFor();
}

async function waitSaved(page: Page) {
  await page.getByTestId('save-status').getByText('Saved').waitFor({ timeout: 20_000 });
}

describe('editing the demo double weave', () => {
  it('a threading change repaints the drawdown and both faces; undo restores; the save survives a reload', async () => {
    const { page } = app.browser;
    await signIn(page, app.server, 'lead@shedwright.test');
    await page.getByRole('link', { name: /double weave table mat — harbour/i }).click();
    await page.getByTestId('draft-canvas').waitFor();
    const draftUrl = page.url();

    await showBothFaces(page);

    // The cursor starts on the threading's first end. End 2 is in the two-colour layer (layer 1 is a
    // single colour, so its face would look the same whatever its interlacement): move there and mark.
    await page.getByTestId('draft-canvas').focus();
    await page.keyboard.press('ArrowRight');
    const original = await settled(page);
    for (const id of VIEWS) expect(original[id]).not.toMatch(/^0:/);
    await page.keyboard.press('Space');
    const changed = await settled(page);
    for (const id of VIEWS) expect(changed[id], `${id} should change`).not.toBe(original[id]);
    await screenshot(page, 'editor-double-weave-changed');

    await page.keyboard.press('Control+z');
    const undone = await settled(page);
    expect(undone).toEqual(original);

    await page.keyboard.press('Control+Shift+z');
    const redone = await settled(page);
    expect(redone).toEqual(changed);
    await waitSaved(page);

    await page.goto(draftUrl);
    await page.getByTestId('draft-canvas').waitFor();
    await showBothFaces(page);
    await page.getByTestId('draft-canvas').focus();
    await page.keyboard.press('ArrowRight');
    const reloaded = await settled(page);
    expect(reloaded).toEqual(changed);
    await screenshot(page, 'editor-double-weave-reloaded');
    expect(app.browser.errors.filter((e) => !/thumbnail|404/.test(e))).toEqual([]);
  });
});
