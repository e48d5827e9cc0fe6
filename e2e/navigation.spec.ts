import { expect, test } from '@playwright/test';
import { addAircraftFromPreset, createTeam, signUp, uniqueEmail } from './helpers/accounts';

test('signed out, import is open and team pages ask for sign-in', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/');
  await expect(page).toHaveURL(/\/sign-in\?next=%2F$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: 'Server' })).toHaveText(/Server online/);

  const nav = page.getByRole('navigation', { name: 'Main' });
  await nav.getByRole('link', { name: 'Import' }).click();
  await expect(page).toHaveURL(/\/import$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Import' })).toBeVisible();

  await nav.getByRole('link', { name: 'Team' }).click();
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fteam/);

  await page.goto('/no/such/page');
  await expect(page.getByRole('heading', { name: 'Nothing here' })).toBeVisible();
  expect(errors).toEqual([]);
});

test('signed in, the main navigation, aircraft sections and deep links all land on real screens', async ({
  page,
}) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signUp(page, { name: 'Moss Ferrand', email: uniqueEmail('nav') });
  await createTeam(page, 'Nav check');
  await addAircraftFromPreset(page, { name: 'Heron', preset: 'wide-front-x' });
  const aircraftUrl = page.url();

  const sections = page.getByRole('navigation', { name: 'Aircraft sections' });
  for (const [label, check] of [
    ['Airframe', page.getByRole('form', { name: 'Airframe' })],
    ['Parts', page.getByRole('form', { name: 'Parts' })],
    ['Service log', page.getByRole('form', { name: 'Add service entry' })],
    ['Bench runs', page.getByRole('complementary', { name: 'Caution: Bench work' })],
    ['Trends', page.getByText('Trends appear once this aircraft has synced flights.')],
  ] as const) {
    await sections.getByRole('link', { name: label }).click();
    await expect(check).toBeVisible();
  }

  const nav = page.getByRole('navigation', { name: 'Main' });
  await nav.getByRole('link', { name: 'Fleet' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Fleet' })).toBeVisible();
  await expect(page.getByRole('list', { name: 'Aircraft' })).toContainText('Heron');
  await nav.getByRole('link', { name: 'Import' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Import' })).toBeVisible();
  await nav.getByRole('link', { name: 'Team' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Team' })).toBeVisible();
  await nav.getByRole('link', { name: 'Inbox' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Dev inbox' })).toBeVisible();

  await page.getByRole('link', { name: 'Moss Ferrand' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Account' })).toBeVisible();
  await expect(page.getByLabel(/E-mail me when someone comments/)).toBeChecked();

  // Deep links load the app shell from the server and land on the same screens.
  await page.goto('/team');
  await expect(page.getByRole('heading', { level: 1, name: 'Team' })).toBeVisible();
  await page.goto(`${aircraftUrl}/airframe`);
  await expect(
    page.getByRole('img', { name: 'Top view: 4 motors, nose up' }).first(),
  ).toBeVisible();
  expect(errors).toEqual([]);
});
