// A student makes a studio draft their own: signs in, opens the lead's scarf, makes a new colourway
// with one colour changed, lands on their copy, and sees where it came from (and the scarf sees it too).
import { describe, expect, it } from 'vitest';
import { screenshot, signIn, useAppAndBrowser } from '../helpers/e2e';

const app = useAppAndBrowser();

describe('new colourway as a student', () => {
  it('forks the demo scarf into the student\'s own drafts and shows the lineage both ways', async () => {
    const { page } = app.browser;
    await signIn(page, app.server, 'student1@shedwright.test');

    await page.getByRole('link', { name: 'Point twill scarf' }).first().click();
    await page.waitForURL(/\/drafts\/\d+$/);
    const scarfUrl = page.url();
    await page.getByRole('button', { name: 'New colourway' }).click();

    const dialog = page.getByRole('dialog', { name: 'New colourway' });
    await dialog.getByLabel('Name').fill('Scarf in rust');
    await dialog.getByLabel('New colour for colour 1').fill('#8a3b12');
    await screenshot(page, 'fork-dialog');
    await dialog.getByRole('button', { name: 'Make colourway' }).click();

    // The copy is the student's own, with its parent named and linked.
    await page.waitForURL((url) => /\/drafts\/\d+$/.test(url.pathname) && url.href !== scarfUrl);
    await page.getByRole('heading', { level: 1, name: 'Scarf in rust' }).waitFor();
    const forkId = Number(new URL(page.url()).pathname.split('/').pop());
    // Where it came from is in the draft's Notes and photos.
    await page.getByRole('navigation', { name: 'Sections of this draft' }).getByRole('link', { name: 'Notes and photos' }).click();
    const forkedFrom = page.getByRole('list', { name: 'Made from, nearest first' });
    await forkedFrom.getByRole('link', { name: 'Point twill scarf' }).waitFor();
    expect(await forkedFrom.textContent()).toMatch(/version 1/);
    await screenshot(page, 'fork-lineage');

    // The new colour is in the saved document, and the threading is the scarf's.
    const detail = await page.evaluate(async (id) => (await fetch(`/api/drafts/${id}`)).json(), forkId);
    expect(detail.draft.document.palette[0]).toBe('#8a3b12');
    expect(detail.draft.role).toBe('owner');
    expect(detail.draft.studioId).toBeNull();

    // Back on the scarf, the student (who can see both) finds the colourway among its children.
    await forkedFrom.getByRole('link', { name: 'Point twill scarf' }).click();
    await page.waitForURL(scarfUrl);
    await page.getByRole('navigation', { name: 'Sections of this draft' }).getByRole('link', { name: 'Notes and photos' }).click();
    await page.getByRole('list', { name: 'Colourways made from this draft' }).getByRole('link', { name: 'Scarf in rust' }).waitFor();
    expect(app.browser.errors).toEqual([]);
  });
});
