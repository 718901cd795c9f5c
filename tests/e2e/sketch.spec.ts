import { expect, test, type Page } from '@playwright/test';
import { DEMO_PASSWORD, PEOPLE, openDemoWorkspace, signIn, watch } from './helpers';

/** Screen position of a layout point given in micrometres, from the drawing's view ("tx ty k", y flipped). */
async function pointOnLayout(page: Page, xUm: number, yUm: number): Promise<{ x: number; y: number }> {
  const canvas = page.locator('osm-sketch-editor osm-sketch-canvas');
  const [tx, ty, k] = ((await canvas.getAttribute('data-view')) ?? '').split(' ').map(Number);
  const box = (await canvas.locator('svg').boundingBox())!;
  return { x: box.x + tx + k * xUm, y: box.y + ty - k * yUm };
}

async function clickLayout(page: Page, xUm: number, yUm: number): Promise<void> {
  const p = await pointOnLayout(page, xUm, yUm);
  await page.mouse.click(p.x, p.y);
}

test('a designer draws a T junction from scratch with the Straight and Port tools', async ({ page, baseURL }) => {
  const seen = watch(page);
  await signIn(page, PEOPLE.editor);
  await openDemoWorkspace(page);

  await page.getByTestId('new-design').click();
  const dialog = page.getByRole('dialog');
  const name = `T junction drawn by hand ${Date.now()}`;
  await dialog.getByLabel('Name').fill(name);
  await page.getByTestId('template-blank').click();
  await dialog.getByRole('button', { name: 'Create design' }).click();
  await expect(page).toHaveURL(/\/designs\/\d+$/);
  const id = /\/designs\/(\d+)$/.exec(page.url())![1];
  const editor = page.locator('osm-sketch-editor');
  await expect(editor.getByTestId('sketch-tools')).toBeVisible();
  await expect(editor.getByText('0 shapes · 0 ports')).toBeVisible();

  // Three channels by their centre lines, meeting at (400, 300) um: a through channel and a side leg.
  await editor.getByTestId('tool-straight').click();
  await expect(editor.getByTestId('straight-width')).toHaveValue('50 µm');
  await clickLayout(page, 100, 300);
  await clickLayout(page, 400, 300);
  await clickLayout(page, 400, 300);
  await clickLayout(page, 700, 300);
  await clickLayout(page, 400, 300);
  await clickLayout(page, 400, 0);
  await expect(editor.getByText('3 shapes · 0 ports')).toBeVisible();

  // Three ports, each a click on a channel end.
  await editor.getByTestId('tool-port').click();
  await clickLayout(page, 99, 310);
  await clickLayout(page, 701, 290);
  await clickLayout(page, 410, -1);
  await expect(editor.getByText('3 shapes · 3 ports')).toBeVisible();
  await expect(editor.locator('text.port-label')).toHaveText(['A', 'B', 'C']);

  // Undo takes the last port away and redo brings it back.
  await page.keyboard.press('Control+z');
  await expect(editor.getByText('3 shapes · 2 ports')).toBeVisible();
  await page.keyboard.press('Control+Shift+z');
  await expect(editor.getByText('3 shapes · 3 ports')).toBeVisible();

  // The checks see one connected piece with its ports; what is left is that nothing drives it yet.
  await editor.getByTestId('tool-select').click();
  await expect(editor.getByTestId('problems')).toContainText('Nothing drives current or flow');
  await expect(editor.getByTestId('problems')).not.toContainText('not on the outline');
  await expect(editor.getByTestId('problems')).not.toContainText('touches no port');

  // The draft is saved; the document on the server has the three channels and three ports across their ends.
  await expect(page.getByTestId('save-state')).toHaveAttribute('data-state', 'saved', { timeout: 15_000 });
  const session = await (await page.request.post(`${baseURL}/api/auth/sign-in`, { data: { email: PEOPLE.editor, password: DEMO_PASSWORD } })).json();
  const design = await (await page.request.get(`${baseURL}/api/designs/${id}`, { headers: { Authorization: `Bearer ${session.token}` } })).json();
  const doc = design.document;
  expect(doc.shapes).toHaveLength(3);
  expect(doc.shapes.every((s: { type: string; height: number }) => s.type === 'rect' && Math.abs(s.height - 5e-5) < 1e-12)).toBe(true);
  expect(doc.ports.map((p: { id: string }) => p.id)).toEqual(['A', 'B', 'C']);
  const um = (v: number) => Math.round(v * 1e6 * 1000) / 1000;
  const ends = doc.ports.map((p: { from: number[]; to: number[] }) => [p.from.map(um), p.to.map(um)]);
  expect(ends).toEqual([
    [[100, 325], [100, 275]],
    [[700, 275], [700, 325]],
    [[375, 0], [425, 0]],
  ]);

  // Select the side leg for the picture: its handle and exact dimensions show.
  await clickLayout(page, 400, 150);
  await expect(page.getByTestId('inspector-heading')).toContainText('Rectangle');
  await page.mouse.move((await pointOnLayout(page, 560, 140)).x, (await pointOnLayout(page, 560, 140)).y);
  await page.screenshot({ path: 'test-results/screens/sketch.png', fullPage: true });

  expect(seen.offsite).toEqual([]);
  expect(seen.errors).toEqual([]);
});
