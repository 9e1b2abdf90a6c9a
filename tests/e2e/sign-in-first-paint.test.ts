import { mainNav } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { signUpFirm } from './support/firm-fixtures';

// Issue 16: the sign-in page paints from its HTML and stylesheet before the app's script has loaded (it is
// rendered at build time, packages/devstack/src/prerender-sign-in.ts), and the script, once it runs, takes that
// markup over without redrawing it: what was typed meanwhile stays.

test('the sign-in page comes in the HTML, waits for its script only to send, and keeps what was typed before it ran', async ({
  page,
  browser,
  baseURL,
  request,
}) => {
  await test.step('the HTML holds the form, and the app script starts only after the first paint', async () => {
    const html = await (await request.get('/sign-in')).text();
    expect(html).toMatch(/<h1[^>]*>Sign in<\/h1>/);
    expect(html).toContain('name="email"');
    expect(html).toContain('name="password"');
    expect(html).not.toMatch(/<script[^>]+src="\/assets\/index-/);
    expect(html).toMatch(/<script type="module" crossorigin src="\/assets\/sign-in-boot-[0-9a-f]{8}\.js"><\/script>/);
    // The form posts, never GETs (a password in the address would sit in the history); the post comes back here.
    expect(html).toMatch(/<form[^>]*method="post"/);
    const posted = await request.post('/sign-in', {
      form: { email: 'someone@example.test', password: 'not sent anywhere' },
      maxRedirects: 0,
    });
    expect(posted.status()).toBe(303);
    expect(posted.headers()['location']).toBe('/sign-in');
  });

  await test.step('with scripts off the form shows, and its button waits', async () => {
    const noScript = await browser.newContext({ javaScriptEnabled: false });
    const bare = await noScript.newPage();
    await bare.goto(`${baseURL}/sign-in`);
    await expect(bare.getByRole('heading', { name: 'Sign in', level: 1 })).toBeVisible();
    await expect(bare.getByLabel('E-mail', { exact: true })).toBeVisible();
    await expect(bare.getByRole('button', { name: 'Sign in' })).toBeDisabled();
    await noScript.close();
  });

  await test.step('typed before the script ran, kept after it took over; no hydration error', async () => {
    const firm = await signUpFirm(baseURL!);
    const errors: string[] = [];
    page.on('console', (message) => {
      if (message.type() === 'error') errors.push(message.text());
    });
    page.on('pageerror', (error) => errors.push(error.message));
    // The app's script is held back until the e-mail has been typed into the pre-rendered field.
    let release: () => void = () => undefined;
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route(/\/assets\/index-[^/]+\.js$/, async (route) => {
      await held;
      await route.continue();
    });
    await page.goto('/sign-in', { waitUntil: 'commit' });
    const email = page.getByLabel('E-mail', { exact: true });
    await email.fill(firm.owner.email);
    await expect(page.getByRole('button', { name: 'Sign in' })).toBeDisabled();
    release();
    await expect(page.getByRole('button', { name: 'Sign in' })).toBeEnabled();
    await expect(email).toHaveValue(firm.owner.email);
    await page.getByLabel('Password', { exact: true }).fill(firm.owner.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(mainNav(page)).toBeVisible();
    expect(errors.filter((text) => /hydrat|#418|#423|#425/i.test(text))).toEqual([]);
  });
});
