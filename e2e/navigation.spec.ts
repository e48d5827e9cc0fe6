import { expect, test } from '@playwright/test';

test('moves between fleet, import and team from the main navigation', async ({ page }) => {
  const errors: string[] = [];
  page.on('console', (msg) => {
    if (msg.type() === 'error') errors.push(msg.text());
  });
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1, name: 'Fleet' })).toBeVisible();
  await expect(page.getByRole('status')).toHaveText(/Server online/);

  const nav = page.getByRole('navigation', { name: 'Main' });
  await nav.getByRole('link', { name: 'Import' }).click();
  await expect(page).toHaveURL(/\/import$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Import' })).toBeVisible();

  await nav.getByRole('link', { name: 'Team' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Team' })).toBeVisible();

  // Deep links work because the server falls back to the app for unknown non-API paths.
  await page.goto('/team');
  await expect(page.getByRole('heading', { level: 1, name: 'Team' })).toBeVisible();
  expect(errors).toEqual([]);
});
