// A draft's details edited in one place and agreeing everywhere: a rename reaches the library, the
// heading and the stored document (and later saves keep it); tags and notes; a personal draft moved
// into a studio is seen by the studio's viewers. Real server, MariaDB and headless Chromium.
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_STUDIO_NAME } from '../../server/db/demo-accounts';
import { screenshot, signIn, useAppAndBrowser } from '../helpers/e2e';

const app = useAppAndBrowser();

async function serverDraft(page: Page, id: number): Promise<{ name: string; tags: string[]; studioName: string | null; document: { name: string; notes: string } }> {
  return page.evaluate(async (draftId) => {
    const res = await fetch(`/api/drafts/${draftId}`, { headers: { accept: 'application/json' } });
    return ((await res.json()) as { draft: { name: string; tags: string[]; studioName: string | null; document: { name: string; notes: string } } }).draft;
  }, id);
}

/** From the library through the New draft form with its defaults and a name; returns the new draft's id. */
async function newDraft(page: Page, name: string): Promise<number> {
  await page.getByRole('link', { name: 'New draft' }).first().click();
  await page.getByLabel('Name', { exact: true }).fill(name);
  await page.getByRole('button', { name: 'Create draft' }).click();
  await page.getByTestId('draft-canvas').waitFor();
  return Number(/\/drafts\/(\d+)/.exec(page.url())![1]);
}

const section = (page: Page, name: string) => page.getByRole('navigation', { name: 'Sections of this draft' }).getByRole('link', { name });

describe('a draft\'s details', () => {
  it('a rename in the workspace shows in the library, the heading and the stored document, and drawing keeps it', async () => {
    const { page } = app.browser;
    await signIn(page, app.server, 'assistant@shedwright.test');
    const id = await newDraft(page, 'Towel trial');

    await page.getByRole('link', { name: 'Edit details' }).click();
    await page.waitForURL(/\/notes$/);
    const details = page.getByRole('form', { name: 'Name, tags and where the draft lives' });
    await details.getByLabel('Name', { exact: true }).fill('Harbour towels');
    await details.getByLabel('New tag').fill('towels');
    await details.getByRole('button', { name: 'Add tag' }).click();
    await details.getByLabel('New tag').fill('cotton');
    await details.getByLabel('New tag').press('Enter');
    await details.getByRole('button', { name: 'Remove tag cotton' }).click();
    await details.getByRole('button', { name: 'Save details' }).click();
    await page.getByRole('heading', { level: 1, name: 'Harbour towels' }).waitFor();
    await page.getByRole('form', { name: 'Notes' }).getByLabel('Notes').fill('Wet-finish hot, tumble dry.');
    await page.getByRole('button', { name: 'Save notes' }).click();
    await expect.poll(async () => (await serverDraft(page, id)).document.notes).toBe('Wet-finish hot, tumble dry.');
    await screenshot(page, 'draft-details');
    const saved = await serverDraft(page, id);
    expect(saved).toMatchObject({ name: 'Harbour towels', tags: ['towels'], document: { name: 'Harbour towels' } });

    // Drawing after the rename: the autosave keeps the new name in the document.
    await section(page, 'Design').click();
    await page.getByTestId('draft-canvas').waitFor();
    await page.getByTestId('draft-canvas').focus();
    await page.keyboard.press('Space');
    await page.getByTestId('save-status').getByText('Saved').waitFor({ timeout: 20_000 });
    await expect.poll(async () => (await serverDraft(page, id)).document).toMatchObject({ name: 'Harbour towels', notes: 'Wet-finish hot, tumble dry.' });

    await page.goto(`${app.server.url}/drafts`);
    await page.getByRole('link', { name: 'Harbour towels' }).waitFor();
    expect(await page.getByRole('link', { name: 'Towel trial' }).count()).toBe(0);
  });

  it('a personal draft moved into a studio is seen by a viewer of that studio', async () => {
    const { page, context } = app.browser;
    await context.clearCookies();
    await signIn(page, app.server, 'assistant@shedwright.test');
    const id = await newDraft(page, 'Shared later');
    await section(page, 'Notes and photos').click();
    const details = page.getByRole('form', { name: 'Name, tags and where the draft lives' });
    await details.getByLabel('Lives in').selectOption({ label: `Studio: ${DEMO_STUDIO_NAME}` });
    await details.getByRole('button', { name: 'Save details' }).click();
    await page.locator('header dd').getByText(DEMO_STUDIO_NAME).waitFor();

    await context.clearCookies();
    await signIn(page, app.server, 'student1@shedwright.test');
    await page.getByRole('link', { name: 'Shared later' }).click();
    await page.getByRole('heading', { level: 1, name: 'Shared later' }).waitFor();
    expect(page.url()).toMatch(new RegExp(`/drafts/${id}$`));
    await page.getByText('Read only: you can look, not change.').waitFor();
    expect(await page.getByRole('link', { name: 'Edit details' }).count()).toBe(0);
  });

  it('Move to Bin asks first, takes the draft out of the library, and Restore brings it back as it was', async () => {
    const { page, context } = app.browser;
    await context.clearCookies();
    await signIn(page, app.server, 'assistant@shedwright.test');
    const id = await newDraft(page, 'Binned by mistake');
    await section(page, 'Notes and photos').click();
    const asked: string[] = [];
    page.once('dialog', (d) => {
      asked.push(d.message());
      void d.accept();
    });
    await page.getByRole('button', { name: 'Move to Bin' }).click();
    await page.waitForURL(/\/bin$/);
    expect(asked).toHaveLength(1);
    expect(asked[0]).toContain('Binned by mistake');
    const row = page.getByRole('list', { name: 'Drafts in the Bin' }).getByRole('listitem').filter({ hasText: 'Binned by mistake' });
    await row.waitFor();
    expect(await row.textContent()).toMatch(/gone for good on/);
    await screenshot(page, 'bin');
    expect((await page.evaluate(async (draftId) => (await fetch(`/api/drafts/${draftId}`)).status, id))).toBe(404);

    await row.getByRole('button', { name: 'Restore Binned by mistake' }).click();
    await page.getByRole('status').getByRole('link', { name: 'Binned by mistake' }).click();
    await page.getByRole('heading', { level: 1, name: 'Binned by mistake' }).waitFor();
    await page.goto(`${app.server.url}/drafts`);
    await page.getByRole('link', { name: 'Binned by mistake' }).waitFor();
  });
});
