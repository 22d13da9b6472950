// Starting a draft of one's own, as a new weaver would: New draft in the library, the short form,
// and drawing straight away; the drawing is kept through a reload. Real server, MariaDB and
// headless Chromium.
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_STUDIO_NAME } from '../../server/db/demo-accounts';
import { screenshot, signIn, useAppAndBrowser } from '../helpers/e2e';

const app = useAppAndBrowser();

/** Calls the API from the page, with its session, as the app does. */
async function serverDocument(page: Page, id: number): Promise<{ name: string; threading: number[][]; control: string }> {
  return page.evaluate(async (draftId) => {
    const res = await fetch(`/api/drafts/${draftId}`, { headers: { accept: 'application/json' } });
    return ((await res.json()) as { draft: { document: { name: string; threading: number[][]; control: string } } }).draft.document;
  }, id);
}

const draftIdOf = (page: Page) => Number(/\/drafts\/(\d+)/.exec(page.url())![1]);

/**
 * Clicks a threading cell with the mouse, as a weaver would: end `end` (1-based) on the top row of
 * the threading, which (shaft 1 at the bottom, the default) is the draft's highest shaft. The grids
 * start unscrolled with the threading above the drawdown: the end ruler, a gap, the warp colour row,
 * a gap, then the shaft rows (src/features/editor/canvas/layout.ts).
 */
async function clickTopThreadingCell(page: Page, end: number): Promise<void> {
  const cell = Number(await page.getByRole('slider', { name: 'Zoom' }).inputValue());
  const host = (await page.getByTestId('draft-canvas').boundingBox())!;
  const x = host.x + (end - 0.5) * cell;
  const y = host.y + 18 + 6 + cell + 6 + cell / 2;
  await page.mouse.click(x, y);
}

/** The cell under the editor's cursor, in the editor's words. */
async function cursorCell(page: Page): Promise<string | null> {
  await page.getByTestId('draft-canvas').focus();
  await page.keyboard.press('ArrowRight');
  await page.keyboard.press('ArrowLeft');
  return page.getByTestId('editor-message').textContent();
}

describe('New draft', () => {
  it('goes from the library to a drawn cell in three steps, and the drawing is there after a reload', async () => {
    const { page } = app.browser;
    await page.setViewportSize({ width: 1440, height: 900 });
    // Signing in lands on the library (Drafts).
    await signIn(page, app.server, 'student1@shedwright.test');
    const steps: string[] = [];

    await page.getByRole('link', { name: 'New draft' }).first().click();
    steps.push('New draft');
    await page.getByRole('button', { name: 'Create draft' }).waitFor();
    await screenshot(page, 'new-draft-form');
    // Everything has a default that weaves: name, Personal, 4 shafts, 6 treadles, 48 × 48, straight twill.
    expect(await page.getByLabel('Name', { exact: true }).inputValue()).toBe('Untitled draft');
    expect(await page.getByLabel('Shafts', { exact: true }).inputValue()).toBe('4');
    expect(await page.getByRole('radio', { name: /^Straight twill/ }).isChecked()).toBe(true);

    await page.getByRole('button', { name: 'Create draft' }).click();
    steps.push('Create draft');
    await page.waitForURL(/\/drafts\/\d+$/);
    await page.getByTestId('draft-canvas').waitFor();
    const id = draftIdOf(page);
    // Version 1 on the server: a straight draw, end 1 on shaft 1.
    expect((await serverDocument(page, id)).threading[0]).toEqual([1]);

    await clickTopThreadingCell(page, 1);
    steps.push('click a threading cell');
    expect(steps).toHaveLength(3);
    await page.getByTestId('save-status').getByText('Saved').waitFor({ timeout: 20_000 });

    await page.reload();
    await page.getByTestId('draft-canvas').waitFor();
    expect(await cursorCell(page)).toBe('Threading, end 1, shaft 4: marked.');
    expect((await serverDocument(page, id)).threading[0]).toEqual([4]);
    await page.goto(`${app.server.url}/drafts`);
    await page.getByRole('link', { name: 'Untitled draft' }).first().waitFor();
    expect(app.browser.errors.filter((e) => !/thumbnail|404/.test(e))).toEqual([]);
  });

  it('says which value the loom cannot take beside its field', async () => {
    const { page } = app.browser;
    await page.goto(`${app.server.url}/drafts/new`);
    await page.getByLabel('Shafts', { exact: true }).fill('40');
    await page.getByRole('button', { name: 'Create draft' }).click();
    const shafts = page.getByLabel('Shafts', { exact: true });
    await expect.poll(() => shafts.getAttribute('aria-invalid')).toBe('true');
    expect(await page.getByText(/Shafts must be a whole number from 2 to 32/).count()).toBe(1);
    expect(page.url()).toMatch(/\/drafts\/new$/);
  });

  it('a lift-plan block design in a studio opens at the block design with the unit chosen', async () => {
    const { page } = app.browser;
    await app.browser.context.clearCookies();
    await signIn(page, app.server, 'lead@shedwright.test');
    await page.goto(`${app.server.url}/studios`);
    await page.getByRole('link', { name: DEMO_STUDIO_NAME }).first().click();
    await page.getByRole('link', { name: 'New draft' }).click();
    await page.waitForURL(/\/drafts\/new\?studio=\d+$/);
    expect(await page.getByLabel('Where it lives').locator('option:checked').textContent()).toBe(`Studio: ${DEMO_STUDIO_NAME}`);
    await page.getByLabel('Name', { exact: true }).fill('Two-block double weave');
    await page.getByLabel('Shafts', { exact: true }).fill('8');
    await page.getByRole('radio', { name: /lift plan/i }).check();
    await page.getByRole('radio', { name: /^Block design/ }).check();
    await page.getByLabel('Unit of the block design').selectOption({ label: 'Double weave, two layers' });
    await page.getByRole('button', { name: 'Create draft' }).click();
    await page.waitForURL(/\/drafts\/\d+$/);
    await page.getByRole('heading', { name: 'Two-block double weave' }).waitFor();
    await page.locator('#profile-heading').waitFor();
    expect(await page.locator('#profile-heading').isVisible()).toBe(true);
    const doc = await serverDocument(page, draftIdOf(page));
    expect(doc.control).toBe('liftplan');
    expect(await page.locator('header dd').getByText(DEMO_STUDIO_NAME).count()).toBe(1);
  });
});
