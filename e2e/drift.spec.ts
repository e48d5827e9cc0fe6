import { expect, test } from '@playwright/test';
import { writeScenarioCsv } from './fixtures/synth-log';
import { addAircraftFromPreset, createTeam, signUp, uniqueEmail } from './helpers/accounts';

test('a flight is judged against its aircraft’s earlier flights, and Stick response is read in Tracking', async ({
  page,
}) => {
  test.setTimeout(300_000);
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signUp(page, { name: 'Ines Marlow', email: uniqueEmail('drift') });
  await createTeam(page, 'Tern Field Flyers');
  await addAircraftFromPreset(page, { name: 'Kite', preset: 'quad-x', armMm: 110 });

  const fly = async (scenario: string, seed: number) => {
    await page.goto('/import');
    await page.getByLabel('Aircraft').selectOption({ label: 'Kite · 4 motors' });
    await page
      .getByLabel('Flight logs')
      .setInputFiles(writeScenarioCsv(scenario, { seconds: 20, seed }));
    await expect(page).toHaveURL(/\/flights\/[0-9a-f-]{36}/, { timeout: 60_000 });
  };
  await fly('clean-quad-x', 11);
  // The first flight has nothing to be judged against, and says so.
  const verdict = page.getByRole('region', { name: 'Verdict' });
  await expect(verdict.getByTestId('drift-line')).toHaveText(
    /No drift: Kite has 0 earlier flights with enough hover.*it takes 3\./,
  );
  await fly('clean-quad-x', 12);
  await fly('clean-quad-x', 13);
  await fly('worn-motor-3', 14);
  await expect(verdict.getByTestId('drift-line')).toHaveText(
    /Drift judged against Kite’s last 3 flights.*beyond its usual flight-to-flight spread/,
    { timeout: 30_000 },
  );
  await expect(verdict.getByRole('list', { name: 'Findings' })).toContainText(
    /Motor 3 now works \d+\.\d points harder than it used to/,
  );

  await page
    .getByRole('navigation', { name: 'Evidence' })
    .getByRole('link', { name: 'Tracking', exact: true })
    .click();
  const response = page.getByRole('table', { name: 'Stick response per axis' });
  // This short hover-heavy flight may not move the sticks enough to read; either way it says so.
  await expect(response).toContainText(
    /Roll\s*(?:[\d.]+ Hz|beyond input)\s*[−-]?[\d.]+ dB|Roll\s*too little stick movement/,
  );
  await expect(
    page.getByRole('img', { name: /Stick response, gain and phase against frequency\. Roll: / }),
  ).toBeVisible();
  expect(errors).toEqual([]);
});
