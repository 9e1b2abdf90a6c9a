import type { Page } from '@playwright/test';
import { firmWithCrew } from './support/crew-fixtures';
import { horizontalOverflow, mainNav, runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { createProduct, isoDaysFromNow, setParLevel } from './support/stock-fixtures';

/**
 * A fresh firm whose engineer drives "Van 1", and a product of its own with par levels on that van,
 * so the numbers the test checks follow from what it set.
 */
async function prepareProduct(baseURL: string) {
  const { stores, engineer, van, depot } = await firmWithCrew(baseURL, { stores: true });
  const session = stores!.session;
  const name = `Trial cleaner ${runId().toUpperCase()}`;
  const product = await createProduct(session, {
    name,
    kind: 'cleaner',
    packSize: 1,
    packUnit: 'l',
    shelfLifeMonths: 24,
  });
  await setParLevel(session, { locationId: van.id, productId: product.id, minimum: 2, target: 4 });
  return { name, depotName: depot.name, stores: stores!, engineer };
}

async function expectNoOverflow(page: Page, what: string) {
  const overflow = await horizontalOverflow(page);
  expect(overflow.scrollWidth, `${what} overflows: ${overflow.widest ?? ''}`).toBeLessThanOrEqual(360);
}

// Each test signs a firm up and walks several screens: on a loaded 2-core machine that runs past a minute.
test.describe.configure({ timeout: 180_000 });

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true, isMobile: true });

test('stores receives a delivery, runs a restock and the engineer sees it on My van', async ({
  page,
  browser,
  baseURL,
}, testInfo) => {
  const { name, depotName, stores, engineer } = await prepareProduct(baseURL!);
  const lot = `T${runId().slice(-6).toUpperCase()}`;

  await signIn(page, stores.email, stores.password);
  await mainNav(page).getByRole('link', { name: 'Stock' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Stock' })).toBeVisible();
  // The new product has no stock anywhere yet, and Van 1 is below its minimum of it.
  await expect(
    page.getByRole('button', { name: `${name} at Van 1: (0 packs of 1 L usable, None usable, minimum 2, target 4)` }),
  ).toBeVisible();
  await page.screenshot({ path: testInfo.outputPath('stock-grid-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the stock grid');

  await page.getByRole('navigation', { name: 'Stock' }).getByRole('link', { name: 'Receive' }).click();
  const receive = page.getByRole('form', { name: 'Receive a delivery' });
  await expect(receive.getByLabel('Depot')).toHaveValue(/\d+/);
  await receive.getByLabel('Delivery note or order reference (optional)').fill(`DN-${lot}`);
  await receive.getByLabel('Product').selectOption({ label: name });
  await receive.getByLabel('Lot number').fill(lot);
  await receive.getByLabel('Use by').fill(isoDaysFromNow(400));
  await receive.getByLabel('Quantity (packs)').fill('10');
  await page.screenshot({ path: testInfo.outputPath('receive-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the delivery form');
  await receive.getByRole('button', { name: 'Receive delivery' }).click();
  await expect(receive.getByText('Received 10 packs on 1 line.')).toBeVisible();

  // The delivery shows in the ledger, with its lot and reference.
  await page.getByRole('navigation', { name: 'Stock' }).getByRole('link', { name: 'Ledger' }).click();
  const received = page.getByRole('row').filter({ hasText: `DN-${lot}` });
  await expect(received).toHaveCount(1);
  await expect(received).toContainText('Received');
  await expect(received).toContainText(lot);
  await expect(received).toContainText('+10');

  await page.getByRole('navigation', { name: 'Stock' }).getByRole('link', { name: 'Restock run' }).click();
  const picks = page.getByRole('list', { name: 'Pick list by van' });
  const van1 = picks.getByRole('listitem').filter({ has: page.getByRole('heading', { name: /^Van 1/ }) });
  const line = van1.getByRole('listitem').filter({ hasText: 'has 0, target 4' }).filter({ hasText: name });
  await expect(line).toContainText(lot);
  // Four packs bring Van 1 from nothing to its target, all from the lot just received.
  await expect(line.getByRole('list', { name: `Lots for ${name} for Van 1` })).toContainText(`${lot}`);
  await expect(line.getByRole('list', { name: `Lots for ${name} for Van 1` })).toContainText('4 packs of 1 L');
  await expect(line.getByLabel(`Packs of ${name} for Van 1`)).toHaveValue('4');
  await expect(page.getByText(`From ${depotName}, first expiry first.`, { exact: false })).toBeVisible();
  await page.screenshot({ path: testInfo.outputPath('restock-run-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the restock run');
  await page.emulateMedia({ media: 'print' });
  await page.screenshot({ path: testInfo.outputPath('pick-list-print.png'), fullPage: true });
  await expect(page.getByRole('button', { name: 'Apply reviewed run' })).toBeHidden();
  await page.emulateMedia({ media: 'screen' });

  await page.getByRole('button', { name: 'Apply reviewed run' }).click();
  await expect(page.getByText(/^Applied: \d+ packs? moved from /)).toBeVisible();
  // Recomputed after applying: Van 1 is at target for the new product, so it leaves the plan.
  await expect(page.getByLabel(`Packs of ${name} for Van 1`)).toHaveCount(0);

  const engineerContext = await browser.newContext({
    viewport: { width: 360, height: 740 },
    hasTouch: true,
    isMobile: true,
    locale: 'en-GB',
    timezoneId: 'Europe/London',
  });
  const phone = await engineerContext.newPage();
  await signIn(phone, engineer.email, engineer.password);
  await mainNav(phone).getByRole('link', { name: 'My van' }).click();
  const onBoard = phone.getByRole('list', { name: 'Stock on my van' });
  const row = onBoard.getByRole('listitem').filter({ hasText: name });
  await expect(row).toContainText('4 packs of 1 L');
  await expect(row).toContainText('Stocked');
  await expect(row).toContainText(`lot ${lot}`);
  await phone.screenshot({ path: testInfo.outputPath('my-van-stock-360.png'), fullPage: true });
  await expectNoOverflow(phone, 'My van');
  await engineerContext.close();
});
