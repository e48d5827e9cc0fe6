import { mkdirSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { writeMalformedCsv, writeScenarioCsv } from './fixtures/synth-log';

const artifacts = new URL('./artifacts/', import.meta.url).pathname;

test('a pilot drops a log with a weak motor and sees that motor named and marked', async ({
  page,
}) => {
  test.setTimeout(120_000);
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  const log = writeScenarioCsv('worn-motor-3');
  await page.goto('/import');
  await page.getByLabel('Flight logs').setInputFiles(log);

  // The worker path: progress is reported while the file is read.
  await expect(page.getByRole('progressbar', { name: /Reading worn-motor-3\.csv/ })).toBeVisible();

  // The review opens on its own when the analysis is done, before any upload.
  await expect(page).toHaveURL(/\/flights\/[0-9a-f-]{36}/, { timeout: 60_000 });
  const verdict = page.getByRole('region', { name: 'Verdict' });
  await expect(verdict).toBeVisible();
  const findings = verdict.getByRole('list', { name: 'Findings' });
  await expect(findings.getByRole('listitem').first()).toContainText('Motor 3');
  // Read before any team: drift has no aircraft to compare with, and says so.
  await expect(verdict.getByTestId('drift-line')).toHaveText(
    'No drift: this flight is not filed under an aircraft.',
  );
  await expect(page.getByText(/40,00\d rows/)).toBeVisible();

  // Balance section: motor 3 ringed on the top view, the others not.
  await page
    .getByRole('navigation', { name: 'Evidence' })
    .getByRole('link', { name: 'Balance' })
    .click();
  const top = page.getByRole('img', { name: /Top view of/ });
  await expect(top).toHaveAttribute('aria-label', /motor 3 marked/);
  await expect(top.locator('[data-motor="3"]')).toHaveAttribute('data-flagged', 'true');
  await expect(top.locator('[data-motor="1"]')).toHaveAttribute('data-flagged', 'false');

  mkdirSync(artifacts, { recursive: true });
  await page.setViewportSize({ width: 1440, height: 1000 });
  await page.screenshot({ path: `${artifacts}review-desktop.png`, fullPage: true });
  await page.setViewportSize({ width: 820, height: 1180 });
  await page.screenshot({ path: `${artifacts}review-tablet.png`, fullPage: true });

  // Arrow keys move the shared cursor.
  await page.locator('body').click({ position: { x: 5, y: 5 } });
  await page.keyboard.press('ArrowRight');
  await expect(page.getByTestId('cursor-readout')).toContainText(/t \d+\.\d\d s/);
  expect(errors).toEqual([]);
});

test('a malformed file shows the line and column of the problem and loses nothing', async ({
  page,
}) => {
  const bad = writeMalformedCsv();
  await page.goto('/import');
  await page.getByLabel('Flight logs').setInputFiles(bad.path);
  const row = page.getByRole('listitem', { name: 'Import of cut-short.csv' });
  const alert = row.getByRole('alert');
  await expect(alert).toContainText(`line ${bad.line}`);
  await expect(alert).toContainText(`column ${bad.column}`);
  await expect(alert).toContainText('gyro_x');
  await expect(page).toHaveURL(/\/import$/);
  await expect(row.getByRole('button', { name: 'Try again' })).toBeVisible();
});

test('every evidence section opens without errors, and the filter bench runs in the worker after a reload', async ({
  page,
}) => {
  test.setTimeout(180_000);
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto('/import');
  await page
    .getByLabel('Flight logs')
    .setInputFiles(writeScenarioCsv('frame-resonance', { seconds: 40, rateHz: 2000 }));
  await expect(page).toHaveURL(/\/flights\/[0-9a-f-]{36}/, { timeout: 60_000 });
  const nav = page.getByRole('navigation', { name: 'Evidence' });
  const sectionTitle = page.locator('#section-title');
  for (const name of [
    'Balance',
    'Torque split',
    'Effort',
    'Vibration',
    'Power',
    'Headroom',
    'Tracking',
    'Compare',
  ]) {
    await nav.getByRole('link', { name, exact: true }).click();
    await expect(sectionTitle).toHaveText(name);
    await page.waitForTimeout(300); // charts build after the first paint
    await page.screenshot({
      path: `${artifacts}section-${name.replace(/\W+/g, '-').toLowerCase()}.png`,
      fullPage: true,
    });
  }
  await nav.getByRole('link', { name: 'Vibration', exact: true }).click();
  await expect(page.getByRole('table', { name: 'Vibration peaks' })).toContainText('Hz');
  await expect(page.getByRole('img', { name: 'Campbell diagram' })).toBeVisible();

  // After a reload the worker no longer holds the log; the bench reads the kept file again.
  await nav.getByRole('link', { name: 'Filter bench', exact: true }).click();
  await page.reload();
  await page.getByRole('button', { name: /^Notch at \d+ Hz$/ }).click();
  await page.getByRole('button', { name: 'Apply to this flight' }).click();
  await expect(
    page.getByRole('img', { name: /spectrum before and after the filters/ }),
  ).toBeVisible({ timeout: 60_000 });
  await expect(page.getByText(/delay at 20 Hz ≈ \d+\.\d\d ms/)).toBeVisible();
  await page.screenshot({ path: `${artifacts}section-filter-bench.png`, fullPage: true });
  expect(errors).toEqual([]);
});

test('compare states what changed against another flight of the same aircraft', async ({
  page,
}) => {
  test.setTimeout(180_000);
  await page.goto('/import');
  await page
    .getByLabel('Flight logs')
    .setInputFiles(writeScenarioCsv('clean-quad-x', { seconds: 30 }));
  await expect(page).toHaveURL(/\/flights\//, { timeout: 60_000 });
  await page.goto('/import');
  await page
    .getByLabel('Flight logs')
    .setInputFiles(writeScenarioCsv('worn-motor-3', { seconds: 30 }));
  await expect(page).toHaveURL(/\/flights\//, { timeout: 60_000 });
  await page
    .getByRole('navigation', { name: 'Evidence' })
    .getByRole('link', { name: 'Compare' })
    .click();
  const pick = page.getByLabel('Compare with');
  const value = await pick.locator('option', { hasText: 'clean-quad-x.csv' }).getAttribute('value');
  await pick.selectOption(value!);
  const changed = page.getByRole('region', { name: 'What changed' });
  await expect(changed).toContainText(/Motor 3 deviation rose from (?:[+−]\d+|0) % to \+\d+ %/);
  // Both flights say which geometry they were judged against (here the assumed quad X).
  await expect(page.getByText(/Judged against Unknown quad X .*\(assumed\)/)).toHaveCount(2);
  await expect(page.getByRole('img', { name: /spectra of both flights/ })).toBeVisible();
  mkdirSync(artifacts, { recursive: true });
  await page.setViewportSize({ width: 1440, height: 1000 });
  await page.screenshot({ path: `${artifacts}compare-desktop.png`, fullPage: true });
  await page.setViewportSize({ width: 820, height: 1180 });
  await page.screenshot({ path: `${artifacts}compare-tablet.png`, fullPage: true });
});
