import { mkdirSync } from 'node:fs';
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

const artifacts = new URL('../artifacts/', import.meta.url).pathname;

/**
 * Scans at the page's own width and again at a 390-px phone, then puts the viewport back.
 * With `phone.fits`, the phone must also show the page without sideways scrolling; with
 * `phone.screenshot`, the phone view is kept in e2e/artifacts under that name.
 */
export async function expectAccessibleAtBothWidths(
  page: Page,
  where: string,
  phone: { fits?: boolean; screenshot?: string } = {},
): Promise<void> {
  await expectNoSeriousA11yIssues(page, where);
  const desktop = page.viewportSize();
  await page.setViewportSize(PHONE);
  try {
    await expectNoSeriousA11yIssues(page, where);
    if (phone.fits)
      await expect
        .poll(() => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth))
        .toBeLessThanOrEqual(0)
        .catch(async () => {
          throw new Error(
            `${where} scrolls sideways at ${PHONE.width} px; too wide:\n${await tooWide(page)}`,
          );
        });
    if (phone.screenshot) {
      mkdirSync(artifacts, { recursive: true });
      await page.screenshot({ path: `${artifacts}phone-${phone.screenshot}.png`, fullPage: true });
    }
  } finally {
    if (desktop) await page.setViewportSize(desktop);
  }
}

/** The outermost elements that reach past the right edge of the screen, for a failure message. */
function tooWide(page: Page): Promise<string> {
  return page.evaluate(() => {
    const right = window.innerWidth + 1;
    const found: string[] = [];
    const clipped = (el: Element) => {
      for (let a = el.parentElement; a; a = a.parentElement)
        if (getComputedStyle(a).overflowX !== 'visible') return true;
      return false;
    };
    for (const el of document.body.querySelectorAll('*')) {
      if (clipped(el)) continue; // inside a box that scrolls or clips by itself
      const box = el.getBoundingClientRect();
      const parent = el.parentElement?.getBoundingClientRect();
      if (box.width > 0 && box.right > right && (!parent || parent.right <= right))
        found.push(
          `  <${el.tagName.toLowerCase()} class="${el.getAttribute('class') ?? ''}"> ${Math.round(box.width)} px wide`,
        );
    }
    return found.slice(0, 6).join('\n');
  });
}
