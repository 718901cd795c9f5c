import { expect, test } from '@playwright/test';
import { PEOPLE, openDemoWorkspace, shot, signIn, signOut, watch } from './helpers';

test('an editor starts a design from the T template, saves a revision and puts it in review; a reviewer comments and approves it', async ({ page }) => {
  const seen = watch(page);
  const name = `T junction trial ${Date.now()}`;
  await signIn(page, PEOPLE.editor);
  await openDemoWorkspace(page);

  await page.getByTestId('new-design').click();
  const dialog = page.getByRole('dialog', { name: 'New design' });
  await dialog.getByLabel('Name').fill(name);
  await dialog.getByTestId('template-tee').click();
  await shot(page, 'new-design');
  await dialog.getByRole('button', { name: 'Create design' }).click();
  await expect(page).toHaveURL(/\/designs\/\d+$/);
  await expect(page.getByTestId('design-name')).toHaveText(name);
  const designUrl = page.url();

  await page.getByTestId('save-revision').click();
  await page.getByTestId('revision-note').fill('Branch 50 um, first try');
  await page.getByTestId('revision-save').click();
  await expect(page.getByText('Revision 1 saved.')).toBeVisible();

  await page.getByRole('tab', { name: 'History' }).click();
  await expect(page.getByTestId('revision-panel').first()).toContainText('Branch 50 um, first try');
  await page.getByTestId('review-in review').click();
  await expect(page.getByTestId('review-chip').first()).toContainText('in review');
  await expect(page.getByTestId('review-mask-ready')).toHaveCount(0); // editors do not approve
  await signOut(page);

  await signIn(page, PEOPLE.reviewer);
  await page.goto(designUrl + '?tab=history');
  await expect(page.getByTestId('read-only')).toBeVisible();
  const panel = page.getByTestId('revision-panel').first();
  await panel.locator('osm-layout-preview svg').click({ position: { x: 120, y: 110 } });
  await expect(panel.getByText(/Pinned at/)).toBeVisible();
  await panel.getByTestId('comment-body').fill('Check the corner where the branch meets the main channel.');
  await panel.getByRole('button', { name: 'Comment' }).click();
  await expect(panel.getByTestId('comment')).toContainText('Check the corner');
  await expect(panel.locator('osm-layout-preview .pin')).toHaveCount(1);
  await page.getByTestId('review-mask-ready').click();
  await expect(page.getByTestId('review-chip').first()).toContainText('mask-ready');
  await shot(page, 'design-review');

  // The mail to reviewers went out when the design was put in review.
  const mails = await (await page.request.get('/api/dev/mailbox')).json();
  expect(mails.some((m: { subject: string; to: string[] }) => m.subject === `In review: ${name}` && m.to.includes(PEOPLE.reviewer))).toBe(true);

  expect(seen.offsite).toEqual([]);
  expect(seen.errors).toEqual([]);
});
