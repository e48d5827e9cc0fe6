import { mkdirSync, writeFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { presetAirframe } from '../shared/airframe/presets';
import { PASSWORD, uniqueEmail } from './helpers/accounts';
import { writeScenarioCsv } from './fixtures/synth-log';
import { writeForeignHeaderCsv } from './fixtures/foreign-csv';

const artifacts = new URL('./artifacts/', import.meta.url).pathname;

test('the parse worker reports progress and the review shows the rows it read, from a gzipped log', async ({
  page,
}) => {
  test.setTimeout(120_000);
  const csv = writeScenarioCsv('worn-motor-3', { seconds: 60 });
  const gz = csv + '.gz';
  writeFileSync(gz, gzipSync(readFileSync(csv)));
  await page.goto('/import');
  await page.getByLabel('Flight logs').setInputFiles(gz);
  const bar = page.getByRole('progressbar', { name: /Reading worn-motor-3\.csv\.gz/ });
  await expect(bar).toBeVisible();
  await expect(page).toHaveURL(/\/flights\//, { timeout: 60_000 });
  await expect(page.getByText(/60,00\d rows/)).toBeVisible();
});

test('an unknown header opens the column map; confirming it reads the flight', async ({ page }) => {
  test.setTimeout(120_000);
  await page.goto('/import');
  await page.getByLabel('Flight logs').setInputFiles(writeForeignHeaderCsv());
  const step = page.getByRole('region', { name: /Column map for kite-export\.csv/ });
  await expect(step).toBeVisible({ timeout: 30_000 });
  await expect(step.getByLabel('Channel for Timestamp (s)')).toHaveValue('time');
  await expect(step.getByLabel('Channel for Out0')).toHaveValue('motor1');
  await expect(step.getByLabel('Channel for GyroYaw (dps)')).toHaveValue('gyro_z');
  // Motor outputs in this file are 0–1 fractions.
  for (const h of ['Out0', 'Out1', 'Out2', 'Out3'])
    await step.getByLabel(`Unit for ${h}`).selectOption('frac');
  mkdirSync(artifacts, { recursive: true });
  await page.setViewportSize({ width: 1440, height: 1000 });
  await page.screenshot({ path: `${artifacts}import-column-map-desktop.png`, fullPage: true });
  await page.setViewportSize({ width: 820, height: 1180 });
  await page.screenshot({ path: `${artifacts}import-column-map-tablet.png`, fullPage: true });
  await step.getByRole('button', { name: 'Read with this map' }).click();
  await expect(page).toHaveURL(/\/flights\//, { timeout: 60_000 });
  await expect(page.getByRole('region', { name: 'Verdict' })).toBeVisible();

  // After a reload the filter bench reads the kept raw log again, with the map kept beside it.
  await page
    .getByRole('navigation', { name: 'Evidence' })
    .getByRole('link', { name: 'Filter bench', exact: true })
    .click();
  await page.reload();
  await page.getByRole('button', { name: 'Apply to this flight' }).click();
  await expect(
    page.getByRole('img', { name: /spectrum before and after the filters/ }),
  ).toBeVisible({ timeout: 60_000 });
  await expect(page.getByText(/filter bench could not run|needs a column map/)).toHaveCount(0);
});

test('µs motor outputs are proposed as µs; read as fractions they are flagged before reading', async ({
  page,
}) => {
  test.setTimeout(120_000);
  await page.goto('/import');
  await page.getByLabel('Flight logs').setInputFiles(writeForeignHeaderCsv({ pulses: true }));
  const step = page.getByRole('region', { name: /Column map for kite-pulses\.csv/ });
  await expect(step).toBeVisible({ timeout: 30_000 });
  // Proposed from the first values, which the headers do not name a unit for.
  for (const h of ['Out0', 'Out1', 'Out2', 'Out3'])
    await expect(step.getByLabel(`Unit for ${h}`)).toHaveValue('us');
  await expect(step.getByRole('status')).toHaveCount(0);
  await step.getByLabel('Unit for Out2').selectOption('frac');
  await expect(step.getByRole('status')).toContainText('do not look like its unit');
  await expect(
    step.getByText(/motor3 \("Out2"\) is read as a 0–1 fraction, but it reaches 1\d{3}/),
  ).toBeVisible();
  await step.getByRole('button', { name: 'Read Out2 as a 1000–2000 µs pulse' }).click();
  await expect(step.getByLabel('Unit for Out2')).toHaveValue('us');
  await expect(step.getByRole('status')).toHaveCount(0);
  await step.getByRole('button', { name: 'Read with this map' }).click();
  await expect(page).toHaveURL(/\/flights\//, { timeout: 60_000 });
  await expect(page.getByRole('region', { name: 'Verdict' })).toBeVisible();
});

test('a first-time pilot tries a sample flight and lands on its review', async ({ page }) => {
  test.setTimeout(120_000);
  await page.goto('/import');
  await page.getByRole('button', { name: 'Try a sample flight' }).click();
  await expect(page).toHaveURL(/\/flights\//, { timeout: 90_000 });
  await expect(page.getByText('sample-weak-motor.csv', { exact: false })).toBeVisible();
  await expect(page.getByRole('list', { name: 'Findings' })).toContainText('Motor 3');
});

test('cancelling an import keeps nothing and offers to try again', async ({ page }) => {
  test.setTimeout(120_000);
  const big = writeScenarioCsv('clean-quad-x', { seconds: 300, rateHz: 2000 });
  await page.goto('/import');
  await page.getByLabel('Flight logs').setInputFiles(big);
  const row = page.getByRole('listitem', { name: /Import of clean-quad-x\.csv/ });
  await row.getByRole('button', { name: 'Cancel' }).click();
  await expect(row).toContainText('Cancelled; nothing was kept.');
  await expect(row.getByRole('button', { name: 'Try again' })).toBeVisible();
  await expect(page).toHaveURL(/\/import$/);
});

test('a flight imported as an unknown quad is filed under its aircraft later, re-analysed and synced', async ({
  browser,
}) => {
  test.setTimeout(180_000);
  const context = await browser.newContext();
  const email = uniqueEmail('pilot');
  expect(
    (
      await context.request.post('/api/auth/sign-up', {
        data: { name: 'Rosa Kite', email, password: PASSWORD },
      })
    ).ok(),
  ).toBe(true);
  const team = (await (
    await context.request.post('/api/teams', { data: { name: 'Heron crew' } })
  ).json()) as { id: string };
  const res = await context.request.post(`/api/teams/${team.id}/aircraft`, {
    data: { name: 'Heron', airframe: presetAirframe('wide-front-x', { name: 'Heron wide-front' }) },
  });
  expect(res.ok(), await res.text()).toBe(true);

  const page = await context.newPage();
  await page.goto('/import');
  await page
    .getByLabel('Flight logs')
    .setInputFiles(writeScenarioCsv('wide-front-healthy', { seconds: 20 }));
  await expect(page).toHaveURL(/\/flights\//, { timeout: 60_000 });
  const flightId = new URL(page.url()).pathname.split('/')[2]!;
  await expect(page.getByText('(assumed airframe)')).toBeVisible();

  await page.getByLabel('Aircraft').selectOption({ label: 'Heron · 4 motors' });
  await page.getByRole('button', { name: 'File under this aircraft' }).click();
  await expect(page.getByText('(assumed airframe)')).toHaveCount(0, { timeout: 60_000 });
  await expect(page.getByRole('img', { name: /Top view of Heron wide-front/ })).toBeVisible();
  // A request that meets a keep-alive socket the server has just closed (ECONNRESET) is asked
  // again on the next poll instead of failing the journey.
  await expect
    .poll(
      async () =>
        (await context.request.get(`/api/flights/${flightId}`).catch(() => null))?.status() ?? 0,
      { timeout: 60_000 },
    )
    .toBe(200);
  // The stored detail carries the geometry the analysis used.
  const stored = (await (await context.request.get(`/api/flights/${flightId}`)).json()) as {
    detail: { airframe?: { name: string } };
  };
  expect(stored.detail.airframe?.name).toBe('Heron wide-front');

  // With the aircraft out of reach, the top view still draws the flight's own geometry.
  await page.route('**/api/aircraft/**', (route) => route.abort());
  await page.reload();
  await page
    .getByRole('navigation', { name: 'Evidence' })
    .getByRole('link', { name: 'Balance' })
    .click();
  await expect(page.getByRole('img', { name: /Top view of Heron wide-front/ })).toBeVisible();
  await context.close();
});

test('a team flight whose headers need a map offers the column-map step to the filter bench', async ({
  browser,
}) => {
  test.setTimeout(240_000);
  const pilot = await browser.newContext();
  const email = uniqueEmail('mapper');
  expect(
    (
      await pilot.request.post('/api/auth/sign-up', {
        data: { name: 'Ivo Kite', email, password: PASSWORD },
      })
    ).ok(),
  ).toBe(true);
  const team = (await (
    await pilot.request.post('/api/teams', { data: { name: 'Kite crew' } })
  ).json()) as { id: string };
  const res = await pilot.request.post(`/api/teams/${team.id}/aircraft`, {
    data: { name: 'Kite', airframe: presetAirframe('quad-x', { name: 'Kite 5-inch' }) },
  });
  expect(res.ok(), await res.text()).toBe(true);

  // Imported with a map (not saved as a preset) and synced with its raw log.
  const page = await pilot.newPage();
  await page.goto('/import');
  await page.getByLabel('Aircraft').selectOption({ label: 'Kite · 4 motors' });
  await page.getByLabel('Flight logs').setInputFiles(writeForeignHeaderCsv());
  const step = page.getByRole('region', { name: /Column map for kite-export\.csv/ });
  for (const h of ['Out0', 'Out1', 'Out2', 'Out3'])
    await step.getByLabel(`Unit for ${h}`).selectOption('frac');
  await step.getByRole('button', { name: 'Read with this map' }).click();
  await expect(page).toHaveURL(/\/flights\//, { timeout: 60_000 });
  const flightId = new URL(page.url()).pathname.split('/')[2]!;
  await expect
    .poll(async () => (await pilot.request.get(`/api/flights/${flightId}/raw`)).status(), {
      timeout: 90_000,
    })
    .toBe(200);
  const session = await pilot.storageState();
  await pilot.close();

  // On another device there is no copy and the team has no preset for these headers: the bench asks.
  const other = await browser.newContext({ storageState: session });
  const review = await other.newPage();
  await review.goto(`/flights/${flightId}/filters`);
  const ask = review.getByRole('alert').filter({ hasText: 'needs a column map' });
  await expect(ask).toBeVisible({ timeout: 60_000 });
  await ask.getByRole('link', { name: 'Map the columns…' }).click();
  const remap = review.getByRole('region', { name: /Column map for the stored log/ });
  await expect(remap).toBeVisible({ timeout: 30_000 });
  for (const h of ['Out0', 'Out1', 'Out2', 'Out3'])
    await remap.getByLabel(`Unit for ${h}`).selectOption('frac');
  await remap.getByRole('button', { name: 'Read with this map' }).click();

  // Back on the bench, which reads the stored log with that map.
  await expect(review).toHaveURL(new RegExp(`/flights/${flightId}/filters`));
  await expect(
    review.getByRole('img', { name: /spectrum before and after the filters/ }),
  ).toBeVisible({ timeout: 60_000 });
  await other.close();
});
