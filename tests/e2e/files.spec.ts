import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { openDemoWorkspace, PEOPLE, shot, signIn, watch } from './helpers';

/**
 * Files in and out in the browser: import an SVG outline (preview with what was skipped, then create), solve the
 * imported layout, save a revision and a run, and download the run's PDF report and the mask outline.
 */

/** A 1 mm straight channel, 50 um wide, drawn in um (10 mm wide document over a 10000-unit viewBox), with two ports. */
const SVG = `<?xml version="1.0" encoding="UTF-8"?>
<svg xmlns="http://www.w3.org/2000/svg" width="1.2mm" height="0.2mm" viewBox="-100 -150 1200 200">
  <title>Straight test channel</title>
  <g id="outline"><rect x="0" y="-50" width="1000" height="50"/></g>
  <g id="ports">
    <line data-port="A" data-potential="10" x1="0" y1="-50" x2="0" y2="0"/>
    <line data-port="B" data-potential="0" x1="1000" y1="-50" x2="1000" y2="0"/>
  </g>
  <text x="10" y="-100">not an outline</text>
</svg>
`;

test('import an SVG outline, solve it and download the run report', async ({ page }) => {
  test.setTimeout(120_000);
  const seen = watch(page);
  await signIn(page, PEOPLE.editor);
  await openDemoWorkspace(page);

  // Import: preview first, with what was found and what was skipped.
  await page.getByTestId('import-outline').click();
  await page.getByTestId('import-file').setInputFiles({ name: 'straight.svg', mimeType: 'image/svg+xml', buffer: Buffer.from(SVG) });
  const report = page.getByTestId('import-report');
  await expect(report).toContainText('1 fluid outline(s) and 0 cut-out(s)');
  await expect(report).toContainText('2 ports');
  await expect(report).toContainText('<text>');
  await expect(report).toContainText('not part of an outline');
  await page.getByTestId('import-name').fill('Imported straight channel');
  await shot(page, 'files-import-preview');
  await page.getByTestId('import-create').click();
  await expect(page).toHaveURL(/\/designs\/\d+/);
  await expect(page.getByTestId('design-name')).toHaveText('Imported straight channel');

  // A revision, then solve on the Fields tab and keep the run.
  await page.getByTestId('save-revision').click();
  await page.getByLabel('Note').fill('imported from straight.svg');
  await page.getByTestId('revision-save').click();
  await page.getByRole('tab', { name: 'Fields' }).click();
  await page.getByTestId('solve').click();
  await expect(page.getByTestId('field-map')).toBeVisible({ timeout: 60_000 });
  await expect(page.getByTestId('save-run')).toBeEnabled();
  await page.getByTestId('save-run').click();
  await expect(page.getByTestId('save-blocker')).toHaveText('Saved with the revision.');

  // The report of that run, from the Export menu.
  await page.getByTestId('export-menu').click();
  await expect(page.getByTestId('export-report')).toBeVisible();
  const [pdf] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-report').click()]);
  expect(pdf.suggestedFilename()).toMatch(/report\.pdf$/);
  const bytes = readFileSync((await pdf.path())!);
  expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  expect(bytes.length).toBeGreaterThan(10_000);

  // And the outline for the mask.
  await page.getByTestId('export-menu').click();
  const [dxf] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-outline-dxf').click()]);
  expect(dxf.suggestedFilename()).toMatch(/outline\.dxf$/);
  expect(readFileSync((await dxf.path())!, 'utf8')).toContain('$INSUNITS');

  expect(seen.offsite).toEqual([]);
  expect(seen.errors).toEqual([]);
});
