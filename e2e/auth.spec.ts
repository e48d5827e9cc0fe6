import { expect, test } from '@playwright/test';
import {
  addAircraftFromPreset,
  createTeam,
  linkIn,
  mailTo,
  PASSWORD,
  signUp,
  uniqueEmail,
} from './helpers/accounts';

test('a new user signs up, starts a team, adds an aircraft from a preset and sees it in the fleet', async ({
  page,
}) => {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  const email = uniqueEmail('wren');

  // Team pages send a signed-out visitor to sign-in.
  await page.goto('/team');
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fteam/);

  await signUp(page, { name: 'Wren Ashdown', email });
  await createTeam(page, 'Riverside Flyers');
  await expect(page.getByRole('combobox', { name: 'Team' })).toHaveValue(/.+/);
  await expect(page.getByText('No aircraft yet.')).toBeVisible();

  await addAircraftFromPreset(page, { name: 'Kite', preset: 'quad-x', armMm: 110 });
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Fleet' }).click();
  const cards = page.getByRole('list', { name: 'Aircraft' });
  await expect(cards.getByRole('link', { name: 'Kite' })).toBeVisible();
  await expect(cards).toContainText('4 motors');
  await expect(cards).toContainText('no flights yet');
  await expect(cards.getByRole('img', { name: 'Top view: 4 motors, nose up' })).toBeVisible();
  expect(errors).toEqual([]);
});

test('sign-in shows the server message on a wrong password, and a reset link from the inbox sets a new one', async ({
  page,
}) => {
  const email = uniqueEmail('heron-pilot');
  await signUp(page, { name: 'Ila Marsh', email });
  await createTeam(page, 'Heron crew');
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/sign-in/);

  // Field errors before anything is sent.
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByText('expected an e-mail address')).toBeVisible();

  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('not-my-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toContainText(/password/i);

  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Send reset link' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'reset link' })).toBeVisible();

  const mail = await mailTo(page.request, email, /password/i);
  await page.goto(linkIn(mail, '/reset/'));
  await page.getByLabel('New password').fill('short');
  await page.getByRole('button', { name: 'Set new password' }).click();
  await expect(page.getByText('use at least 10 characters')).toBeVisible();
  const fresh = `${PASSWORD}-renewed`;
  await page.getByLabel('New password').fill(fresh);
  await page.getByRole('button', { name: 'Set new password' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Fleet' })).toBeVisible();

  // The new password works.
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(fresh);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Fleet' })).toBeVisible();
});
