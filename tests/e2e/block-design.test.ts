// A block weaver starts a two-block double weave from the New draft form, designs it in the block
// design with a two-colour order in one layer, uses it as the draft, comes back to it later, changes
// one block and sees the faces change; then moves one end to a wrong shaft and finds one item in
// Checks for it.
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, settledCanvas, signIn, useAppAndBrowser } from '../helpers/e2e';

const app = useAppAndBrowser();

async function showFront(page: Page) {
  const button = page.getByRole('group', { name: 'Views to show' }).getByRole('button', { name: 'Front', exact: true });
  if ((await button.getAttribute('aria-pressed')) !== 'true') await button.click();
}

describe('block design for a two-block double weave', () => {
  it('is designed with a two-colour layer order, used, reopened, changed, and checked', async () => {
    const { page } = app.browser;
    await signIn(page, app.server, 'lead@shedwright.test');

    // From the New draft form: an 8-shaft lift-plan draft started as a double-weave block design.
    await page.getByRole('link', { name: 'New draft' }).first().click();
    await page.getByLabel('Name', { exact: true }).fill('Two-block mat');
    await page.getByLabel('Shafts', { exact: true }).fill('8');
    await page.getByRole('radio', { name: /lift plan/i }).check();
    await page.getByRole('radio', { name: /^Block design/ }).check();
    await page.getByLabel('Unit of the block design').selectOption({ label: 'Double weave, two layers' });
    await page.getByRole('button', { name: 'Create draft' }).click();
    await page.waitForURL(/\/drafts\/\d+$/);
    const id = Number(/\/drafts\/(\d+)$/.exec(page.url())![1]);
    const design = page.getByTestId('block-design');
    await design.waitFor();
    await design.getByText('(kept with this draft)').waitFor();

    // Three yarns named in the colours: charcoal, oat and a third colour added as rust.
    const palette = page.getByRole('region', { name: 'Colours and yarns' });
    await palette.getByRole('button', { name: 'Add colour' }).click();
    await palette.getByLabel('Colour 3: hex').fill('#9a3b2e');
    for (const [n, name] of [[1, 'Charcoal cotton'], [2, 'Oat cotton'], [3, 'Rust cotton']] as const) {
      await palette.getByLabel(`Colour ${n}: yarn name`).fill(name);
      await palette.getByLabel(`Colour ${n}: yarn name`).press('Enter');
    }

    // Layer 1 takes charcoal and oat in turn; layer 2 is rust, in warp and weft.
    for (const side of ['Warp', 'Weft']) {
      const layer1 = design.getByRole('group', { name: `${side}, Layer 1: colour order` });
      await layer1.getByRole('button', { name: `${side}, Layer 1: add a place` }).click();
      await layer1.getByLabel(`${side}, Layer 1, place 2`).selectOption({ label: 'Oat cotton' });
      await design.getByLabel(`${side}, Layer 2, place 1`).selectOption({ label: 'Rust cotton' });
    }
    await design.getByRole('button', { name: 'Use as the draft' }).click();
    await expect.poll(() => design.getByTestId('block-design-summary').textContent(), { timeout: 30_000 }).toContain('Yarns kept: Charcoal cotton, Oat cotton, Rust cotton.');
    await page.getByTestId('save-status').getByText('Saved').waitFor({ timeout: 60_000 });
    const saved = await page.evaluate(async (draftId) => (await (await fetch(`/api/drafts/${draftId}`)).json()) as { draft: { document: Record<string, unknown> } }, id);
    expect(saved.draft.document.profile).toMatchObject({ unit: 'double-weave', warpColors: [[0, 1], [2]], weftColors: [[0, 1], [2]] });
    expect((saved.draft.document.warpColors as number[]).slice(0, 4)).toEqual([0, 2, 1, 2]);

    // Reopened later, the block design is the one kept with the draft.
    await page.reload();
    await design.waitFor();
    await design.getByText('(kept with this draft)').waitFor();
    expect(await design.getByLabel('Warp, Layer 1, place 2').inputValue()).toBe('1');
    await showFront(page);
    const before = (await settledCanvas(page, 'view-front')).hash;
    await screenshot(page, 'block-design-used');

    // Column 1 moves from block 1 to block 2: the faces change there.
    await design.getByRole('button', { name: 'Column 1, block 2' }).click();
    await design.getByRole('button', { name: 'Use as the draft' }).click();
    const after = (await settledCanvas(page, 'view-front', before)).hash;
    expect(after).not.toBe(before);
    await screenshot(page, 'block-design-changed');

    // End 2 (layer 2 of block 2 now, on shaft 7) moved to shaft 3, a shaft of block 1.
    const grid = page.getByTestId('draft-canvas');
    await grid.focus();
    await page.keyboard.press('ArrowRight');
    const message = page.getByTestId('editor-message');
    for (let i = 0; i < 8 && !/shaft 3:/.test((await message.textContent()) ?? ''); i++) await page.keyboard.press('ArrowDown');
    expect(await message.textContent()).toMatch(/^Threading, end 2, shaft 3:/);
    await page.keyboard.press('Space');
    const checks = page.getByTestId('checks');
    await checks.getByRole('button', { name: /^End 2 \(layer 2\) is on shaft 3/ }).waitFor({ timeout: 60_000 });
    expect(await checks.locator('li').count()).toBe(1);
    await checks.getByRole('button', { name: 'Ends on the wrong shaft (1)' }).waitFor();
    expect(await checks.textContent()).not.toMatch(/#[0-9a-f]{6}/i);
    await screenshot(page, 'block-design-checks');
    expect(app.browser.errors).toEqual([]);
    // Saves, the worker's repaints and Checks each wait for a busy machine: allow for all of them.
  }, 180_000);
});
