import { firmWithCrew } from './support/crew-fixtures';
import { horizontalOverflow, mainNav, runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { addKitItem, createKit, itemKinds, kitLabels } from './support/fleet-fixtures';

// A tiny PNG made here rather than kept as a file: a phone photo stands in for the real thing.
const photoPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAgAAAAICAIAAABLbSncAAAAEklEQVR4nGNgYGD4z0AswK4SAFXuAf8EPy+xAAAAAElFTkSuQmCC',
  'base64',
);

/** A fresh firm whose engineer drives "Van 1"; its stores person makes a kit with two items at the depot. */
async function prepareKit(baseURL: string) {
  const { engineer, stores } = await firmWithCrew(baseURL, { stores: true });
  const session = stores!.session;
  const kinds = await itemKinds(session);
  expect(kinds.length).toBeGreaterThan(0);
  const run = runId().toUpperCase();
  const kit = await createKit(session, `Test rig ${run}`);
  for (const [n, kind] of kinds.slice(0, 2).entries()) {
    await addKitItem(session, {
      assetTag: `T${run}-${n + 1}`.slice(0, 32),
      kindId: kind.id,
      kitId: kit.id,
      serialNumber: `SN-${run}-${n + 1}`,
    });
  }

  // The URL printed in the QR code, exactly as the label sheet gets it.
  const labels = await kitLabels(session, kit.id);
  expect(labels).toHaveLength(Math.min(2, kinds.length));
  expect(labels[0]!.qrSvgDataUrl).toMatch(/^data:image\/svg\+xml/);
  return { kit, label: labels[0]!, stores: stores!, engineer };
}

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true, isMobile: true });

test('an engineer on a phone checks a kit out from its label and back in with a photo', async ({
  page,
  browser,
  baseURL,
}, testInfo) => {
  const { kit, label, stores, engineer } = await prepareKit(baseURL!);
  const labelPath = new URL(label.url).pathname;
  expect(labelPath).toMatch(/^\/kit-items\/\d+$/);

  await test.step('stores sees the kit on the label sheet, ready to print', async () => {
    const desk = await browser.newContext({ viewport: { width: 1024, height: 900 }, locale: 'en-GB' });
    const sheet = await desk.newPage();
    await signIn(sheet, stores.email, stores.password);
    await sheet.goto(`/labels?kitId=${kit.id}`);
    const labels = sheet.getByRole('list', { name: 'Labels' }).getByRole('listitem');
    await expect(labels.first()).toContainText(label.assetTag);
    await expect(labels.first().getByRole('img', { name: `QR code for ${label.assetTag}` })).toBeVisible();
    await expect(sheet.getByRole('button', { name: 'Print' })).toBeVisible();
    await sheet.emulateMedia({ media: 'print' });
    await expect(mainNav(sheet)).toBeHidden();
    await sheet.screenshot({ path: testInfo.outputPath('label-sheet-print.png'), fullPage: true });
    await desk.close();
  });

  // Scanning the label while signed out leads through sign-in and back to the item.
  await page.goto(labelPath);
  await expect(page).toHaveURL(/\/sign-in\?next=/);
  await page.getByLabel('E-mail', { exact: true }).fill(engineer.email);
  await page.getByLabel('Password', { exact: true }).fill(engineer.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(new RegExp(`${labelPath}$`));
  await expect(page.getByRole('heading', { level: 1, name: label.assetTag })).toBeVisible();

  const custody = page.getByRole('region', { name: 'Custody' });
  await custody.getByRole('button', { name: 'Check out' }).click();
  const checkOut = page.getByRole('form', { name: 'Check out' });
  // An engineer has exactly one van to check out to: theirs, with nothing to choose.
  await expect(checkOut.getByText('To your van')).toBeVisible();
  await expect(checkOut.getByRole('radio', { name: new RegExp(`The whole kit, ${kit.name}`) })).toBeChecked();
  await page.screenshot({ path: testInfo.outputPath('check-out-360.png'), fullPage: true });

  // One bar of signal: the server acts on the first tap but its answer never arrives. The phone keeps the
  // write and its queue sends it again by itself with the same Idempotency-Key (README, Working offline),
  // so the server replays its answer instead of acting twice.
  const keys: string[] = [];
  await page.route('**/api/kits/*/check-out', async (route) => {
    keys.push(route.request().headers()['idempotency-key'] ?? '');
    if (keys.length > 1) return route.continue();
    await route.fetch();
    await route.abort('connectionreset');
  });
  await checkOut.getByRole('button', { name: /^Check out to / }).click();
  await expect(custody.getByText('could not reach its server')).toBeVisible();
  await expect(custody.getByText(/^Checked out to Van 1/)).toBeVisible();
  expect(keys).toHaveLength(2);
  expect(keys[0]).toMatch(/^[0-9a-f-]{36}$/);
  expect(keys[1]).toBe(keys[0]);
  await page.unroute('**/api/kits/*/check-out');
  await expect(custody.locator('p').filter({ hasText: /^Now:/ })).toContainText('Van 1');

  await custody.getByRole('button', { name: 'Check in' }).click();
  const checkIn = page.getByRole('form', { name: 'Check in' });
  // Each item has its own condition, in service unless changed (kit-check-in.test.ts changes them).
  await expect(checkIn.getByRole('combobox', { name: /^Condition of / }).first()).toHaveValue('in_service');
  await checkIn.getByLabel('Missing parts (if any)').fill('One hose clip');
  await checkIn
    .getByLabel('Photo (optional)')
    .setInputFiles({ name: 'after-the-job.png', mimeType: 'image/png', buffer: photoPng });
  await expect(checkIn.getByText('after-the-job.png will be sent with this.')).toBeVisible();
  await page.screenshot({ path: testInfo.outputPath('check-in-360.png'), fullPage: true });
  await checkIn.getByRole('button', { name: 'Check in' }).click();
  await expect(custody.getByText(/^Checked in/)).toBeVisible();

  // Both events, newest first, the check-in with its condition, missing part and photo.
  const timeline = page.getByRole('list', { name: 'Custody timeline' });
  await expect(timeline.getByRole('listitem')).toHaveCount(2);
  await expect(timeline.getByRole('listitem').nth(0)).toContainText('Checked in');
  await expect(timeline.getByRole('listitem').nth(0)).toContainText('Missing: One hose clip');
  await expect(timeline.getByRole('listitem').nth(0).getByRole('link', { name: 'Photo' })).toBeVisible();
  await expect(timeline.getByRole('listitem').nth(1)).toContainText('Checked out');
  await expect(timeline.getByRole('listitem').nth(1)).toContainText('Van 1');

  const photo = await page.request.get((await timeline.getByRole('link', { name: 'Photo' }).getAttribute('href'))!);
  expect(photo.status()).toBe(200);
  expect(photo.headers()['content-type']).toMatch(/^image\//);

  // The photo is the item's too, shown from the object store through the API.
  const shown = page.getByRole('list', { name: 'Photos' }).getByRole('img');
  await expect(shown).toHaveCount(1);
  await shown.scrollIntoViewIfNeeded();
  await expect
    .poll(() => shown.evaluate((img: HTMLImageElement) => (img.complete ? img.naturalWidth : 0)))
    .toBeGreaterThan(0);

  await page.screenshot({ path: testInfo.outputPath('item-after-360.png'), fullPage: true });
  const overflow = await horizontalOverflow(page);
  expect(overflow.scrollWidth, `the item page overflows: ${overflow.widest ?? ''}`).toBeLessThanOrEqual(360);
});
