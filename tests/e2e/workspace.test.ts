// The draft workspace as a weaver meets it at 1440 × 900: the grids and cloth views side by side,
// the side column beside them, the sections one click apart.
import { describe, expect, it } from 'vitest';
import { screenshot, signIn, useAppAndBrowser } from '../helpers/e2e';

const app = useAppAndBrowser();

describe('the draft workspace', () => {
  it('fits the grids, cloth views and side column in a 1440 × 900 window, with sections one click apart', async () => {
    const { page } = app.browser;
    await page.setViewportSize({ width: 1440, height: 900 });
    await signIn(page, app.server, 'lead@shedwright.test');
    await page.getByRole('link', { name: /double weave table mat — harbour/i }).click();
    await page.getByTestId('draft-canvas').waitFor();
    await page.getByTestId('view-front').locator('canvas').first().waitFor().catch(() => undefined);

    // Nothing needed while drawing is below the fold: the grids, the divider, the cloth views and the side column.
    for (const target of [
      page.getByTestId('draft-canvas'),
      page.getByTestId('split-divider'),
      page.getByRole('region', { name: 'Cloth views' }),
      page.getByRole('complementary', { name: 'Side column' }),
      page.getByRole('navigation', { name: 'Sections of this draft' }),
    ]) {
      const box = await target.boundingBox();
      expect(box).not.toBeNull();
      expect(box!.y + Math.min(box!.height, 200)).toBeLessThanOrEqual(900);
    }
    const grid = (await page.getByTestId('draft-canvas').boundingBox())!;
    expect(grid.y + grid.height).toBeLessThanOrEqual(900);
    const views = (await page.getByRole('region', { name: 'Cloth views' }).boundingBox())!;
    expect(views.x).toBeGreaterThan(grid.x + grid.width - 1);
    await screenshot(page, 'workspace-double-weave-1440x900');

    // Dragging the divider gives the grids more room.
    const divider = (await page.getByTestId('split-divider').boundingBox())!;
    await page.mouse.move(divider.x + divider.width / 2, divider.y + divider.height / 2);
    await page.mouse.down();
    await page.mouse.move(divider.x + 120, divider.y + divider.height / 2, { steps: 4 });
    await page.mouse.up();
    await expect.poll(async () => (await page.getByTestId('draft-canvas').boundingBox())!.width).toBeGreaterThan(grid.width + 60);

    // Each section has its own address, one click from the bar.
    const bar = page.getByRole('navigation', { name: 'Sections of this draft' });
    await bar.getByRole('link', { name: 'Plan' }).click();
    await page.waitForURL(/\/drafts\/\d+\/plan$/);
    await page.getByRole('heading', { level: 2, name: 'Plan' }).waitFor();
    await bar.getByRole('link', { name: 'Discussion' }).click();
    await page.getByRole('region', { name: 'Comments' }).waitFor();
    await bar.getByRole('link', { name: 'Design' }).click();
    await page.getByTestId('draft-canvas').waitFor();
    expect(app.browser.errors.filter((e) => !/thumbnail|404/.test(e))).toEqual([]);
  });
});
