import { expect, test } from '@playwright/test';

test('the app shell loads with the bundled font, a healthy server and a running solver worker', async ({ page, baseURL }) => {
  const consoleErrors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
  page.on('pageerror', (e) => consoleErrors.push(e.message));
  const offsite: string[] = [];
  const fontFiles: string[] = [];
  page.on('request', (r) => {
    const url = new URL(r.url());
    if (url.hostname !== '127.0.0.1' && url.protocol !== 'data:' && url.protocol !== 'blob:') offsite.push(r.url());
    if (/ibm-plex-sans-latin-400-normal.*\.woff2$/.test(url.pathname)) fontFiles.push(url.pathname);
  });

  await page.goto('/');
  await expect(page.getByRole('heading', { name: 'Osmolane' })).toBeVisible();
  await expect(page.getByTestId('server-status')).toHaveText(/^ok, database ok/);
  await expect(page.getByTestId('worker-status')).toHaveText('ready');

  const bodyFont = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
  expect(bodyFont).toContain('IBM Plex Sans');
  await page.evaluate(() => document.fonts.ready);
  expect(await page.evaluate(() => document.fonts.check('16px "IBM Plex Sans"'))).toBe(true);
  expect(fontFiles.length).toBeGreaterThan(0);

  const health = await (await page.request.get(`${baseURL}/api/health`)).json();
  expect(health).toMatchObject({ status: 'ok', database: 'ok' });

  await page.screenshot({ path: 'test-results/screens/shell.png', fullPage: true });
  expect(offsite).toEqual([]);
  expect(consoleErrors).toEqual([]);
});
