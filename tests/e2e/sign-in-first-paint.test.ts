import { mainNav } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { signUpFirm } from './support/firm-fixtures';

// Issue 16: the sign-in page paints from its HTML and stylesheet alone (it is rendered at build time,
// packages/devstack/src/prerender-sign-in.ts); the app's script is fetched only when someone uses the page (or is
// already signed in), and once it runs it takes that markup over without redrawing it: what was typed stays, and a
// tap on Sign in made before it ran is sent after.

test('the sign-in page comes in the HTML, loads the app when used, and sends what was typed before it ran', async ({
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

  await test.step('the app is fetched only once the page is used; a tap on Sign in before it ran is sent after', async () => {
    const firm = await signUpFirm(baseURL!);
    const errors: string[] = [];
    page.on('console', (message) => {
      if (message.type() === 'error') errors.push(message.text());
    });
    page.on('pageerror', (error) => errors.push(error.message));
    const entryRequests: string[] = [];
    page.on('request', (r) => {
      if (/\/assets\/index-[^/]+\.js$/.test(r.url())) entryRequests.push(r.url());
    });
    // The app's script is held back until the form has been filled in and sent.
    let release: () => void = () => undefined;
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route(/\/assets\/index-[^/]+\.js$/, async (route) => {
      await held;
      await route.continue();
    });
    // The page asks whether someone is signed in (nobody is here), and then waits to be used.
    const askedWhoIsSignedIn = page.waitForResponse((r) => new URL(r.url()).pathname === '/api/me');
    await page.goto('/sign-in');
    expect((await askedWhoIsSignedIn).status()).toBe(401);
    await page.waitForTimeout(1000);
    expect(entryRequests).toEqual([]);
    const email = page.getByLabel('E-mail', { exact: true });
    await email.fill(firm.owner.email);
    await expect.poll(() => entryRequests.length).toBe(1);
    await page.getByLabel('Password', { exact: true }).fill(firm.owner.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(email).toHaveValue(firm.owner.email);
    release();
    await expect(mainNav(page)).toBeVisible();
    expect(errors.filter((text) => /hydrat|#418|#423|#425/i.test(text))).toEqual([]);
  });

  await test.step('someone already signed in who opens the sign-in page is taken on without touching it', async () => {
    await page.goto('/sign-in');
    await expect(mainNav(page)).toBeVisible();
    await expect(page).toHaveURL(/\/$/);
  });
});
