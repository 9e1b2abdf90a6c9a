import type { Page } from '@playwright/test';
import { firmWithCrew } from './support/crew-fixtures';
import { horizontalOverflow, mainNav, signIn } from './support/e2e-helpers';
import { callApi } from './support/api-session';
import { expect, test } from './support/fixture-test';
import { addKitItem, createKit, createVan, itemKinds } from './support/fleet-fixtures';
import { isoDaysFromNow } from './support/stock-fixtures';

/**
 * A firm with something on every screen: three members, two vans (Van 1's MOT due within the
 * reminder window, so the scan sends one), a kit of three items and the reminders it sent.
 */
async function prepareFirm(baseURL: string) {
  const crew = await firmWithCrew(baseURL, { stores: true, motDueOn: isoDaysFromNow(12) });
  const session = crew.owner.session;
  await createVan(session, {
    name: 'Van 2',
    registration: 'HF70 BRK',
    motDueOn: isoDaysFromNow(200),
    serviceDueOn: isoDaysFromNow(25),
  });
  const kit = await createKit(session, 'Rig 1');
  for (const [n, kind] of (await itemKinds(session)).slice(0, 3).entries()) {
    await addKitItem(session, {
      assetTag: `RIG1-${n + 1}`,
      kindId: kind.id,
      kitId: kit.id,
      serialNumber: `SN-10${n + 1}`,
    });
  }
  const { sent } = await callApi<{ sent: number }>(session, 'post', '/api/reminders/scan', { status: 200 });
  expect(sent, "the scan reminds of Van 1's MOT").toBeGreaterThan(0);
  return crew.owner;
}

/** Visible buttons, drop-downs and text fields shorter than 48 px, each as its tag and name. */
async function shortTargets(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    Array.from(
      document.querySelectorAll<HTMLElement>(
        'button, select, textarea, input:not([type=checkbox]):not([type=radio]):not([type=hidden])',
      ),
    )
      .filter((element) => {
        const rect = element.getBoundingClientRect();
        return rect.width > 0 && rect.height > 0 && rect.height < 47.5;
      })
      .map(
        (element) =>
          `${element.tagName.toLowerCase()} "${(element.getAttribute('aria-label') ?? element.textContent ?? '').trim().slice(0, 40)}" ${Math.round(element.getBoundingClientRect().height)} px`,
      ),
  );
}

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true });

test('at 360 px the Owner can sign in, no screen scrolls sideways and every button and field is 48 px tall', async ({
  page,
  baseURL,
}, testInfo) => {
  const owner = await prepareFirm(baseURL!);
  await page.goto('/sign-in');
  expect((await horizontalOverflow(page)).scrollWidth).toBeLessThanOrEqual(360);

  await signIn(page, owner.email, owner.password);
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
      // DEVELOPERS.md, phone first: every button and field a gloved thumb aims at is at least 48 px tall.
      expect(await shortTargets(page), `${screen}: controls under 48 px`).toEqual([]);
    });
  }
});
