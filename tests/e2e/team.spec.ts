import { expect, test } from '@playwright/test';
import { PEOPLE, WORKSPACE, openDemoWorkspace, shot, signIn, signOut, watch } from './helpers';

const DEMO_DESIGNS = [
  'Cross injector, 50 um legs',
  'Serpentine separation channel',
  'Expansion chamber with pillar field',
  'T-mixer with back-pressure check',
];

test('an editor signs in, sees the workspace and its four demo designs, opens one, reloads still signed in, signs out', async ({ page }) => {
  const seen = watch(page);
  await signIn(page, PEOPLE.editor);
  await expect(page.getByRole('heading', { name: 'Workspaces' })).toBeVisible();
  await expect(page.getByRole('link', { name: WORKSPACE })).toBeVisible();
  await shot(page, 'workspaces');

  await openDemoWorkspace(page);
  await expect(page.getByTestId('current-workspace')).toHaveText(WORKSPACE);
  const rows = page.getByTestId('design-row');
  // The four demo designs (other tests may have added more by now).
  for (const name of DEMO_DESIGNS) await expect(page.getByTestId('design-link').filter({ hasText: name })).toBeVisible();
  expect(await rows.count()).toBeGreaterThanOrEqual(4);
  await expect(page.getByTestId('new-design')).toBeVisible();
  await shot(page, 'designs');

  // The filter asks the server.
  await page.getByTestId('design-filter').fill('separation channel');
  await expect(rows).toHaveCount(1);
  await expect(rows.first()).toContainText('Serpentine separation channel');
  await page.getByTestId('design-filter').fill('');
  await expect(page.getByTestId('design-link').filter({ hasText: 'T-mixer' })).toBeVisible();

  await page.getByTestId('design-link').filter({ hasText: 'Cross injector' }).click();
  await expect(page).toHaveURL(/\/designs\/\d+$/);
  await expect(page.getByTestId('design-name')).toHaveText(/Cross injector/);
  for (const tab of ['Sketch', 'Conditions', 'Fields', 'History']) await expect(page.getByRole('tab', { name: tab })).toBeVisible();
  await expect(page.getByTestId('save-revision')).toBeVisible();
  await expect(page.getByTestId('read-only')).toHaveCount(0);
  await shot(page, 'design-sketch');
  await page.getByRole('tab', { name: 'Conditions' }).click();
  await expect(page).toHaveURL(/tab=conditions/);
  await expect(page.locator('osm-conditions-panel')).toBeVisible();
  await shot(page, 'design-conditions');
  await page.getByRole('tab', { name: 'Fields' }).click();
  await expect(page.locator('osm-fields-view')).toBeAttached();
  await shot(page, 'design-fields');

  await page.getByRole('tab', { name: 'History' }).click();
  await expect(page).toHaveURL(/tab=history/);
  await expect(page.getByTestId('revision-panel').first()).toBeVisible();
  await shot(page, 'design-history');

  const url = page.url();
  await page.reload();
  await expect(page).toHaveURL(url);
  await expect(page.getByTestId('design-name')).toHaveText(/Cross injector/);
  await expect(page.getByTestId('user-menu')).toContainText('Jonas Lindqvist');
  await expect(page.getByRole('tab', { name: 'History', selected: true })).toBeVisible();

  await signOut(page);
  await page.goto(url);
  await expect(page).toHaveURL(/\/sign-in\?next=/);
  expect(seen.offsite).toEqual([]);
  expect(seen.errors).toEqual([]);
});

