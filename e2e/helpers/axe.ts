import AxeBuilder from '@axe-core/playwright';
import { expect, type Page } from '@playwright/test';

/** WCAG 2.1 A and AA, the level the app promises. */
const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];
export const PHONE = { width: 390, height: 844 };

/**
 * Scans the page as it stands and fails on any serious or critical violation, listing each
 * rule with the elements it caught (so a failure says what to fix, not just that it failed).
 * Call it once the page has settled: after its heading or data is visible.
 */
export async function expectNoSeriousA11yIssues(page: Page, where: string): Promise<void> {
  // Two frames, so text that mounts with the data has its final colours and layout.
  await page.evaluate(
    () => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done))),
  );
  const result = await new AxeBuilder({ page }).withTags(TAGS).analyze();
  const blocking = result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `${v.impact}: ${v.id} (${v.help})\n` +
        v.nodes
          .slice(0, 5)
          .map(
            (n) => `    ${n.target.join(' ')}: ${n.failureSummary?.split('\n')[1]?.trim() ?? ''}`,
          )
          .join('\n'),
    );
  expect(blocking, `accessibility of ${where} (${page.viewportSize()?.width} px)`).toEqual([]);
}

/** Scans at the page's own width and again at a 390-px phone, then puts the viewport back. */
export async function expectAccessibleAtBothWidths(page: Page, where: string): Promise<void> {
  await expectNoSeriousA11yIssues(page, where);
  const desktop = page.viewportSize();
  await page.setViewportSize(PHONE);
  try {
    await expectNoSeriousA11yIssues(page, where);
  } finally {
    if (desktop) await page.setViewportSize(desktop);
  }
}
