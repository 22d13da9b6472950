// The At the loom page as a student meets it: open the double-weave mat at the loom, thread from
// the back of the loom for a few groups, reload, and find the same place.
import { describe, expect, it } from 'vitest';
import { demoAccounts } from '../../server/db/demo-accounts';
import { screenshot, signIn, useAppAndBrowser } from '../helpers/e2e';

/** The demo draft the test threads (its link text in the library). */
const DRAFT_LINK = /double weave table mat — harbour/i;
const student = demoAccounts.find((a) => a.role === 'viewer')!;

const app = useAppAndBrowser();

describe('At the loom', () => {
  it('threads from the back a few groups, and finds the same group after a reload', async () => {
    const { page } = app.browser;
    await page.setViewportSize({ width: 1024, height: 1366 });
    await signIn(page, app.server, student.email, student.password);

    await page.getByRole('link', { name: DRAFT_LINK }).first().click();
    await page.waitForURL(/\/drafts\/\d+$/);
    await page.getByRole('link', { name: 'At the loom' }).click();
    await page.waitForURL(/\/drafts\/\d+\/loom$/);

    const heading = page.getByRole('heading', { level: 2, name: /group \d+ of \d+/ });
    await heading.waitFor();
    await page.getByRole('button', { name: 'Threading', exact: true }).click();
    await page.getByRole('button', { name: 'Back of the loom' }).click();
    // Turning round keeps the weaver on the same end, so the group number changes; Page Up (as a
    // foot switch sends it) walks back to the first group.
    const turned = Number(/group (\d+) of/.exec((await heading.textContent()) ?? '')![1]);
    for (let i = 1; i < turned; i++) await page.keyboard.press('PageUp');
    await page.getByText(/^Threading: group 1 of \d+$/).waitFor();

    const next = page.getByRole('button', { name: /Next group/ });
    // Buttons at the loom are at least 48 px each way (a large touch target).
    const box = (await next.boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(48);
    await next.click();
    await next.click();
    await page.keyboard.press('ArrowRight');
    await page.getByText(/^Threading: group 4 of \d+$/).waitFor();
    const before = await heading.textContent();
    await page.getByText('Place saved.').waitFor();
    await page.getByRole('region', { name: 'Quick check' }).getByText(/Raise shaft \d+ alone/).first().waitFor();
    await screenshot(page, 'loom-threading-back');

    await page.reload();
    await page.getByText(/^Threading: group 4 of \d+$/).waitFor();
    expect(await heading.textContent()).toBe(before);
    // Once work has started the working order is folded away, saying what it is.
    await page.getByText(/^Working order: from the back, right to left/).waitFor();
    expect(app.browser.errors).toEqual([]);

    // At a loom with no connection: the app itself comes from the service worker's cache, and the
    // guide from the copy kept on the device; a step taken offline is kept and sent later.
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    await app.browser.context.setOffline(true);
    await page.reload();
    await page.getByText(/^Threading: group 4 of \d+$/).waitFor();
    await page.getByRole('button', { name: /Next group/ }).click();
    await page.getByText(/^Threading: group 5 of \d+$/).waitFor();
    await app.browser.context.setOffline(false);
    await page.getByText('Place saved.').waitFor({ timeout: 20_000 });
    await page.reload();
    await page.getByText(/^Threading: group 5 of \d+$/).waitFor();
  });
});
