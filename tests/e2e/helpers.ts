import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'osmolane-demo';
export const WORKSPACE = 'Tidewater Assay Lab';
export const PEOPLE = {
  owner: 'mira.okafor@example.test',
  editor: 'jonas.lindqvist@example.test',
  reviewer: 'priya.raman@example.test',
  viewer: 'tom.beck@example.test',
} as const;

/** Collects console errors, page errors and requests that leave this machine; check them at the end of a test. */
export function watch(page: Page): { errors: string[]; offsite: string[] } {
  const errors: string[] = [];
  const offsite: string[] = [];
  page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('request', (r) => {
    const url = new URL(r.url());
    if (url.hostname !== '127.0.0.1' && url.protocol !== 'data:' && url.protocol !== 'blob:') offsite.push(r.url());
  });
  return { errors, offsite };
}

/** A full-page screenshot kept as a test artifact; also checks that nothing overflows the 1280 px wide window. */
export async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `test-results/screens/${name}.png`, fullPage: true });
  const overflow = await page.evaluate(() => {
    const width = document.documentElement.clientWidth;
    const wide = Array.from(document.querySelectorAll<HTMLElement>('main *, mat-toolbar *'))
      .filter((e) => e.getBoundingClientRect().right > width + 1 && getComputedStyle(e).visibility !== 'hidden')
      .map((e) => `${e.tagName.toLowerCase()}.${e.className}`.slice(0, 80));
    return { scroll: document.documentElement.scrollWidth, width, wide: wide.slice(0, 5) };
  });
  expect(overflow.scroll, `${name}: page wider than the window`).toBeLessThanOrEqual(overflow.width);
  expect(overflow.wide, `${name}: elements reaching past the right edge`).toEqual([]);
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/');
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/workspaces/);
}

/** From the workspace list into the demo workspace's designs. */
export async function openDemoWorkspace(page: Page): Promise<void> {
  await page.getByRole('link', { name: WORKSPACE }).click();
  await expect(page).toHaveURL(/\/workspaces\/\d+\/designs$/);
  await expect(page.getByTestId('design-row').first()).toBeVisible();
}

export async function signOut(page: Page): Promise<void> {
  await page.getByTestId('user-menu').click();
  await page.getByRole('menuitem', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/sign-in/);
}
