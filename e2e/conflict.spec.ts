import { expect, test, type Page } from '@playwright/test';
import {
  addAircraftFromPreset,
  createTeam,
  PASSWORD,
  signUp,
  uniqueEmail,
} from './helpers/accounts';

async function signIn(page: Page, email: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Fleet' })).toBeVisible();
}

test('two browsers editing one aircraft: the later save is offered reload or overwrite, never lost silently', async ({
  page,
  browser,
}) => {
  test.setTimeout(120_000);
  const email = uniqueEmail('bench');
  await signUp(page, { name: 'Ines Whitlock', email });
  await createTeam(page, 'Tern Field Flyers');
  await addAircraftFromPreset(page, { name: 'Tern Two', preset: 'quad-x', armMm: 110 });
  const aircraftUrl = page.url().replace(/\/[a-z]+$/, '');

  // The same tuner on a second machine (the laptop at the bench).
  const laptop = await browser.newContext();
  const other = await laptop.newPage();
  await signIn(other, email);

  // Both open the parts list of the same aircraft.
  await page.goto(`${aircraftUrl}/parts`);
  await other.goto(`${aircraftUrl}/parts`);
  await expect(page.getByLabel('Frame', { exact: true })).toBeVisible();
  await expect(other.getByLabel('Frame', { exact: true })).toBeVisible();

  // The laptop saves first.
  await other.getByLabel('Frame', { exact: true }).fill('Kestrel 5 carbon');
  await other.getByRole('button', { name: 'Save parts' }).click();
  await expect(other.getByText('Parts saved.')).toBeVisible();

  // This browser still shows the old version; its save is refused, not written over theirs.
  await page.getByLabel('ESC', { exact: true }).fill('4-in-1 45 A');
  await page.getByRole('button', { name: 'Save parts' }).click();
  const conflict = page.getByRole('alert').filter({ hasText: 'Changed by someone else' });
  await expect(conflict).toBeVisible();
  const apiUrl = aircraftUrl.replace('/aircraft/', '/api/aircraft/');
  let stored = await (await page.request.get(apiUrl)).json();
  expect(stored.components.frame).toBe('Kestrel 5 carbon');
  expect(stored.components.esc).toBeUndefined();

  // Reload takes their version into the form.
  await conflict.getByRole('button', { name: 'Reload' }).click();
  await expect(page.getByLabel('Frame', { exact: true })).toHaveValue('Kestrel 5 carbon');
  await expect(conflict).toHaveCount(0);

  // A save now builds on their version and keeps both changes.
  await page.getByLabel('ESC', { exact: true }).fill('4-in-1 45 A');
  await page.getByRole('button', { name: 'Save parts' }).click();
  await expect(page.getByText('Parts saved.')).toBeVisible();
  stored = await (await page.request.get(apiUrl)).json();
  expect(stored.components).toMatchObject({ frame: 'Kestrel 5 carbon', esc: '4-in-1 45 A' });

  // The laptop's form is now stale; it chooses to overwrite with its own.
  await other.getByLabel('Notes').fill('Swapped the rear-left arm.');
  await other.getByRole('button', { name: 'Save parts' }).click();
  const stale = other.getByRole('alert').filter({ hasText: 'Changed by someone else' });
  await expect(stale).toBeVisible();
  await stale.getByRole('button', { name: 'Overwrite' }).click();
  await expect(other.getByText('Parts saved.')).toBeVisible();
  stored = await (await page.request.get(apiUrl)).json();
  // Overwrite means theirs: the laptop's whole parts list, sent against version 3, makes 4.
  expect(stored.notes).toBe('Swapped the rear-left arm.');
  expect(stored.components.frame).toBe('Kestrel 5 carbon');
  expect(stored.version).toBe(4);
  await laptop.close();
});
