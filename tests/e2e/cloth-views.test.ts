// Both faces of the demo double-weave mat drawn thread by thread, as a weaver looks at them: the
// whole cloth fitted to the view, then at its actual size with a ruler. Each view is saved to
// tests/e2e/artifacts/ (cloth-front-whole, cloth-back-whole, cloth-front-actual, cloth-back-actual).
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { artifactsDir, screenshot, signIn, useAppAndBrowser } from '../helpers/e2e';

const app = useAppAndBrowser();

/** The pixels of a view's canvas, as a fingerprint and a count of distinct colours. */
async function looks(page: Page, id: string): Promise<{ hash: string; colours: number; width: number }> {
  return page.evaluate((testId) => {
    const c = document.querySelector(`[data-testid="${testId}"] canvas`) as HTMLCanvasElement;
    const data = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
    let h = 2166136261;
    const seen = new Set<number>();
    for (let i = 0; i < data.length; i += 4) {
      const v = (data[i] << 16) | (data[i + 1] << 8) | data[i + 2];
      seen.add(v);
      h = Math.imul(h ^ v, 16777619) >>> 0;
    }
    return { hash: h.toString(16), colours: seen.size, width: c.width };
  }, id);
}

/** Waits until a view's pixels have stayed the same for two seconds. */
async function settled(page: Page, id: string): Promise<{ hash: string; colours: number; width: number }> {
  await page.getByTestId(id).locator('canvas').first().waitFor();
  let last = await looks(page, id);
  let stableSince = Date.now();
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    await page.waitForTimeout(250);
    const next = await looks(page, id);
    if (next.hash !== last.hash) {
      last = next;
      stableSince = Date.now();
    } else if (Date.now() - stableSince >= 2000) break;
  }
  return last;
}

describe('the faces of the demo double weave', () => {
  it('shows the front and back thread by thread, whole and at actual size with a ruler', async () => {
    const { page } = app.browser;
    await page.setViewportSize({ width: 1440, height: 1000 });
    await signIn(page, app.server, 'lead@shedwright.test');
    await page.getByRole('link', { name: /double weave table mat — harbour/i }).click();
    await page.getByTestId('draft-canvas').waitFor();
    const views = page.getByRole('group', { name: 'Views to show' });
    for (const name of ['Front', 'Back']) {
      const button = views.getByRole('button', { name, exact: true });
      if ((await button.getAttribute('aria-pressed')) !== 'true') await button.click();
    }

    const whole: Record<string, { hash: string; colours: number }> = {};
    for (const face of ['front', 'back']) {
      const view = page.getByTestId(`view-${face}`);
      await view.getByRole('button', { name: 'Whole' }).click();
      whole[face] = await settled(page, `view-${face}`);
      // Shaded round threads, gaps and the other layer in shadow: many tones, not three flat colours.
      expect(whole[face].colours).toBeGreaterThan(12);
      await view.screenshot({ path: join(artifactsDir, `cloth-${face}-whole.png`) });
    }
    expect(whole.front.hash).not.toBe(whole.back.hash);

    for (const face of ['front', 'back']) {
      const view = page.getByTestId(`view-${face}`);
      const fitted = Number(await view.getAttribute('data-zoom'));
      await view.getByRole('button', { name: 'Actual size' }).click();
      await expect.poll(async () => view.getByRole('button', { name: 'Actual size' }).getAttribute('aria-pressed')).toBe('true');
      const actual = await settled(page, `view-${face}`);
      expect(actual.hash).not.toBe(whole[face].hash);
      // The mat is wider than the view at its actual size: the zoom differs from the fitted one.
      expect(Number(await view.getAttribute('data-zoom'))).not.toBe(fitted);
      await view.getByRole('img', { name: /inches|centimetres|ruler/i }).first().waitFor();
      await view.screenshot({ path: join(artifactsDir, `cloth-${face}-actual.png`) });
    }
    await screenshot(page, 'cloth-faces-actual-size');
    expect(app.browser.errors.filter((e) => !/thumbnail|404/.test(e))).toEqual([]);
  });
});
