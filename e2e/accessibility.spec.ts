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

async function scanEverySection(page: Page, who: string, shots: string) {
  await expectAccessibleAtBothWidths(page, `review as it opens (${who})`);
  const nav = page.getByRole('navigation', { name: 'Evidence' });
  for (const name of SECTIONS) {
    await nav.getByRole('link', { name, exact: true }).click();
    await expect(page.locator('#section-title')).toHaveText(name);
    await page.waitForTimeout(300); // charts build after the first paint
    // Every section fits a phone: nothing scrolls sideways.
    await expectAccessibleAtBothWidths(page, `review, ${name} (${who})`, {
      fits: true,
      screenshot: `${shots}-${name.replace(/\W+/g, '-').toLowerCase()}`,
    });
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
  await expectAccessibleAtBothWidths(page, 'sign-in', { fits: true, screenshot: 'sign-in' });
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
  await expectAccessibleAtBothWidths(page, 'import, column map', {
    fits: true,
    screenshot: 'import-column-map',
  });
  for (const h of ['Out0', 'Out1', 'Out2', 'Out3'])
    await step.getByLabel(`Unit for ${h}`).selectOption('frac');
  await step.getByRole('button', { name: 'Read with this map' }).click();
  await expect(page).toHaveURL(/\/flights\//, { timeout: 60_000 });
  await expect(page.getByRole('region', { name: 'Verdict' })).toBeVisible();
  await scanEverySection(page, 'signed out, kept on this device', 'review-local');
});

test('signed in: fleet, aircraft sections, team, inbox, account and a synced review with a comment', async ({
  page,
}) => {
  // About forty scans at two widths; on a busy two-core machine that takes several minutes.
  test.setTimeout(600_000);
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
    // The airframe tab (motor table, preview, build figures) fits a phone without sideways scroll.
    await expectAccessibleAtBothWidths(
      page,
      `aircraft, ${label}`,
      label === 'Airframe' ? { fits: true, screenshot: 'aircraft-airframe' } : {},
    );
  }

  const main = page.getByRole('navigation', { name: 'Main' });
  await main.getByRole('link', { name: 'Team' }).click();
  const invite = page.getByRole('form', { name: 'Invite' });
  await invite.getByLabel('E-mail').fill(uniqueEmail('coach'));
  await invite.getByLabel('Role').selectOption('coach');
  await invite.getByRole('button', { name: 'Send invite' }).click();
  await expect(page.getByRole('table', { name: 'Invitations' })).toBeVisible();
  await expectAccessibleAtBothWidths(page, 'team', { fits: true, screenshot: 'team' });
  await main.getByRole('link', { name: 'Inbox' }).click();
  await expect(page.getByRole('list', { name: 'Messages' })).toBeVisible();
  await expectAccessibleAtBothWidths(page, 'inbox', { fits: true, screenshot: 'inbox' });
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

  // Keyboard only: the cursor is a slider, `c` opens the comment box at it, and once the
  // comment is sent focus is back on the slider, drawn with a visible focus mark.
  const cursor = page.getByRole('slider', { name: 'Flight cursor' });
  await cursor.focus();
  await page.keyboard.press('End');
  await expect(cursor).toHaveAttribute('aria-valuetext', /^t 20\.\d\d s/);
  await page.keyboard.press('Home');
  await expect(cursor).toHaveAttribute('aria-valuetext', /^t 0\.00 s/);
  await page.keyboard.press('ArrowRight');
  await page.keyboard.press('c');
  const box = page.getByRole('textbox', { name: 'Comment at the cursor' });
  await expect(box).toBeFocused();
  await page.keyboard.type('Spin motor 3 by hand, props off, and feel the bearing.');
  await page.keyboard.press('Control+Enter');
  await expect(page.getByRole('article', { name: /Comment by Orla Fenwick/ })).toBeVisible();
  await expect(cursor).toBeFocused();
  expect(await cursor.evaluate((el) => getComputedStyle(el).outlineStyle)).not.toBe('none');

  // The pin is a button too: it moves the cursor to the comment's moment.
  await page.keyboard.press('End');
  const pin = page.getByRole('list', { name: 'Comment pins' }).getByRole('button').first();
  const pinnedAt = /at (\d+\.\d\d) s/.exec((await pin.getAttribute('aria-label')) ?? '')![1]!;
  await pin.focus();
  await page.keyboard.press('Enter');
  await expect(cursor).toHaveAttribute('aria-valuetext', new RegExp(`^t ${pinnedAt} s`));
  await scanEverySection(page, 'signed in, synced, with a comment', 'review-team');

  await main.getByRole('link', { name: 'Fleet' }).click();
  await expect(page.getByRole('table', { name: 'Flights' })).toContainText('worn-motor-3');
  await expectAccessibleAtBothWidths(page, 'fleet with a flight', {
    fits: true,
    screenshot: 'fleet',
  });
});
