import type { Page } from '@playwright/test';

/**
 * Everything the page writes to the console as an error or a warning, and uncaught exceptions,
 * from now on. Normal use leaves this empty: a signed-out visit, an offline journey.
 */
export function collectConsoleProblems(page: Page): string[] {
  const problems: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error' || message.type() === 'warning')
      problems.push(`${message.type()}: ${message.text()} (${message.location().url})`);
  });
  page.on('pageerror', (error) => problems.push(`uncaught: ${error.message}`));
  return problems;
}
