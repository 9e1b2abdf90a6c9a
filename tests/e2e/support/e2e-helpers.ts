import { expect, type Page } from '@playwright/test';

/** Unique per run, so the test can run again against the same database without clashing. */
export function runId(): string {
  return `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 7)}`;
}

export function mainNav(page: Page) {
  return page.getByRole('navigation', { name: 'Main' });
}

export async function expectNavLinks(page: Page, names: string[]): Promise<void> {
  await expect(mainNav(page).getByRole('link')).toHaveText(names);
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail', { exact: true }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(mainNav(page)).toBeVisible();
}

export async function horizontalOverflow(page: Page): Promise<{ scrollWidth: number; widest: string | null }> {
  return page.evaluate(() => {
    const root = document.scrollingElement ?? document.documentElement;
    const width = root.clientWidth;
    let widest: string | null = null;
    for (const element of Array.from(document.querySelectorAll('body *'))) {
      const rect = element.getBoundingClientRect();
      if (rect.right > width + 0.5) {
        widest = `${element.tagName.toLowerCase()}.${String(element.className).slice(0, 80)} right=${Math.round(rect.right)}`;
        break;
      }
    }
    return { scrollWidth: root.scrollWidth, widest };
  });
}
