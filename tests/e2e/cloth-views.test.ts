// Both faces of the demo double-weave mat drawn thread by thread, as a weaver looks at them: the
// whole cloth fitted to the view, then at its actual size with a ruler. Each view is saved to
// tests/e2e/artifacts/ (cloth-front-whole, cloth-back-whole, cloth-front-actual, cloth-back-actual).
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { artifactsDir, screenshot, settledCanvas, signIn, useAppAndBrowser, type CanvasLook } from '../helpers/e2e';

const app = useAppAndBrowser();

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

    const whole: Record<string, CanvasLook> = {};
    for (const face of ['front', 'back']) {
      const view = page.getByTestId(`view-${face}`);
      await view.getByRole('button', { name: 'Whole' }).click();
      whole[face] = await settledCanvas(page, `view-${face}`);
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
      const actual = await settledCanvas(page, `view-${face}`, whole[face].hash);
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
