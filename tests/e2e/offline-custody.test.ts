import { chromium } from '@playwright/test';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { ItemCustodyResponse } from '@heatfleet/domain';
import { callApi } from './support/api-session';
import { firmWithCrew } from './support/crew-fixtures';
import { horizontalOverflow, runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { addKitItem, createKit, itemKinds, kitLabels } from './support/fleet-fixtures';
import {
  expectSaved,
  jpegSize,
  phone,
  photoPng,
  statusLine,
  waitForServiceWorker,
  watchWrites,
} from './support/offline-helpers';

// As a phone camera takes it: 4,000 x 3,000 px. The app sends it as a JPEG of 2,000 x 1,500.
const cameraPhoto = photoPng(4000, 3000);

/** A fresh firm whose engineer drives "Van 1"; its stores person makes a kit of two items at the depot. */
async function prepareKit(baseURL: string) {
  const { engineer, stores, owner } = await firmWithCrew(baseURL, { stores: true });
  const session = stores!.session;
  const kinds = await itemKinds(session);
  const run = runId().toUpperCase();
  const kit = await createKit(session, `Offline rig ${run}`);
  for (const [n, kind] of kinds.slice(0, 2).entries()) {
    await addKitItem(session, { assetTag: `F${run}-${n + 1}`.slice(0, 32), kindId: kind.id, kitId: kit.id });
  }
  const label = (await kitLabels(session, kit.id))[0]!;
  return { kit, label, engineer, owner };
}

test.use(phone);

test('with no signal an engineer checks a kit out from its label and back in with a photo; after a reload and a new page, each reaches the server once with its tap time', async ({
  page,
  context,
  baseURL,
}, testInfo) => {
  const { kit, label, engineer, owner } = await prepareKit(baseURL!);
  const labelPath = new URL(label.url).pathname;
  const itemId = Number(labelPath.split('/').pop());
  const writes = watchWrites(context, /^\/api\/(kits|kit-items)\/\d+\/check-(out|in)$/);

  await signIn(page, engineer.email, engineer.password);
  await page.goto(labelPath);
  await expect(page.getByRole('heading', { level: 1, name: label.assetTag })).toBeVisible();
  await waitForServiceWorker(page);
  // From now on the service worker sees the page's reads and keeps a copy of each: load the page once more.
  await page.reload();
  await expect(page.getByRole('heading', { level: 1, name: label.assetTag })).toBeVisible();
  await expect(statusLine(page)).toHaveText('All saved');
  // What the label's page needs offline is kept on the phone: the item, the vans and depots.
  await expectSaved(page, ['kit-items', 'detail', itemId], ['vans', 'list'], ['depots', 'list']);

  await context.setOffline(true);
  const tappedFrom = Date.now();
  await expect(statusLine(page)).toContainText('Offline');
  const custody = page.getByRole('region', { name: 'Custody' });
  await custody.getByRole('button', { name: 'Check out' }).click();
  await page
    .getByRole('form', { name: 'Check out' })
    .getByRole('button', { name: /^Check out to / })
    .click();
  await expect(custody.getByText('No signal: the check-out is saved on this phone')).toBeVisible();
  await expect(statusLine(page)).toHaveText(/^Offline · 1 change waiting to send/);
  // The next action starts from where the kit will be: on the engineer's van.
  await expect(custody.locator('p').filter({ hasText: /^Now:/ })).toContainText('Van 1');
  await expect(custody.locator('p').filter({ hasText: /^Now:/ })).toContainText('waiting to send');

  await custody.getByRole('button', { name: 'Check in' }).click();
  const checkIn = page.getByRole('form', { name: 'Check in' });
  // A condition per item, "In service" unless changed (issue 14).
  const conditions = checkIn.getByRole('combobox', { name: /^Condition of / });
  await expect(conditions).not.toHaveCount(0);
  for (const condition of await conditions.all()) await condition.selectOption('Needs attention');
  await checkIn.getByLabel('Missing parts (if any)').fill('One hose clip');
  await checkIn
    .getByLabel('Photo (optional)')
    .setInputFiles({ name: 'after-the-job.png', mimeType: 'image/png', buffer: cameraPhoto });
  await checkIn.getByRole('button', { name: 'Check in' }).click();
  await expect(custody.getByText('No signal: the check-in is saved on this phone')).toBeVisible();
  await expect(statusLine(page)).toHaveText(/^Offline · 2 changes waiting to send/);
  await page.screenshot({ path: testInfo.outputPath('offline-custody-390.png'), fullPage: true });
  const overflow = await horizontalOverflow(page);
  expect(overflow.scrollWidth, `the item page overflows: ${overflow.widest ?? ''}`).toBeLessThanOrEqual(390);

  // Half-typed and never sent: a note on a new check-out survives the reload below.
  await custody.getByRole('button', { name: 'Check out' }).click();
  await page
    .getByRole('form', { name: 'Check out' })
    .getByLabel('Note (optional)')
    .fill('For the loft job, half typed');
  await page.waitForTimeout(600);

  await test.step('a reload with no signal keeps both writes and the draft', async () => {
    await page.reload();
    await expect(page.getByRole('heading', { level: 1, name: label.assetTag })).toBeVisible();
    await expect(statusLine(page)).toHaveText(
      /^Offline · 2 changes waiting to send · showing what was saved as of \d\d:\d\d/,
    );
    // The service worker answers API reads from its copy, marked so (the app says "as of" from its Date).
    const fromCache = await page.evaluate(async (path) => {
      const scope = JSON.parse(localStorage.getItem('heatfleet.offline-scope')!) as { userId: number; firmId: number };
      const answer = await fetch(path, { headers: { 'X-Heatfleet-Scope': `u${scope.userId}-f${scope.firmId}` } });
      return { status: answer.status, marked: answer.headers.get('X-Heatfleet-From-Cache') };
    }, `/api/kit-items/${itemId}`);
    expect(fromCache).toEqual({ status: 200, marked: '1' });
    const waiting = page.getByRole('list', { name: 'Custody waiting to send' }).getByRole('listitem');
    await expect(waiting).toHaveCount(2);
    await expect(waiting.nth(0)).toContainText(`Check out ${kit.name} to Van 1`);
    await expect(waiting.nth(1)).toContainText(`Check in ${kit.name} to Main depot with a photo`);
    await page.getByRole('region', { name: 'Custody' }).getByRole('button', { name: 'Check out' }).click();
    await expect(page.getByRole('form', { name: 'Check out' }).getByLabel('Note (optional)')).toHaveValue(
      'For the loft job, half typed',
    );
  });

  await test.step('a new page, still with no signal, shows the same', async () => {
    await page.close();
    const again = await context.newPage();
    await again.goto(labelPath);
    await expect(statusLine(again)).toHaveText(/^Offline · 2 changes waiting to send/);
    // The server has heard nothing yet.
    const before = await callApi<ItemCustodyResponse>(owner.session, 'get', `/api/kit-items/${itemId}`);
    expect(before.events).toHaveLength(0);

    await context.setOffline(false);
    // The queue empty and no "showing what was saved as of ...": a read still on its way from the phone's copy when
    // the signal came back is fetched again (lib/offline/data-age.ts; it once stayed marked, seen in CI).
    await expect(statusLine(again)).toHaveText('All saved', { timeout: 20_000 });
    await expect(
      again.getByRole('region', { name: 'Custody' }).locator('p').filter({ hasText: /^Now:/ }),
    ).toContainText('Main depot');
    await expect(again.getByRole('list', { name: 'Custody timeline' }).getByRole('listitem')).toHaveCount(2);
  });

  // On the server exactly once each (a kit's check-out writes one event per item), with the engineer's tap times.
  const after = await callApi<{ events: ItemCustodyResponse['events'] }>(owner.session, 'get', `/api/kits/${kit.id}`);
  const out = after.events.filter((e) => e.action === 'check_out');
  const back = after.events.filter((e) => e.action === 'check_in');
  expect(out).toHaveLength(2);
  expect(back).toHaveLength(2);
  for (const event of after.events) {
    expect(event.tappedAt, `${event.action} ${event.item.assetTag}`).not.toBeNull();
    expect(Date.parse(event.tappedAt!)).toBeGreaterThanOrEqual(tappedFrom - 2_000);
    expect(Date.parse(event.tappedAt!)).toBeLessThan(Date.parse(event.createdAt));
  }
  expect(Date.parse(out[0]!.tappedAt!)).toBeLessThan(Date.parse(back[0]!.tappedAt!));
  expect(back.every((e) => e.condition === 'needs_attention' && e.missingParts === 'One hose clip')).toBe(true);

  // The photo went once, shrunk and re-encoded on the phone as a JPEG.
  const photoId = back[0]!.photoId!;
  expect(photoId).toBeGreaterThan(0);
  const item = await callApi<ItemCustodyResponse & { photos: { id: number }[] }>(
    owner.session,
    'get',
    `/api/kit-items/${itemId}`,
  );
  expect(item.photos.map((p) => p.id)).toEqual([photoId]);
  const photo = await owner.session.api.get(`/api/photos/${photoId}/content`);
  expect(photo.headers()['content-type']).toBe('image/jpeg');
  expect(jpegSize(await photo.body())).toEqual({ width: 2000, height: 1500 });

  // Each write carried its Idempotency-Key and tap time, the same on every attempt.
  const sent = writes.filter((w) => w.method === 'POST');
  expect(sent.length).toBeGreaterThanOrEqual(2);
  for (const write of sent) {
    expect(write.key).toMatch(/^[0-9a-f-]{36}$/);
    expect(write.tappedAt).toMatch(/^\d{4}-\d\d-\d\dT/);
  }
  expect(new Set(sent.map((w) => w.key)).size).toBe(2);
});

test('Chromium finds the app installable: manifest, icons and a service worker', async ({ baseURL }) => {
  // A persistent profile: Chromium never offers to install from an incognito one.
  const profile = mkdtempSync(join(tmpdir(), 'heatfleet-install-'));
  const browser = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu'],
    baseURL: baseURL!,
    ...phone,
  });
  try {
    const page = browser.pages()[0] ?? (await browser.newPage());
    await page.goto('/sign-in');
    await waitForServiceWorker(page);
    const manifest = await page.request.get('/manifest.webmanifest');
    expect(manifest.ok()).toBe(true);
    const body = (await manifest.json()) as {
      name: string;
      display: string;
      icons: { sizes: string; purpose: string }[];
    };
    expect(body.name).toBe('Heatfleet');
    expect(body.display).toBe('standalone');
    expect(body.icons).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ sizes: '192x192', purpose: 'any' }),
        expect.objectContaining({ sizes: '512x512', purpose: 'any' }),
        expect.objectContaining({ sizes: '512x512', purpose: 'maskable' }),
      ]),
    );
    const cdp = await page.context().newCDPSession(page);
    const { installabilityErrors } = (await cdp.send('Page.getInstallabilityErrors')) as {
      installabilityErrors: { errorId: string }[];
    };
    expect(installabilityErrors).toEqual([]);
  } finally {
    await browser.close();
    rmSync(profile, { recursive: true, force: true });
  }
});
