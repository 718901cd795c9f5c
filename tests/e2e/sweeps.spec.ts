import { expect, test } from '@playwright/test';
import { PEOPLE, openDemoWorkspace, shot, signIn, watch } from './helpers';

test('an editor sweeps the serpentine’s depth on the worker, reads the table, opens a point as a run, and sweeps a port potential by superposition', async ({ page }) => {
  test.setTimeout(120_000);
  const seen = watch(page);
  await signIn(page, PEOPLE.editor);
  await openDemoWorkspace(page);
  await page.getByTestId('design-link').filter({ hasText: 'Serpentine separation channel' }).first().click();
  await expect(page).toHaveURL(/\/designs\/\d+$/);
  await page.getByRole('tab', { name: 'Sweeps' }).click();

  // Define: depth from 15 to 25 um in 3 steps on a coarse grid.
  const form = page.locator('osm-sweep-form');
  await page.getByTestId('new-sweep').click();
  await expect(form.getByTestId('sweep-summary')).toBeVisible();
  await form.getByTestId('sweep-field-1').click();
  await page.getByRole('option', { name: 'Depth', exact: true }).click();
  await form.getByTestId('sweep-from-1').fill('15 um');
  await form.getByTestId('sweep-to-1').fill('25 um');
  await form.getByTestId('sweep-steps-1').fill('3');
  await form.getByTestId('sweep-cells').fill('60');
  await form.getByTestId('sweep-cells').press('Tab');
  await expect(form.getByTestId('sweep-summary')).toContainText('3 points · one job each for the sweep workers');
  await shot(page, 'sweep-define');
  await form.getByTestId('run-sweep').click();

  // Watch it run on the server's worker and finish.
  await expect(page.getByTestId('sweep-state')).toHaveText('solved', { timeout: 90_000 });
  await expect(page.getByTestId('sweep-progress')).toHaveText('3 of 3 points');
  await expect(page.getByText('Solved point by point by the workers')).toBeVisible();

  // The table under the plots: one row per depth, solved, with the port currents.
  const rows = page.getByTestId('sweep-row');
  await expect(rows).toHaveCount(3);
  const cells = await rows.evaluateAll((trs) => trs.map((tr) => Array.from(tr.querySelectorAll('td')).map((td) => td.textContent!.trim())));
  expect(cells.map((r) => r[1])).toEqual(['15 µm', '20 µm', '25 µm']);
  expect(cells.map((r) => r[2])).toEqual(['solved', 'solved', 'solved']);
  const headers = await page.getByTestId('sweep-table').locator('th').allTextContents();
  expect(headers.map((h) => h.trim())).toEqual(expect.arrayContaining(['Depth', 'Current at IN', 'Current at OUT', 'Largest field strength']));
  // Deeper channels carry proportionally more current at the same voltage.
  const current = (r: string[]) => Number.parseFloat(r[headers.findIndex((h) => h.trim() === 'Current at IN')]);
  expect(current(cells[2]) / current(cells[0])).toBeCloseTo(25 / 15, 1);
  await expect(page.locator('osm-sweep-plot')).toHaveCount(6);
  await expect(page.locator('osm-sweep-plot circle.dot')).not.toHaveCount(0);
  await shot(page, 'sweep-solved');

  // A click on a point, then open it as a run of the revision.
  await rows.nth(1).click();
  await expect(page.getByTestId('picked-point')).toContainText('Point 2');
  await page.getByTestId('open-point').click();
  await expect(page).toHaveURL(/tab=fields/);
  await expect(page).toHaveURL(/run=\d+/);
  await expect(page.getByTestId('run-shown')).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId('fields-error')).toHaveCount(0);

  // Two port potentials superpose: answered when the sweep is made, shown as a map.
  await page.getByRole('tab', { name: 'Sweeps' }).click();
  await page.getByTestId('new-sweep').click();
  await expect(form.getByTestId('sweep-summary')).toBeVisible();
  await form.getByTestId('sweep-field-1').click();
  await page.getByRole('option', { name: 'Port IN potential', exact: true }).click();
  await form.getByTestId('sweep-steps-1').fill('5');
  await form.getByRole('button', { name: 'Second parameter (a map)' }).click();
  await form.getByTestId('sweep-field-2').click();
  await page.getByRole('option', { name: 'Port OUT potential', exact: true }).click();
  await form.getByTestId('sweep-parameter-2').locator('mat-button-toggle', { hasText: 'List' }).click();
  await form.getByTestId('sweep-list-2').fill('0 V, 100 V, -200 V');
  await form.getByTestId('sweep-list-2').press('Tab');
  await form.getByTestId('sweep-cells').fill('60');
  await form.getByTestId('sweep-cells').press('Tab');
  await expect(form.getByTestId('sweep-summary')).toContainText('15 points · answered at once by superposing');
  await form.getByTestId('run-sweep').click();
  await expect(page.getByTestId('sweep-state')).toHaveText('solved');
  await expect(page.getByText('Answered at once by superposition')).toBeVisible();
  await expect(page.getByTestId('sweep-row')).toHaveCount(15);
  await expect(page.locator('osm-sweep-map rect.cell')).toHaveCount(15);
  await expect(page.locator('osm-sweep-map osm-colour-bar')).toBeVisible();
  await page.locator('osm-sweep-map rect.cell[data-index="7"]').click();
  await expect(page.getByTestId('picked-point')).toContainText('Point 8');
  await shot(page, 'sweep-map');
  await expect(page.getByTestId('sweep-list-row').first()).toContainText('Port IN potential × Port OUT potential');

  expect(seen.offsite).toEqual([]);
  expect(seen.errors).toEqual([]);
});
