import { expect, test } from '@playwright/test';
import { horizontalOverflow, mainNav, signIn } from './support/e2e-helpers';

// The demo firm's Owner, seeded by the API's db-cli (invented data).
const demoOwner = { email: 'owner@brackenford.example', password: 'heatfleet-demo-2026' };

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true });

test('at 360 px the demo Owner can sign in and no screen scrolls sideways', async ({ page }) => {
  await page.goto('/sign-in');
  expect((await horizontalOverflow(page)).scrollWidth).toBeLessThanOrEqual(360);

  await signIn(page, demoOwner.email, demoOwner.password);
  await expect(page.getByRole('heading', { name: 'Your role: Owner' })).toBeVisible();

  for (const screen of ['Home', 'Team', 'Outbox']) {
    await test.step(screen, async () => {
      await mainNav(page).getByRole('link', { name: screen }).click();
      await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
      if (screen === 'Team') await expect(page.getByRole('table', { name: 'Members of the firm' })).toBeVisible();
      const overflow = await horizontalOverflow(page);
      expect(overflow.scrollWidth, `${screen} overflows: ${overflow.widest ?? ''}`).toBeLessThanOrEqual(360);
    });
  }
});
