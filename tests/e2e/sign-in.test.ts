// The foundation as a person meets it: the built app served by the real server, each demo role
// signs in through the form and sees the drafts library with what that role may see.
import { describe, expect, it } from 'vitest';
import { demoAccounts } from '../../server/db/demo-accounts';
import { screenshot, useAppAndBrowser } from '../helpers/e2e';

const app = useAppAndBrowser();

describe('signing in as each demo role', () => {
  for (const account of demoAccounts) {
    it(`${account.role} ${account.email} signs in and sees the library`, async () => {
      const { page } = app.browser;
      await app.browser.context.clearCookies();
      await page.goto(`${app.server.url}/drafts`);
      // Signed out, the guard sends the visitor to the sign-in page.
      await page.waitForURL(/\/sign-in/);
      await page.getByLabel('E-mail').fill(account.email);
      await page.getByLabel('Password').fill(account.password);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.waitForURL(/\/drafts/);
      await page.getByRole('heading', { name: 'Drafts' }).first().waitFor();
      await expect(page.getByRole('button', { name: 'Sign out' })).toBeTruthy();
      await page.getByText(account.name).first().waitFor();

      if (account.role === 'admin') {
        // The site admin is in no studio: the studio's drafts are not theirs to see.
        await page.getByText('No drafts yet').waitFor();
      } else {
        await page.getByRole('link', { name: 'Point twill scarf' }).waitFor();
        await page.getByRole('link', { name: /double weave table mat — harbour/i }).waitFor();
        // The second colourway is a fork of the first, made in the studio.
        await page.getByRole('link', { name: /double weave table mat — meadow/i }).waitFor();
      }
      await screenshot(page, `library-${account.role}-${account.email.split('@')[0]}`);
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.waitForURL(/\/sign-in/);
    });
  }

  it('a wrong password is refused with a plain message and no console errors beyond the 401', async () => {
    const { page } = app.browser;
    await page.goto(`${app.server.url}/sign-in`);
    await page.getByLabel('E-mail').fill('lead@shedwright.test');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('That e-mail and password do not match an account.').waitFor();
    expect(page.url()).toMatch(/\/sign-in/);
    expect(app.browser.errors.filter((e) => !/401|Unauthorized/.test(e))).toEqual([]);
  });
});
