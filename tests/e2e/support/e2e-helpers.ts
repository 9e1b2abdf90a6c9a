import { expect, request as playwrightRequest, type APIRequestContext, type Page } from '@playwright/test';

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

/** The demo accounts' password (invented, seeded by `npm start` and `npm test`). */
export const DEMO_PASSWORD = 'heatfleet-demo-2026';

/** A signed-in API client (session cookie and CSRF token), for preparing a test's own data as another member. */
export async function signInToApi(baseURL: string, email: string, password = DEMO_PASSWORD): Promise<{ api: APIRequestContext; csrf: string }> {
  const api = await playwrightRequest.newContext({ baseURL });
  const first = await api.get('/api/auth/csrf');
  expect(first.ok()).toBe(true);
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const signedIn = await api.post('/api/auth/sign-in', { data: { email, password }, headers: { 'X-CSRF-Token': csrfToken } });
  expect(signedIn.status(), await signedIn.text()).toBe(200);
  return { api, csrf: ((await signedIn.json()) as { csrfToken: string }).csrfToken };
}
