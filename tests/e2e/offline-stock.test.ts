import type { Page } from '@playwright/test';
import type { Movement, Product } from '@heatfleet/domain';
import { callApi, type ApiSession } from './support/api-session';
import { firmWithCrew, type Crew } from './support/crew-fixtures';
import { runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import {
  expectSaved,
  joinSecondFirm,
  phone,
  statusLine,
  storedKeys,
  waitForServiceWorker,
} from './support/offline-helpers';
import { createProduct, isoDaysFromNow, receiveStock, transferStock } from './support/stock-fixtures';

/** A fresh firm whose engineer has `packs` packs of a cleaner of its own on Van 1. */
async function prepareStock(baseURL: string, packs: number) {
  const crew = await firmWithCrew(baseURL);
  const session = crew.owner.session;
  const product = await createProduct(session, {
    name: `Offline cleaner ${runId().toUpperCase()}`,
    kind: 'cleaner',
    packSize: 1,
    packUnit: 'l',
    shelfLifeMonths: 24,
  });
  await receiveStock(session, {
    locationId: crew.depot.id,
    reference: `DN-${runId()}`,
    lines: [
      {
        productId: product.id,
        lotNumber: `L${runId().slice(-6).toUpperCase()}`,
        expiresOn: isoDaysFromNow(400),
        quantity: 10,
      },
    ],
  });
  await transferStock(session, {
    fromLocationId: crew.depot.id,
    toLocationId: crew.van.id,
    lines: [{ productId: product.id, quantity: packs }],
    note: 'Loaded for the week',
  });
  return { crew, product };
}

/** Packs of the product used by hand, as the firm's ledger has them. */
async function usedRows(session: ApiSession, product: Product): Promise<Movement[]> {
  const { movements } = await callApi<{ movements: Movement[] }>(
    session,
    'get',
    `/api/stock/movements?productId=${product.id}&kind=used`,
  );
  return movements;
}

/** The engineer opens "Record stock used" and waits until the page is kept on the phone. */
async function openUseForm(page: Page, crew: Crew) {
  await signIn(page, crew.engineer.email, crew.engineer.password);
  await page.goto('/stock/use');
  await expect(page.getByRole('form', { name: 'Record stock used' })).toBeVisible();
  await waitForServiceWorker(page);
  await expectSaved(page, ['stock', 'grid'], ['products', 'list'], ['stock', 'mine']);
}

async function recordUse(page: Page, product: Product, quantity: number, reason: string) {
  const form = page.getByRole('form', { name: 'Record stock used' });
  await form.getByLabel('Product').selectOption({ label: product.name });
  await form.getByLabel('Quantity (packs)').fill(String(quantity));
  await form.getByLabel('What it was used for').fill(reason);
  await form.getByRole('button', { name: 'Record use' }).click();
}

test.use(phone);

test('a sign-out mid-queue sends what waits first and loses nothing; afterwards nothing of the engineer is left on the phone', async ({
  page,
  context,
  baseURL,
}) => {
  const { crew, product } = await prepareStock(baseURL!, 5);
  await openUseForm(page, crew);

  await context.setOffline(true);
  await recordUse(page, product, 1, 'Top-up at 4 Quarry Lane');
  await expect(page.getByText('No signal: the stock use is saved on this phone')).toBeVisible();
  await recordUse(page, product, 2, 'Workshop test');
  await expect(statusLine(page)).toHaveText(/^Offline · 2 changes waiting to send/);

  await test.step('signing out with no signal names what would be lost, and staying keeps it', async () => {
    await page.getByRole('button', { name: 'Sign out' }).click();
    const warning = page.getByRole('alertdialog');
    await expect(warning).toContainText(
      '2 changes have not reached the server. Signing out deletes them from this phone.',
    );
    await warning.getByRole('button', { name: 'Stay signed in' }).click();
    await expect(warning).toBeHidden();
    expect(await storedKeys(page, 'outbox')).toHaveLength(2);
  });

  // The signal returns and the engineer signs out at once: the queue goes first, then the session.
  await context.setOffline(false);
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/sign-in$/);
  const used = await usedRows(crew.owner.session, product);
  expect(used.map((m) => [m.quantityDelta, m.reason])).toEqual([
    [-2, 'Workshop test'],
    [-1, 'Top-up at 4 Quarry Lane'],
  ]);
  for (const movement of used) {
    expect(movement.tappedAt).not.toBeNull();
    expect(Date.parse(movement.tappedAt!)).toBeLessThan(Date.parse(movement.createdAt));
  }
  // Wiped at sign-out: the queue, the drafts and the saved query cache of this person.
  await expect.poll(() => storedKeys(page, 'outbox')).toEqual([]);
  await expect.poll(() => storedKeys(page, 'drafts')).toEqual([]);
  await expect.poll(() => storedKeys(page, 'query-cache')).toEqual([]);
  expect(await page.evaluate(() => caches.has('heatfleet-api'))).toBe(false);
});

