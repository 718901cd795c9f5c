import { expect, test } from '@playwright/test';
import { DEMO_PASSWORD, PEOPLE, WORKSPACE, shot, signOut, watch } from './helpers';

test('a new member joins, forgets the password, resets it from the mail, signs in and changes it', async ({ page, request }) => {
  const seen = watch(page);
  const email = `lena.moreau.${Date.now()}@example.test`;

  // The owner's invitation, through the API (the owner's screens are covered elsewhere).
  const owner = await (await request.post('/api/auth/sign-in', { data: { email: PEOPLE.owner, password: DEMO_PASSWORD } })).json();
  const auth = { Authorization: `Bearer ${owner.token}` };
  const workspaces = await (await request.get('/api/workspaces', { headers: auth })).json();
  const ws = workspaces.find((w: { name: string }) => w.name === WORKSPACE);
  expect((await request.post(`/api/workspaces/${ws.id}/invitations`, { headers: auth, data: { email, role: 'reviewer' } })).status()).toBe(201);
  const invitation = (await (await request.get('/api/dev/mailbox')).json()).find((m: { to: string[] }) => m.to.includes(email));
  const text: string = (await (await request.get(`/api/dev/mailbox/${invitation.id}`)).json()).text;
  const link = new URL(/https?:\/\/\S+\/invite\?token=\S+/.exec(text)![0]);

  await page.goto(link.pathname + link.search);
  await page.getByLabel('Your name').fill('Lena Moreau');
  await page.getByLabel('Password', { exact: true }).fill('first-pass-phrase');
  await page.getByLabel('Password again').fill('first-pass-phrase');
  await page.getByRole('button', { name: 'Create account and join' }).click();
  await expect(page.getByTestId('user-menu')).toContainText('Lena Moreau');
  await signOut(page);

  await page.getByRole('link', { name: 'Forgot password?' }).click();
  await expect(page.getByRole('heading', { name: 'Reset password' })).toBeVisible();
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Send link' }).click();
  await expect(page.getByTestId('reset-sent')).toContainText(email);
  await shot(page, 'reset-request');

  await page.goto('/mailbox');
  await page.getByTestId('mail-row').filter({ hasText: email }).filter({ hasText: 'Reset your Osmolane password' }).getByTestId('mail-link').click();
  await page.getByTestId('mail-body-link').first().click();
  await expect(page).toHaveURL(/\/reset\?token=/);
  await expect(page.getByRole('heading', { name: 'Choose a new password' })).toBeVisible();
  await page.getByLabel('New password', { exact: true }).fill('short');
  await page.getByLabel('New password again').fill('different');
  await page.getByRole('button', { name: 'Set password' }).click();
  await expect(page.getByText('Use at least 8 characters.')).toBeVisible();
  await expect(page.getByText('The two passwords differ.')).toBeVisible();
  await shot(page, 'reset-password');
  await page.getByLabel('New password', { exact: true }).fill('second-pass-phrase');
  await page.getByLabel('New password again').fill('second-pass-phrase');
  await page.getByRole('button', { name: 'Set password' }).click();

  await expect(page).toHaveURL(/\/sign-in\?reset=1/);
  await expect(page.getByText('Your password was changed.')).toBeVisible();
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('first-pass-phrase');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toHaveText('The e-mail address or the password is wrong.');
  await page.getByLabel('Password').fill('second-pass-phrase');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/workspaces$/);

  await page.getByTestId('user-menu').click();
  await page.getByRole('menuitem', { name: 'Change password' }).click();
  const dialog = page.getByRole('dialog', { name: 'Change password' });
  // The dialog focuses its first field once it has opened: wait for that, or the focus moves in the middle of typing.
  await expect(dialog.getByLabel('Current password')).toBeFocused();
  await dialog.getByLabel('Current password').fill('wrong-one');
  await dialog.getByLabel('New password', { exact: true }).fill('third-pass-phrase');
  await dialog.getByLabel('New password again').fill('third-pass-phrase');
  await dialog.getByRole('button', { name: 'Change password' }).click();
  await expect(dialog.getByText('The current password is wrong')).toBeVisible();
  await shot(page, 'change-password');
  await dialog.getByLabel('Current password').fill('second-pass-phrase');
  await dialog.getByRole('button', { name: 'Change password' }).click();
  await expect(page.getByText('Password changed.')).toBeVisible();
  await expect(dialog).toHaveCount(0);

  expect(seen.offsite).toEqual([]);
  // Two refusals were asked for (wrong password at sign-in, wrong current password): the browser logs those
  // responses as failed loads; nothing else may appear.
  expect(seen.errors.filter((e) => !/status of (400|401)/.test(e))).toEqual([]);
});
