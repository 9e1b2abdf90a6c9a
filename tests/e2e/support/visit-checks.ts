import AxeBuilder from '@axe-core/playwright';
import { expect, type Page } from '@playwright/test';
import { horizontalOverflow } from './e2e-helpers';

/** Controls in the page's main part shorter than 48 px: the engineer may be wearing gloves. */
export async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    Array.from(
      document.querySelectorAll(
        'main button, main select, main input:not([type=checkbox]):not([type=radio]), main textarea, main summary, main a',
      ),
    )
      .filter((el) => (el as HTMLElement).offsetParent !== null && !el.closest('details:not([open]) > :not(summary)'))
      .filter((el) => el.getBoundingClientRect().height < 47.5)
      .map(
        (el) =>
          `${el.tagName.toLowerCase()} "${(el.textContent ?? '').trim().slice(0, 40) || (el as HTMLInputElement).name}" ${Math.round(el.getBoundingClientRect().height)} px`,
      ),
  );
}

/** At 360 px wide (a small phone) nothing scrolls sideways; the viewport goes back afterwards. */
export async function expectNoSidewaysScroll(page: Page, what: string): Promise<void> {
  const before = page.viewportSize()!;
  await page.setViewportSize({ width: 360, height: before.height });
  const overflow = await horizontalOverflow(page);
  await page.setViewportSize(before);
  expect(overflow.scrollWidth, `${what} scrolls sideways at 360 px: ${overflow.widest ?? ''}`).toBeLessThanOrEqual(360);
}

/** axe-core over the page: no serious or critical violation of WCAG 2.1 A and AA (contrast included). */
export async function expectNoSeriousAxeViolations(page: Page, what: string): Promise<void> {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
  const serious = results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `${v.id} (${v.impact}): ${v.help} at ${v.nodes
          .map((n) => n.target.join(' '))
          .slice(0, 3)
          .join(', ')}`,
    );
  expect(serious, `axe on ${what}`).toEqual([]);
}

/** The three checks at one point of the visit. */
export async function checkScreen(page: Page, what: string): Promise<void> {
  expect(await smallTargets(page), `controls under 48 px on ${what}`).toEqual([]);
  await expectNoSidewaysScroll(page, what);
  await expectNoSeriousAxeViolations(page, what);
}
