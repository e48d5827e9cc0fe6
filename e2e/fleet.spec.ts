import { mkdirSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { writeScenarioCsv } from './fixtures/synth-log';
import {
  addAircraftFromPreset,
  createTeam,
  localSyncErrors,
  signUp,
  uniqueEmail,
} from './helpers/accounts';

test('a tuner edits an airframe, logs a repair and a bench run, and finds a synced flight with the filters', async ({
  page,
}) => {
  test.setTimeout(120_000);
  await signUp(page, { name: 'Rook Tallis', email: uniqueEmail('tuner') });
  await createTeam(page, 'Survey rigs');

  // Osprey from the hex preset: six motors in the table and the preview.
  await addAircraftFromPreset(page, { name: 'Osprey', preset: 'hex-x', armMm: 300 });
  await page
    .getByRole('navigation', { name: 'Aircraft sections' })
    .getByRole('link', { name: 'Airframe' })
    .click();
  const motors = page.getByRole('table', { name: 'Motors' });
  await expect(motors.getByRole('row')).toHaveCount(7);
  await expect(page.getByRole('img', { name: 'Top view: 6 motors, nose up' })).toBeVisible();
  await page.getByLabel('Take-off mass (g)').fill('3150');
  await page.getByRole('button', { name: 'Save airframe' }).click();
  await expect(page.getByText('Airframe saved.')).toBeVisible();
  await expect(page.getByText(/3150 g/)).toBeVisible();

  const sections = page.getByRole('navigation', { name: 'Aircraft sections' });
  await sections.getByRole('link', { name: 'Service log' }).click();
  const entry = page.getByRole('form', { name: 'Add service entry' });
  await entry.getByLabel('Kind').selectOption('part-swap');
  await entry.getByLabel('Motor').selectOption('4');
  await entry.getByLabel('What was done').fill('Replaced motor 4 bearing after a rough spin-up');
  await entry.getByRole('button', { name: 'Add entry' }).click();
  await expect(page.getByRole('table', { name: 'Service log' })).toContainText(
    'Replaced motor 4 bearing',
  );

  await sections.getByRole('link', { name: 'Bench runs' }).click();
  await page.getByText('Add a bench run').click();
  const bench = page.getByRole('form', { name: 'Add bench run' });
  await bench.getByLabel('Motor', { exact: true }).fill('4114 400kV');
  await bench.getByLabel('Prop', { exact: true }).fill('15×5.5×2');
  await bench
    .getByLabel(/Paste readings/)
    .fill(
      'throttle\tthrust\tcurrent\trpm\tvolts\n25\t420\t2.1\t3100\t24.6\n50\t1180\t7.4\t5200\t24.2\n75\t2050\t16.0\t6800\t23.7\n',
    );
  await bench.getByRole('button', { name: 'Fill table from pasted lines' }).click();
  await bench.getByRole('button', { name: 'Save bench run' }).click();
  const run = page.getByRole('table', { name: /Bench run .* 4114 400kV/ });
  await expect(run).toContainText('1180');
  // 1180 g ÷ (7.4 A × 24.2 V = 179.08 W) = 6.59 g/W.
  await expect(run).toContainText('6.59');

  // A quad for the flight list: import a log online, it syncs, and the filters find it.
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Fleet' }).click();
  await addAircraftFromPreset(page, { name: 'Kite', preset: 'quad-x', armMm: 110 });
  await page
    .getByRole('navigation', { name: 'Main' })
    .getByRole('link', { name: 'Import' })
    .click();
  await page.getByLabel('Aircraft').selectOption({ label: 'Kite · 4 motors' });
  await page
    .getByLabel('Flight logs')
    .setInputFiles(writeScenarioCsv('weak-motor', { seconds: 20 }));
  await expect(page).toHaveURL(/\/flights\/[0-9a-f-]{36}/, { timeout: 60_000 });
  await expect(page.getByTestId('sync-state'), 'sync should finish')
    .toHaveText('All synced', { timeout: 30_000 })
    .catch(async (error: unknown) => {
      throw new Error(`${String(error)}\nlocal store: ${await localSyncErrors(page)}`);
    });

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Fleet' }).click();
  const flights = page.getByRole('table', { name: 'Flights' });
  await expect(flights).toContainText('Kite');
  const filters = page.getByRole('search', { name: 'Filter flights' });
  await filters.getByLabel('Aircraft').selectOption({ label: 'Osprey' });
  await expect(page.getByText('No flights match.')).toBeVisible();
  await expect(page).toHaveURL(/aircraftId=/);
  await filters.getByLabel('Aircraft').selectOption({ label: 'Kite' });
  await expect(flights).toContainText('weak-motor.csv');
  await filters.getByLabel('Pilot').selectOption({ label: 'Rook Tallis' });
  // A weak motor is at least worth watching.
  await filters.getByLabel('Verdict at least').selectOption('watch');
  await expect(page).toHaveURL(/severity=watch/);
  await expect(flights).toContainText('weak-motor.csv');
  await filters.getByLabel('Review').selectOption('reviewed');
  await expect(page.getByText('No flights match.')).toBeVisible();
  await page.getByRole('button', { name: 'Clear filters' }).click();
  await expect(flights).toContainText('weak-motor.csv');
  await expect(page.getByRole('list', { name: 'Aircraft' })).toContainText('1 flight');

  const artifacts = new URL('./artifacts/', import.meta.url).pathname;
  mkdirSync(artifacts, { recursive: true });
  await page.setViewportSize({ width: 1440, height: 1000 });
  await page.screenshot({ path: `${artifacts}fleet-desktop.png`, fullPage: true });

  // The aircraft's trends now have a point per synced flight.
  await page.getByRole('list', { name: 'Aircraft' }).getByRole('link', { name: 'Kite' }).click();
  await expect(page.getByRole('img', { name: 'Balance trend' })).toBeVisible();
  await expect(page.getByRole('img', { name: 'Battery trend' })).toBeVisible();
  await page.screenshot({ path: `${artifacts}aircraft-trends-desktop.png`, fullPage: true });
  await page
    .getByRole('navigation', { name: 'Aircraft sections' })
    .getByRole('link', { name: 'Airframe' })
    .click();
  await page.screenshot({ path: `${artifacts}aircraft-airframe-desktop.png`, fullPage: true });
});

test('an entry logged by mistake leaves the service log and the bench runs after a confirmation', async ({
  page,
}) => {
  await signUp(page, { name: 'Rook Tallis', email: uniqueEmail('owner') });
  await createTeam(page, 'Survey rigs');
  await addAircraftFromPreset(page, { name: 'Osprey', preset: 'hex-x', armMm: 300 });
  const sections = page.getByRole('navigation', { name: 'Aircraft sections' });

  await sections.getByRole('link', { name: 'Service log' }).click();
  const form = page.getByRole('form', { name: 'Add service entry' });
  for (const note of ['Replaced motor 4 bearing', 'Wrong aircraft: Heron gimbal damper']) {
    await form.getByLabel('What was done').fill(note);
    await form.getByRole('button', { name: 'Add entry' }).click();
    await expect(page.getByRole('table', { name: 'Service log' })).toContainText(note);
  }
  const log = page.getByRole('table', { name: 'Service log' });
  const mistake = log.getByRole('row').filter({ hasText: 'Heron gimbal damper' });
  page.once('dialog', (d) => void d.dismiss());
  await mistake.getByRole('button', { name: /^Delete/ }).click();
  await expect(log).toContainText('Heron gimbal damper');
  page.once('dialog', (d) => {
    expect(d.message()).toContain('Heron gimbal damper');
    void d.accept();
  });
  await mistake.getByRole('button', { name: /^Delete/ }).click();
  await expect(log).not.toContainText('Heron gimbal damper');
  await expect(log).toContainText('Replaced motor 4 bearing');
  await page.reload();
  await expect(page.getByRole('table', { name: 'Service log' })).not.toContainText(
    'Heron gimbal damper',
  );

  await sections.getByRole('link', { name: 'Bench runs' }).click();
  await page.getByText('Add a bench run').click();
  const bench = page.getByRole('form', { name: 'Add bench run' });
  await bench.getByLabel('Motor', { exact: true }).fill('4114 400kV');
  await bench.getByLabel('Prop', { exact: true }).fill('15×5.5×2');
  await bench.getByLabel(/Paste readings/).fill('25\t420\n50\t1180\n');
  await bench.getByRole('button', { name: 'Fill table from pasted lines' }).click();
  await bench.getByRole('button', { name: 'Save bench run' }).click();
  await expect(page.getByRole('table', { name: /Bench run .* 4114 400kV/ })).toBeVisible();
  page.once('dialog', (d) => void d.accept());
  await page.getByRole('button', { name: /^Delete the bench run of .*4114 400kV/ }).click();
  await expect(page.getByText('No bench runs yet.')).toBeVisible();
});
