import { expect, test, type Page } from '@playwright/test';
import { PEOPLE, openDemoWorkspace, shot, signIn, watch } from './helpers';

/**
 * The analysis tabs of the design page through the real server and the real solver worker, on the demo cross
 * injector (50 um legs; sample 400 V, sample waste 0 V, buffer and waste 250 V; 10 mM buffer at 25 °C).
 */

/** A screenshot of a zoomed map: the map's own drawing runs past its (clipping) box, nothing else may. */
async function zoomedShot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `test-results/screens/${name}.png`, fullPage: true });
  const wide = await page.evaluate(() => {
    const width = document.documentElement.clientWidth;
    return Array.from(document.querySelectorAll<HTMLElement>('main *'))
      .filter((e) => !e.closest('osm-tracer-map svg'))
      .filter((e) => e.getBoundingClientRect().right > width + 1 && getComputedStyle(e).visibility !== 'hidden')
      .map((e) => `${e.tagName.toLowerCase()}.${String(e.className)}`.slice(0, 80));
  });
  expect(wide, `${name}: elements reaching past the right edge`).toEqual([]);
}

async function openCross(page: Page, tab: string): Promise<void> {
  await signIn(page, PEOPLE.editor);
  await openDemoWorkspace(page);
  await page.getByTestId('design-link').filter({ hasText: 'Cross injector' }).first().click();
  await expect(page.getByTestId('design-name')).toHaveText(/Cross injector/);
  await page.getByRole('tab', { name: tab, exact: true }).click();
}

test('Compare: slip and pressure at the matched flow rate, side by side', async ({ page }) => {
  test.setTimeout(180_000);
  const seen = watch(page);
  await openCross(page, 'Compare');
  const tab = page.locator('osm-compare-tab');
  // The strongest electrode, the sample port S at 400 V, is picked.
  await expect(tab.getByTestId('compare-port')).toContainText('S');
  await tab.getByTestId('compare-run').click();
  await expect(tab.getByTestId('matched-flow')).toBeVisible({ timeout: 120_000 });
  const ratio = Number(await tab.getByTestId('matched-flow').getAttribute('data-ratio'));
  expect(ratio).toBeCloseTo(1, 6);
  await expect(tab.getByTestId('compare-map-slip')).toBeVisible();
  await expect(tab.getByTestId('compare-map-pressure')).toBeVisible();
  await expect(tab.getByTestId('compare-colour-bar')).toContainText('mm/s');
  await expect(tab.getByTestId('compare-profile').locator('path[data-series]')).toHaveCount(2);
  console.log(`browser compare, demo cross, default grid: ${Number(await tab.getByTestId('compare-status').getAttribute('data-ms')).toFixed(0)} ms`);
  await shot(page, 'compare-speed');
  await tab.getByTestId('compare-map-vorticity').click();
  await expect(tab.getByTestId('compare-colour-bar')).toContainText('1/s');
  await shot(page, 'compare-vorticity');
  expect(seen.errors).toEqual([]);
  expect(seen.offsite).toEqual([]);
});