test('a firm switch mid-queue sends nothing into the other firm: the write waits for its own', async ({
  page,
  context,
  baseURL,
}) => {
  const { crew, product } = await prepareStock(baseURL!, 5);
  const other = await joinSecondFirm(baseURL!, crew.engineer);
  await openUseForm(page, crew);

  await context.setOffline(true);
  await recordUse(page, product, 1, 'Used before the switch');
  await expect(statusLine(page)).toHaveText(/^Offline · 1 change waiting to send/);

  // Signal, but too weak to get the write through: it stays queued while the engineer switches firm.
  await page.route('**/api/stock/usages', (route) => route.abort('connectionreset'));
  await context.setOffline(false);
  await expect(statusLine(page)).toHaveText(/^1 change waiting to send/);
  await page.getByLabel('Firm', { exact: true }).selectOption({ label: other.name });
  await expect(page.getByLabel('Firm', { exact: true })).toHaveValue(String(other.id));
  await page.unroute('**/api/stock/usages');

  await expect(statusLine(page)).toContainText(
    `1 change for ${crew.firm.name} waits until you switch to ${crew.firm.name}`,
  );
  await page.waitForTimeout(4_000);
  expect(await usedRows(crew.owner.session, product)).toHaveLength(0);
  const otherLedger = await callApi<{ movements: Movement[] }>(
    other.owner.session,
    'get',
    '/api/stock/movements?kind=used',
  );
  expect(otherLedger.movements).toHaveLength(0);
  await expect(page.getByRole('button', { name: /need.* your attention/ })).toHaveCount(0);

  // Back in its own firm, it goes, once.
  await page.getByLabel('Firm', { exact: true }).selectOption({ label: crew.firm.name });
  await expect(statusLine(page)).toHaveText('All saved', { timeout: 20_000 });
  const used = await usedRows(crew.owner.session, product);
  expect(used.map((m) => [m.quantityDelta, m.reason])).toEqual([[-1, 'Used before the switch']]);
  expect(used[0]!.tappedAt).not.toBeNull();
});

test('a write the server refuses after the signal returns waits in "needs your attention" with its message and the form keeps what was typed', async ({
  page,
  context,
  baseURL,
}) => {
  const { crew, product } = await prepareStock(baseURL!, 2);
  await openUseForm(page, crew);

  await context.setOffline(true);
  await recordUse(page, product, 5, 'Power flush, two systems');
  await expect(statusLine(page)).toHaveText(/^Offline · 1 change waiting to send/);
  await context.setOffline(false);

  const attention = page.getByRole('button', { name: '1 change needs your attention' });
  await expect(attention).toBeVisible({ timeout: 20_000 });
  await expect(statusLine(page)).toHaveText('All saved');
  await attention.click();
  const list = page.getByRole('list', { name: 'Needs your attention' }).getByRole('listitem');
  await expect(list).toHaveCount(1);
  await expect(list.first()).toContainText(`Use 5 packs of ${product.name} from Van 1`);
  await expect(list.first()).toContainText(
    `Only 2 usable packs of ${product.name} at Van 1; 5 asked for. Nothing was used.`,
  );
  expect(await usedRows(crew.owner.session, product)).toHaveLength(0);

  // What was typed is back in the form, to put right and send again.
  await page.reload();
  const form = page.getByRole('form', { name: 'Record stock used' });
  await expect(form.getByLabel('Quantity (packs)')).toHaveValue('5');
  await expect(form.getByLabel('What it was used for')).toHaveValue('Power flush, two systems');
  await form.getByLabel('Quantity (packs)').fill('2');
  await form.getByRole('button', { name: 'Record use' }).click();
  await expect(form.getByText(`Recorded 2 packs of ${product.name} used.`)).toBeVisible();
  await page.getByRole('button', { name: '1 change needs your attention' }).click();
  await page.getByRole('list', { name: 'Needs your attention' }).getByRole('button', { name: 'Discard' }).click();
  await expect(page.getByRole('button', { name: /needs your attention/ })).toHaveCount(0);
  expect((await usedRows(crew.owner.session, product)).map((m) => m.quantityDelta)).toEqual([-2]);
});

test('when the session has ended the queue keeps its write, the app asks to sign in again, and the same engineer signing in sends it once', async ({
  page,
  context,
  baseURL,
}) => {
  const { crew, product } = await prepareStock(baseURL!, 5);
  await openUseForm(page, crew);
  await context.setOffline(true);
  await recordUse(page, product, 1, 'Before the session ran out');
  await expect(statusLine(page)).toHaveText(/^Offline · 1 change waiting to send/);

  // Meanwhile the session ends on the server (as after its idle timeout): page.request shares the browser's cookie.
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  expect((await page.request.post('/api/auth/sign-out', { headers: { 'X-CSRF-Token': csrfToken } })).status()).toBe(
    204,
  );

  await context.setOffline(false);
  await expect(page).toHaveURL(/\/sign-in\?next=/);
  expect(await storedKeys(page, 'outbox')).toHaveLength(1);
  expect(await usedRows(crew.owner.session, product)).toHaveLength(0);

  await page.getByLabel('E-mail', { exact: true }).fill(crew.engineer.email);
  await page.getByLabel('Password', { exact: true }).fill(crew.engineer.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(statusLine(page)).toHaveText('All saved', { timeout: 20_000 });
  const used = await usedRows(crew.owner.session, product);
  expect(used.map((m) => [m.quantityDelta, m.reason])).toEqual([[-1, 'Before the session ran out']]);
  expect(used[0]!.tappedAt).not.toBeNull();
});