test('a viewer opens a design and finds no edit controls', async ({ page }) => {
  const seen = watch(page);
  await signIn(page, PEOPLE.viewer);
  await openDemoWorkspace(page);
  await expect(page.getByTestId('new-design')).toHaveCount(0);
  await page.getByTestId('design-link').filter({ hasText: 'T-mixer' }).click();
  await expect(page.getByTestId('design-name')).toHaveText(/T-mixer/);
  await expect(page.getByTestId('read-only')).toBeVisible();
  await expect(page.getByTestId('save-revision')).toHaveCount(0);
  await expect(page.getByTestId('save-state')).toHaveCount(0);
  await expect(page.getByTestId('review-menu')).toHaveCount(0);
  await shot(page, 'design-viewer');

  await page.getByRole('tab', { name: 'History' }).click();
  await expect(page.getByTestId('revision-panel').first()).toBeVisible();
  await expect(page.getByRole('button', { name: /Put in review|Approve|Send back/ })).toHaveCount(0);
  await expect(page.getByTestId('comment-body')).toHaveCount(0);

  await page.getByRole('link', { name: 'Library' }).click();
  await expect(page.getByRole('heading', { name: 'Library' })).toBeVisible();
  await expect(page.getByTestId('library-row-buffer').first()).toBeVisible();
  await expect(page.getByTestId('add-buffer')).toHaveCount(0);

  await page.getByRole('link', { name: 'Members' }).click();
  await expect(page.getByTestId('member-row').filter({ hasText: 'Mira Okafor' })).toBeVisible();
  await expect(page.getByTestId('invite-email')).toHaveCount(0);
  await expect(page.getByRole('combobox')).toHaveCount(0);
  expect(seen.offsite).toEqual([]);
  expect(seen.errors).toEqual([]);
});

test('an owner invites someone; the mailbox shows the mail; the invitee follows the link, makes an account and lands in the workspace', async ({ page, browser }) => {
  const seen = watch(page);
  const invitee = `nadia.voss.${Date.now()}@example.test`;
  await signIn(page, PEOPLE.owner);
  await openDemoWorkspace(page);
  await page.getByRole('link', { name: 'Members' }).click();
  await expect(page.getByTestId('member-row').first()).toBeVisible();
  await page.getByTestId('invite-email').fill(invitee);
  await page.getByTestId('invite-role').click();
  await page.getByRole('option', { name: 'Editor' }).click();
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByTestId('invitation-row').filter({ hasText: invitee })).toBeVisible();
  await shot(page, 'members');

  await page.getByTestId('mailbox-link').click();
  await expect(page.getByRole('heading', { name: 'Development mailbox' })).toBeVisible();
  const row = page.getByTestId('mail-row').filter({ hasText: invitee });
  await expect(row).toBeVisible();
  await shot(page, 'mailbox');
  await row.getByTestId('mail-link').click();
  await expect(page.getByTestId('mail-to')).toContainText(invitee);
  const link = page.getByTestId('mail-body-link').first();
  await expect(link).toBeVisible();
  await shot(page, 'mail');
  const href = await link.getAttribute('href');
  expect(href).toMatch(/^\/invite\?token=/);

  // The invitee, in a browser of their own.
  const context = await browser.newContext();
  const other = await context.newPage();
  const seenOther = watch(other);
  await other.goto(href!);
  await expect(other.getByTestId('invitation-summary')).toContainText(WORKSPACE);
  await expect(other.getByTestId('invitation-summary')).toContainText(invitee);
  await other.getByLabel('Your name').fill('Nadia Voss');
  await other.getByLabel('Password', { exact: true }).fill('a-long-pass-phrase');
  await other.getByLabel('Password again').fill('a-long-pass-phrase');
  await shot(other, 'invitation');
  await other.getByRole('button', { name: 'Create account and join' }).click();
  await expect(other).toHaveURL(/\/workspaces\/\d+\/designs$/);
  await expect(other.getByTestId('current-workspace')).toHaveText(WORKSPACE);
  await expect(other.getByTestId('user-menu')).toContainText('Nadia Voss');
  for (const name of DEMO_DESIGNS) await expect(other.getByTestId('design-link').filter({ hasText: name })).toBeVisible();
  await context.close();

  // The owner sees the new member.
  await page.goto('/');
  await openDemoWorkspace(page);
  await page.getByRole('link', { name: 'Members' }).click();
  await expect(page.getByTestId('member-row').filter({ hasText: invitee })).toBeVisible();
  await page.getByRole('link', { name: 'Activity' }).click();
  await expect(page.getByTestId('activity-row').filter({ hasText: 'Nadia Voss' }).filter({ hasText: 'joined as editor' })).toBeVisible();
  await shot(page, 'activity');
  await page.getByRole('link', { name: 'Library' }).click();
  await expect(page.getByTestId('library-row-wall').first()).toBeVisible();
  await shot(page, 'library');

  expect(seen.offsite).toEqual([]);
  expect(seen.errors).toEqual([]);
  expect(seenOther.offsite).toEqual([]);
  expect(seenOther.errors).toEqual([]);
});
