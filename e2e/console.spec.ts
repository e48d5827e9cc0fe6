import { expect, test } from '@playwright/test';
import { collectConsoleProblems } from './helpers/console';

test('a signed-out visit leaves the console clean: no 401 for "who is signed in", no warnings', async ({
  page,
}) => {
  const problems = collectConsoleProblems(page);
  await page.goto('/');
  // A team page sends a signed-out visitor to sign in.
  await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: 'Server' })).toHaveText(/Server online/);
  for (const path of ['/sign-up', '/reset', '/import', '/team']) {
    await page.goto(path);
    await expect(page.getByRole('navigation', { name: 'Main' })).toBeVisible();
    await page.waitForLoadState('networkidle');
  }
  expect(problems).toEqual([]);
});
