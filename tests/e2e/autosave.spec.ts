import { expect, test, type APIRequestContext } from '@playwright/test';
import { DEMO_PASSWORD, PEOPLE, openDemoWorkspace, shot, signIn, watch } from './helpers';

async function bearer(request: APIRequestContext, email: string): Promise<Record<string, string>> {
  const session = await (await request.post('/api/auth/sign-in', { data: { email, password: DEMO_PASSWORD } })).json();
  return { Authorization: `Bearer ${session.token}` };
}

test('the draft saves itself; when someone saved first the editor chooses, and nothing is overwritten silently', async ({ page, request }) => {
  const seen = watch(page);
  await signIn(page, PEOPLE.editor);
  await openDemoWorkspace(page);
  await page.getByTestId('new-design').click();
  const dialog = page.getByRole('dialog', { name: 'New design' });
  await dialog.getByLabel('Name').fill(`Autosave check ${Date.now()}`);
  await dialog.getByTestId('template-straight').click();
  await dialog.getByRole('button', { name: 'Create design' }).click();
  await expect(page).toHaveURL(/\/designs\/\d+$/);
  const id = /\/designs\/(\d+)/.exec(page.url())![1];

  // An edit in Conditions is saved after a quiet moment, and is there after a reload.
  await page.getByRole('tab', { name: 'Conditions' }).click();
  await page.getByTestId('depth').fill('25 um');
  await page.getByTestId('depth').press('Enter');
  await expect(page.getByTestId('save-state')).toHaveAttribute('data-state', /pending|saving/);
  await expect(page.getByTestId('save-state')).toHaveAttribute('data-state', 'saved', { timeout: 10_000 });
  await page.reload();
  await expect(page.getByTestId('depth')).toHaveValue('25 µm');
  const saved = await (await request.get(`/api/designs/${id}`, { headers: await bearer(request, PEOPLE.editor) })).json();
  expect(saved.document.depth).toBeCloseTo(25e-6, 12);

  // Mira saves the same design from elsewhere meanwhile.
  const mira = await bearer(request, PEOPLE.owner);
  const current = await (await request.get(`/api/designs/${id}`, { headers: mira })).json();
  const theirs = { ...current.document, depth: 40e-6 };
  expect((await request.put(`/api/designs/${id}`, { headers: mira, data: { document: theirs, version: current.version } })).status()).toBe(200);

  // Jonas's next edit meets the conflict: a dialog asks; taking theirs shows Mira's depth.
  await page.getByTestId('depth').fill('30 um');
  await page.getByTestId('depth').press('Enter');
  const conflict = page.getByRole('dialog', { name: 'Someone saved this design first' });
  await expect(conflict).toBeVisible({ timeout: 10_000 });
  await expect(conflict).toContainText('Mira Okafor');
  await expect(page.getByTestId('save-state')).toHaveAttribute('data-state', 'conflict');
  await shot(page, 'design-conflict');
  await conflict.getByTestId('conflict-theirs').click();
  await expect(page.getByTestId('depth')).toHaveValue('40 µm');
  await expect(page.getByTestId('save-state')).toHaveAttribute('data-state', 'saved');
  const after = await (await request.get(`/api/designs/${id}`, { headers: mira })).json();
  expect(after.document.depth).toBeCloseTo(40e-6, 12);

  // Once more, and this time Jonas overwrites with his own.
  const again = await (await request.get(`/api/designs/${id}`, { headers: mira })).json();
  await request.put(`/api/designs/${id}`, { headers: mira, data: { document: { ...again.document, depth: 45e-6 }, version: again.version } });
  await page.getByTestId('depth').fill('33 um');
  await page.getByTestId('depth').press('Enter');
  await expect(conflict).toBeVisible({ timeout: 10_000 });
  await conflict.getByTestId('conflict-overwrite').click();
  await expect(page.getByTestId('save-state')).toHaveAttribute('data-state', 'saved', { timeout: 10_000 });
  const final = await (await request.get(`/api/designs/${id}`, { headers: mira })).json();
  expect(final.document.depth).toBeCloseTo(33e-6, 12);

  expect(seen.offsite).toEqual([]);
  // The two refused saves (409) show in the browser's log as failed loads; nothing else may appear.
  expect(seen.errors.filter((e) => !/status of 409/.test(e))).toEqual([]);
});
