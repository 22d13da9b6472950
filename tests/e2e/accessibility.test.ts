// Every page and every section of a draft, signed out and signed in, checked with axe-core (Deque's
// rules for WCAG 2.0–2.2 A and AA) in Chromium: no serious or critical violation. axe cannot judge
// everything (meaning carried by colour alone inside a canvas, for one); those places have their own
// checks beside the components that draw them.
import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { demoAccounts } from '../../server/db/demo-accounts';
import { signIn, useAppAndBrowser } from '../helpers/e2e';

const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');
const lead = demoAccounts.find((a) => a.role === 'owner')!;
const WCAG_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

interface Finding { id: string; impact: string; help: string; targets: string[] }

/**
 * Opens `path`, waits until nothing is loading, and returns axe's serious and critical findings.
 * The script goes in through the DevTools protocol, which the page's Content-Security-Policy does not
 * govern (a script tag would be refused, as it should be).
 */
async function audit(page: Page, url: string): Promise<Finding[]> {
  await page.goto(url);
  await page.waitForLoadState('networkidle');
  await page.locator('main').first().waitFor();
  // A wait is a status line ending in "…" (the Spinner); audit what the weaver sees once it is gone.
  await page.waitForFunction(() => ![...document.querySelectorAll('[role="status"]')].some((s) => s.textContent?.trim().endsWith('…')));
  await page.evaluate(axeSource);
  const results = await page.evaluate(
    (tags) => (window as unknown as { axe: { run: (c: Document, o: object) => Promise<AxeResults> } }).axe
      .run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] }),
    WCAG_AA,
  );
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => ({ id: v.id, impact: v.impact!, help: v.help, targets: v.nodes.map((n) => `${n.target.join(' ')}  ${n.html.slice(0, 160)}`) }));
}

interface AxeResults {
  violations: { id: string; impact: string | null; help: string; nodes: { target: string[]; html: string }[] }[];
}

/** Draft ids of the demo drafts by name, and a public link to one of them, read through the API as the lead. */
async function demoFixtures(page: Page): Promise<{ draftId: number; studioId: number; shareToken: string }> {
  return page.evaluate(async () => {
    const json = async (res: Response) => {
      if (!res.ok) throw new Error(`${res.url}: ${res.status}`);
      return res.json();
    };
    const drafts = await json(await fetch('/api/drafts?q=table+mat'));
    const draftId: number = drafts.items[0].id;
    const studios = await json(await fetch('/api/studios'));
    const { token } = await json(await fetch('/api/csrf'));
    const link = await json(await fetch(`/api/drafts/${draftId}/share`, { method: 'POST', headers: { 'x-csrf-token': token } }));
    return { draftId, studioId: studios.studios[0].id, shareToken: link.token };
  });
}

const app = useAppAndBrowser();

/** Audits each path in turn; the report names each page, finding and element, and is empty when all pass. */
async function auditPages(page: Page, paths: string[]): Promise<string> {
  const report: string[] = [];
  for (const path of paths) {
    const findings = await audit(page, app.server.url + path);
    const lines = findings.map((f) => `${f.impact} ${f.id}: ${f.help}\n    ${f.targets.join('\n    ')}`);
    if (lines.length > 0) report.push(`${path}\n  ${lines.join('\n  ')}`);
  }
  return report.join('\n');
}

describe('accessibility (axe-core, WCAG 2.2 A and AA)', () => {
  const fixtures = { draftId: 0, studioId: 0, shareToken: '' };

  it('signed in: every page and every section of a draft', async () => {
    const { page } = app.browser;
    await signIn(page, app.server, lead.email, lead.password);
    Object.assign(fixtures, await demoFixtures(page));
    const { draftId, studioId } = fixtures;
    const pages = [
      '/drafts',
      ...['', '/plan', '/loom', '/history', '/print', '/notes', '/discussion'].map((section) => `/drafts/${draftId}${section}`),
      '/yarns', '/studios', `/studios/${studioId}`, '/account', '/join?token=not-a-real-invitation-token', '/no-such-page',
    ];
    expect(await auditPages(page, pages)).toBe('');
  }, 600_000);

  it('signed out: sign-in, sign-up, password reset, a shared draft, captured mail and a missing page', async () => {
    const { page } = app.browser;
    await app.browser.context.clearCookies();
    const pages = [
      '/sign-in', '/sign-up', '/welcome?token=not-a-real-sign-up-token', '/forgot', '/reset?token=not-a-real-reset-token', `/shared/${fixtures.shareToken}`, '/admin/mails',
      '/no-such-page',
    ];
    expect(await auditPages(page, pages)).toBe('');
  }, 600_000);
});
