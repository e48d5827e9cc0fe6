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
  const log = writeScenarioCsv('weak-motor');
  await page.goto('/import');
  await page.getByLabel('Flight logs').setInputFiles(log);

  // The worker path: progress is reported while the file is read.
  await expect(page.getByRole('progressbar', { name: /Reading weak-motor\.csv/ })).toBeVisible();

  // The review opens on its own when the analysis is done, before any upload.
  await expect(page).toHaveURL(/\/flights\/[0-9a-f-]{36}/, { timeout: 60_000 });
  const verdict = page.getByRole('region', { name: 'Verdict' });
  await expect(verdict).toBeVisible();
  const findings = verdict.getByRole('list', { name: 'Findings' });
  await expect(findings.getByRole('listitem').first()).toContainText('Motor 3');
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
