import { expect, test, type Page } from '@playwright/test';
import { writeForeignHeaderCsv } from './fixtures/foreign-csv';
import { writeScenarioCsv } from './fixtures/synth-log';
import { expectAccessibleAtBothWidths } from './helpers/axe';
import {
  addAircraftFromPreset,
  createTeam,
  localSyncErrors,
  signUp,
  uniqueEmail,
} from './helpers/accounts';

/**
 * WCAG 2.1 AA on every screen, desktop and phone, signed out and in: axe finds no serious or
 * critical violation once each page has settled.
 */

const SECTIONS = [
  'Balance',
  'Torque split',
  'Effort',
  'Vibration',
  'Filter bench',
  'Power',
  'Headroom',
  'Tracking',
  'Compare',
];

async function scanEverySection(page: Page, who: string) {
  await expectAccessibleAtBothWidths(page, `review as it opens (${who})`);
  const nav = page.getByRole('navigation', { name: 'Evidence' });
  for (const name of SECTIONS) {
    await nav.getByRole('link', { name, exact: true }).click();
    await expect(page.locator('#section-title')).toHaveText(name);
    await page.waitForTimeout(300); // charts build after the first paint
    await expectAccessibleAtBothWidths(page, `review, ${name} (${who})`);
  }
}

test.use({ viewport: { width: 1280, height: 900 } });

test('signed out: sign-in, sign-up, reset, import with its column map and every review section', async ({
  page,
}) => {
  test.setTimeout(240_000);
  await page.goto('/sign-in');
  await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: 'Server' })).toHaveText(/Server online/);
  await expectAccessibleAtBothWidths(page, 'sign-in');
  await page.goto('/sign-up');
  await expect(page.getByRole('button', { name: 'Create account' })).toBeVisible();
  await expectAccessibleAtBothWidths(page, 'sign-up');
  await page.goto('/reset');
  await expect(page.getByRole('button', { name: 'Send reset link' })).toBeVisible();
  await expectAccessibleAtBothWidths(page, 'password reset');

  await page.goto('/import');
  await expect(page.getByRole('heading', { level: 1, name: 'Import' })).toBeVisible();
  await expectAccessibleAtBothWidths(page, 'import');
  await page.getByLabel('Flight logs').setInputFiles(writeForeignHeaderCsv());
  const step = page.getByRole('region', { name: /Column map for kite-export\.csv/ });
  await expect(step).toBeVisible({ timeout: 30_000 });
  await expectAccessibleAtBothWidths(page, 'import, column map');
  for (const h of ['Out0', 'Out1', 'Out2', 'Out3'])
    await step.getByLabel(`Unit for ${h}`).selectOption('frac');
  await step.getByRole('button', { name: 'Read with this map' }).click();
  await expect(page).toHaveURL(/\/flights\//, { timeout: 60_000 });
  await expect(page.getByRole('region', { name: 'Verdict' })).toBeVisible();
  await scanEverySection(page, 'signed out, kept on this device');
});

test('signed in: fleet, aircraft sections, team, inbox, account and a synced review with a comment', async ({
  page,
}) => {
  test.setTimeout(300_000);
  await signUp(page, { name: 'Orla Fenwick', email: uniqueEmail('a11y') });
  await createTeam(page, 'Tern Field Flyers');
  await expectAccessibleAtBothWidths(page, 'empty fleet');

  await addAircraftFromPreset(page, { name: 'Kite', preset: 'quad-x', armMm: 110 });
  await expectAccessibleAtBothWidths(page, 'aircraft');
  const sections = page.getByRole('navigation', { name: 'Aircraft sections' });
  for (const label of ['Airframe', 'Parts', 'Service log', 'Bench runs', 'Trends']) {
    await sections.getByRole('link', { name: label }).click();
    await expect(sections.getByRole('link', { name: label })).toHaveAttribute(
      'aria-current',
      'page',
    );
    await expectAccessibleAtBothWidths(page, `aircraft, ${label}`);
  }

  const main = page.getByRole('navigation', { name: 'Main' });
  await main.getByRole('link', { name: 'Team' }).click();
  const invite = page.getByRole('form', { name: 'Invite' });
  await invite.getByLabel('E-mail').fill(uniqueEmail('coach'));
  await invite.getByLabel('Role').selectOption('coach');
  await invite.getByRole('button', { name: 'Send invite' }).click();
  await expect(page.getByRole('table', { name: 'Invitations' })).toBeVisible();
  await expectAccessibleAtBothWidths(page, 'team');
  await main.getByRole('link', { name: 'Inbox' }).click();
  await expect(page.getByRole('list', { name: 'Messages' })).toBeVisible();
  await expectAccessibleAtBothWidths(page, 'inbox');
  await page.getByRole('link', { name: 'Orla Fenwick' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Account' })).toBeVisible();
  await expectAccessibleAtBothWidths(page, 'account');

  await main.getByRole('link', { name: 'Import' }).click();
  await page.getByLabel('Aircraft').selectOption({ label: 'Kite · 4 motors' });
  await expectAccessibleAtBothWidths(page, 'import, signed in');
  await page
    .getByLabel('Flight logs')
    .setInputFiles(writeScenarioCsv('worn-motor-3', { seconds: 20 }));
  await expect(page).toHaveURL(/\/flights\/[0-9a-f-]{36}/, { timeout: 60_000 });
  await expect(page.getByTestId('sync-state'), 'sync should finish')
    .toHaveText('All synced', { timeout: 60_000 })
    .catch(async (error: unknown) => {
      throw new Error(`${String(error)}\nlocal store: ${await localSyncErrors(page)}`);
    });
  await page.reload();
  await page
    .getByRole('combobox', { name: 'Comment at the cursor' })
    .fill('Spin motor 3 by hand, props off, and feel the bearing.');
  await page.getByRole('button', { name: 'Comment', exact: true }).click();
  await expect(page.getByRole('article', { name: /Comment by Orla Fenwick/ })).toBeVisible();
  await scanEverySection(page, 'signed in, synced, with a comment');

  await main.getByRole('link', { name: 'Fleet' }).click();
  await expect(page.getByRole('table', { name: 'Flights' })).toContainText('worn-motor-3');
  await expectAccessibleAtBothWidths(page, 'fleet with a flight');
});