test('Tracer: a pinched plug at the cross, animated, with its arrival statistics', async ({ page }) => {
  test.setTimeout(300_000);
  const seen = watch(page);
  await openCross(page, 'Tracer');
  const tab = page.locator('osm-tracer-tab');
  await tab.getByTestId('tracer-mode-pinched').click();
  await expect(tab.getByTestId('tracer-phases')).toBeVisible();
  await expect(tab.getByTestId('tracer-phase-0-S')).toHaveValue('400 V');
  await tab.getByTestId('tracer-particles').fill('600');
  await tab.getByTestId('tracer-particles').press('Tab');
  await tab.getByTestId('tracer-seed').fill('7');
  await tab.getByTestId('tracer-seed').press('Tab');
  await shot(page, 'tracer-setup');
  await tab.getByTestId('tracer-run').click();
  await expect(tab.getByTestId('tracer-stats')).toBeVisible({ timeout: 240_000 });
  const arrived = Number(await tab.getByTestId('stat-arrived').getAttribute('data-value'));
  expect(arrived).toBeGreaterThan(10);
  expect(arrived).toBeLessThan(600);
  expect(Number(await tab.getByTestId('stat-plates').getAttribute('data-value'))).toBeGreaterThan(1);
  expect(Number(await tab.getByTestId('stat-height').getAttribute('data-value'))).toBeGreaterThan(0);
  await expect(tab.getByTestId('stat-seed')).toContainText('7');
  await expect(tab.getByTestId('arrival-histogram').locator('rect.bar').first()).toBeVisible();
  console.log(`browser trace, pinched plug, 600 particles, default grid: ${Number(await tab.getByTestId('tracer-status').getAttribute('data-ms')).toFixed(0)} ms`);
  // The animation runs through the frames: loading, then dispensing.
  await expect(tab.getByTestId('tracer-frame')).toContainText('dispensing', { timeout: 15_000 });
  await shot(page, 'tracer-pinched-plug');
  // Close on the cross and the detector, paused part way through dispensing.
  await tab.getByTestId('tracer-view-focus').click();
  await tab.getByTestId('tracer-play').click();
  await zoomedShot(page, 'tracer-pinched-plug-close');
  expect(seen.errors).toEqual([]);
});

test('Planner: plan a speed target, tiny residual, and a slider moves the map', async ({ page }) => {
  test.setTimeout(240_000);
  const seen = watch(page);
  await openCross(page, 'Planner');
  const tab = page.locator('osm-planner-tab');
  await expect(tab.getByTestId('planner-map')).toBeVisible({ timeout: 180_000 });
  await expect(tab.getByTestId('planner-responses')).toContainText('4 unit responses');
  // The default target: 1 mm/s out of the grounded sample-waste port, SW held at ground.
  await expect(tab.getByTestId('target-value-0')).toHaveValue('1 mm/s');
  await tab.getByTestId('planner-plan').click();
  const residual = tab.getByTestId('planner-residual').first();
  await expect(residual).toBeVisible();
  expect(Number(await residual.getAttribute('data-share'))).toBeLessThan(1e-6);
  await shot(page, 'planner-planned');

  const flowBefore = Number(await tab.getByTestId('planner-live-W').getAttribute('data-flow'));
  const thumb = tab.getByTestId('planner-slider-W').locator('input');
  await thumb.focus();
  for (let k = 0; k < 40; k++) await thumb.press('ArrowRight');
  await expect.poll(async () => Number(await tab.getByTestId('planner-live-W').getAttribute('data-flow'))).not.toBeCloseTo(flowBefore, 15);
  const ms = Number(await tab.getByTestId('planner-step-ms').getAttribute('data-ms'));
  console.log(`browser slider step (speed map recombined from 4 unit responses): ${ms.toFixed(2)} ms`);
  expect(ms).toBeGreaterThan(0);
  await shot(page, 'planner-slider');
  expect(seen.errors).toEqual([]);
});

test('Double layer: the Debye length of the design’s buffer, 3.04 nm at 10 mM and 25 °C', async ({ page }) => {
  const seen = watch(page);
  await openCross(page, 'Double layer');
  const tab = page.locator('osm-double-layer-tab');
  await expect(tab.getByTestId('debye-length')).toHaveText('3.04 nm');
  await expect(tab.getByTestId('edl-narrowest')).toHaveText('50 µm', { timeout: 20_000 });
  await expect(tab.getByTestId('edl-verdict')).toContainText('model holds');
  await expect(tab.getByTestId('edl-plot-potential').locator('path[data-series]')).toHaveCount(2);
  await shot(page, 'double-layer');
  await tab.getByTestId('axis-debye').click();
  await tab.getByTestId('edl-ionic-strength').fill('0.1 mM');
  await tab.getByTestId('edl-ionic-strength').press('Enter');
  await expect(tab.getByTestId('debye-length')).toHaveText('30.4 nm');
  await shot(page, 'double-layer-dilute');
  expect(seen.errors).toEqual([]);
});
