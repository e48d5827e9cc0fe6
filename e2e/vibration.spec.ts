import { mkdirSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { writeScenarioCsv } from './fixtures/synth-log';

const artifacts = new URL('./artifacts/', import.meta.url).pathname;

test('one chipped prop is one vibration finding naming its motor, and the peak table groups its lines', async ({
  page,
}) => {
  test.setTimeout(120_000);
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  // The synthesiser's chipped prop on motor 2: its once-per-turn line shows at several speeds
  // and on several axes.
  await page.goto('/import');
  await page.getByLabel('Flight logs').setInputFiles(writeScenarioCsv('rotor-imbalance'));
  await expect(page).toHaveURL(/\/flights\/[0-9a-f-]{36}/, { timeout: 60_000 });

  const findings = page
    .getByRole('region', { name: 'Verdict' })
    .getByRole('list', { name: 'Findings' });
  const vibration = findings
    .getByRole('listitem')
    .filter({ has: page.getByRole('link', { name: /^Vibration evidence/ }) });
  await expect(vibration).toHaveCount(1);
  await expect(vibration).toContainText('follows motor 2 once per turn');
  await expect(vibration).toContainText(/Seen on [^.]*gyro_x[^.]* Hz/);
  await expect(vibration).not.toContainText(/motor 4\b/);

  await page
    .getByRole('navigation', { name: 'Evidence' })
    .getByRole('link', { name: 'Vibration', exact: true })
    .click();
  const table = page.getByRole('table', { name: 'Vibration peaks' });
  await expect(table.getByRole('rowheader')).toHaveCount(1);
  await expect(table.getByRole('columnheader', { name: /Level/ })).toContainText(
    'dB re 1 (deg/s)²/Hz',
  );
  await expect(page.getByTestId('band-rms')).toContainText(/gyro_x \d+\.\d deg\/s/);

  // The group opens from the keyboard and lists every gyro peak of the one cause.
  const toggle = table.getByRole('button', { name: /Motor 2/ });
  await toggle.focus();
  await page.keyboard.press('Enter');
  await expect(toggle).toHaveAttribute('aria-expanded', 'true');
  const members = (await toggle.getAttribute('aria-controls'))!.split(' ');
  expect(members.length).toBeGreaterThan(3);
  await expect(table.getByRole('row')).toHaveCount(2 + members.length);

  // On a phone the table fits the screen.
  await page.setViewportSize({ width: 390, height: 844 });
  await expect(table).toBeVisible();
  const box = (await table.boundingBox())!;
  expect(box.x).toBeGreaterThanOrEqual(0);
  expect(box.x + box.width).toBeLessThanOrEqual(390);
  expect(await table.evaluate((t) => t.scrollWidth <= t.clientWidth + 1)).toBe(true);
  mkdirSync(artifacts, { recursive: true });
  await page.screenshot({ path: `${artifacts}vibration-phone.png`, fullPage: true });
  expect(errors).toEqual([]);
});
