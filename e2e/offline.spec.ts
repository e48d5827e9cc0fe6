import { expect, test } from '@playwright/test';
import { writeScenarioCsv } from './fixtures/synth-log';
import {
  addAircraftFromPreset,
  createTeam,
  localSyncErrors,
  signUp,
  uniqueEmail,
} from './helpers/accounts';
import { collectConsoleProblems } from './helpers/console';

test('a log imported offline is kept on the device and synced when the network is back', async ({
  page,
  context,
}) => {
  test.setTimeout(120_000);
  const problems = collectConsoleProblems(page);
  await signUp(page, { name: 'Kit Calloway', email: uniqueEmail('field') });
  await createTeam(page, 'Field crew');
  await addAircraftFromPreset(page, { name: 'Kite', preset: 'quad-x', armMm: 110 });

  // Online once: the service worker installs and precaches the app shell.
  await page
    .getByRole('navigation', { name: 'Main' })
    .getByRole('link', { name: 'Import' })
    .click();
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect
    .poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller)))
    .toBe(true);
  await page.getByLabel('Aircraft').selectOption({ label: 'Kite · 4 motors' });

  await context.setOffline(true);
  await expect(page.getByTestId('sync-state')).toHaveText(/^Offline/);
  const log = writeScenarioCsv('weak-motor', { seconds: 20 });
  await page.getByLabel('Flight logs').setInputFiles(log);
  await expect(page).toHaveURL(/\/flights\/[0-9a-f-]{36}/, { timeout: 60_000 });
  const flightId = page.url().match(/flights\/([0-9a-f-]{36})/)![1]!;
  await expect(page.getByTestId('sync-state')).toHaveText('Offline · 1 flight not synced');
  // The review opens from this device with no network and no reload: it never waits for one.
  await expect(page.getByRole('region', { name: 'Verdict' })).toBeVisible({ timeout: 10_000 });
  await expect(page.getByText('Opening the flight…')).toHaveCount(0);
  // One story in the header: no network, so no "Server online" beside "Offline".
  await expect(page.getByRole('status').filter({ hasText: 'Server' })).toHaveText(
    'Server out of reach',
  );

  // Still offline, a reload gets the shell from the service worker and the flight from IndexedDB.
  await page.reload();
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeVisible();
  await expect(page.getByTestId('sync-state')).toHaveText('Offline · 1 flight not synced');
  await expect(page.getByRole('region', { name: 'Verdict' })).toBeVisible();
  await expect(page.getByText('kept on this device · syncs to the team when online')).toBeVisible();
  // The team's aircraft are remembered, so the next log can be filed without a network too.
  await page.goto('/import');
  await expect(
    page.getByLabel('Aircraft').locator('option', { hasText: 'Kite · 4 motors' }),
  ).toHaveCount(1);
  // No link disappears offline, the inbox's included.
  const main = page.getByRole('navigation', { name: 'Main' });
  for (const name of ['Fleet', 'Import', 'Team', 'Inbox'])
    await expect(main.getByRole('link', { name })).toBeVisible();
  // The fleet and the team page show what this device kept, never an error.
  await main.getByRole('link', { name: 'Fleet' }).click();
  await expect(page.getByRole('list', { name: 'Aircraft' })).toContainText('Kite');
  await expect(page.getByRole('list', { name: 'Flights on this device' })).toContainText('.csv');
  await expect(page.getByRole('alert')).toHaveCount(0);
  await main.getByRole('link', { name: 'Team' }).click();
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await expect(page.getByRole('alert')).toHaveCount(0);
  // Back on the review, which follows the sync state live once the network returns.
  await page.goto(`/flights/${flightId}`);
  await expect(page.getByRole('region', { name: 'Verdict' })).toBeVisible();

  // Back online: the sync runner sends it without anyone asking.
  await context.setOffline(false);
  await page.evaluate(() => window.dispatchEvent(new Event('online')));
  await expect(page.getByTestId('sync-state'), 'sync should finish')
    .toHaveText('All synced', { timeout: 30_000 })
    .catch(async (error: unknown) => {
      throw new Error(`${String(error)}\nlocal store: ${await localSyncErrors(page)}`);
    });
  await expect(page.getByText('kept on this device · stored by the team')).toBeVisible();

  const stored = await page.request.get(`/api/flights/${flightId}`);
  expect(stored.status()).toBe(200);
  expect((await stored.json()).aircraftName).toBe('Kite');
  const raw = await page.request.get(`/api/flights/${flightId}/raw`);
  expect(raw.status()).toBe(200);

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Fleet' }).click();
  await expect(page.getByRole('table', { name: 'Flights' })).toContainText('Kite');
  await expect(page.getByText('Every flight read on this device is on the server.')).toBeVisible();

  // Normal use, offline included, leaves nothing in the console: no failing request repeated
  // while the network is away, no 401 for "who is signed in".
  expect(problems).toEqual([]);
});
