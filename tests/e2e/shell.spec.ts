import { expect, test } from '@playwright/test';
import { shot, watch } from './helpers';

test('a signed-out visitor lands on sign-in; the bundled font is used, the server is healthy and the solver worker starts', async ({ page, baseURL }) => {
  const seen = watch(page);
  const fontFiles: string[] = [];
  page.on('request', (r) => {
    const url = new URL(r.url());
    if (/ibm-plex-sans-latin-400-normal.*\.woff2$/.test(url.pathname)) fontFiles.push(url.pathname);
  });

  await page.goto('/');
  await expect(page).toHaveURL(/\/sign-in$/);
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await expect(page.getByRole('link', { name: /Osmolane/ })).toBeVisible();

  // The About panel reads the server's health and starts the solver worker.
  await page.getByRole('button', { name: 'About Osmolane' }).click();
  await expect(page.getByRole('dialog', { name: 'About Osmolane' })).toBeVisible();
  await expect(page.getByTestId('server-status')).toHaveText(/^ok, database ok/);
  await expect(page.getByTestId('worker-status')).toHaveText('ready');
  await shot(page, 'about');
  await page.getByRole('button', { name: 'Close' }).click();

  const bodyFont = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
  expect(bodyFont).toContain('IBM Plex Sans');
  await page.evaluate(() => document.fonts.ready);
  expect(await page.evaluate(() => document.fonts.check('16px "IBM Plex Sans"'))).toBe(true);
  expect(fontFiles.length).toBeGreaterThan(0);
  // Material Symbols are bundled too: an icon renders with the icon font, not as its ligature text's width.
  expect(await page.evaluate(() => document.fonts.check('24px "Material Symbols Outlined"'))).toBe(true);

  const health = await (await page.request.get(`${baseURL}/api/health`)).json();
  expect(health).toMatchObject({ status: 'ok', database: 'ok' });

  await shot(page, 'sign-in');
  expect(seen.offsite).toEqual([]);
  expect(seen.errors).toEqual([]);
});

test('signing in works with the keyboard alone', async ({ page }) => {
  await page.goto('/sign-in');
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await page.keyboard.press('Tab'); // brand link
  let guard = 0;
  while (!(await page.getByLabel('E-mail').evaluate((e) => e === document.activeElement)) && guard++ < 10) await page.keyboard.press('Tab');
  await page.keyboard.type('jonas.lindqvist@example.test');
  await page.keyboard.press('Tab');
  await expect(page.getByLabel('Password')).toBeFocused();
  await page.keyboard.type('osmolane-demo');
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/\/workspaces$/);
  await expect(page.getByRole('link', { name: 'Tidewater Assay Lab' })).toBeVisible();
});
