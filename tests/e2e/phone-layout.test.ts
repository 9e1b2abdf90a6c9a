import { expect, test } from '@playwright/test';
import { horizontalOverflow, mainNav, signIn } from './support/e2e-helpers';

// The demo firm's Owner, seeded by the API's db-cli (invented data).
const demoOwner = { email: 'owner@brackenford.example', password: 'heatfleet-demo-2026' };

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true });

test('at 360 px the demo Owner can sign in and no screen scrolls sideways', async ({ page }, testInfo) => {
  await page.goto('/sign-in');
  expect((await horizontalOverflow(page)).scrollWidth).toBeLessThanOrEqual(360);

  await signIn(page, demoOwner.email, demoOwner.password);
  await expect(page.getByRole('heading', { name: 'Your role: Owner' })).toBeVisible();

  const tables: Record<string, string> = {
    Team: 'Members of the firm',
    Vans: 'Vans of the firm',
    Kits: 'Kit items',
    Reminders: 'Reminders sent',
  };
  for (const screen of ['Home', 'Vans', 'Kits', 'Reminders', 'Team', 'Settings', 'Outbox']) {
    await test.step(screen, async () => {
      await mainNav(page).getByRole('link', { name: screen }).click();
      await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
      const table = tables[screen];
      if (table) await expect(page.getByRole('table', { name: table })).toBeVisible();
      await page.screenshot({ path: testInfo.outputPath(`${screen.toLowerCase()}-360.png`), fullPage: true });
      const overflow = await horizontalOverflow(page);
      expect(overflow.scrollWidth, `${screen} overflows: ${overflow.widest ?? ''}`).toBeLessThanOrEqual(360);
    });
  }
});
