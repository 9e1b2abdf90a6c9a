import type { Locator, Page } from '@playwright/test';
import type { JobDetail, ProductInput } from '@heatfleet/domain';
import { callApi, type ApiSession } from './support/api-session';
import { firmWithCrew } from './support/crew-fixtures';
import { runId } from './support/e2e-helpers';
import { expect as baseExpect, test } from './support/fixture-test';
import { addKitItem, checkOutKit, createKit, itemKindNamed, setVibration } from './support/fleet-fixtures';
import { addCustomer, addSite, bookJob } from './support/job-fixtures';
import {
  expectSaved,
  jpegSize,
  joinSecondFirm,
  phone,
  queuedWrites,
  photoPng,
  statusLine,
  storedKeys,
  waitForServiceWorker,
  watchWrites,
} from './support/offline-helpers';
import { createProduct, isoDaysFromNow, receiveStock, transferStock } from './support/stock-fixtures';

// Working offline on the job sheet (README, Working offline): every visit write goes through the phone's queue with
// its Idempotency-Key and tap time made at the tap; the sheet shows what waits; the server gets each once.

// Two cores shared by several test runs: the waits here are generous, never timed assertions.
const expect = baseExpect.configure({ timeout: 30_000 });

async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail', { exact: true }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeVisible();
}

// As a phone camera takes it: 4,000 x 3,000 px. The app sends it as a JPEG of 2,000 x 1,500.
const cameraPhoto = photoPng(4000, 3000);

/**
 * A fresh firm whose engineer drives "Van 1" with an agitator head of 10 m/s² on it, and a job booked for them
 * (two radiators, a cleaner and an inhibitor). `stocked`: the van holds the chemicals the job needs.
 */
async function prepareJob(baseURL: string, stocked = true) {
  const crew = await firmWithCrew(baseURL);
  const session = crew.owner.session;
  const id = runId().toUpperCase();
  const product = (data: Pick<ProductInput, 'name' | 'kind'> & Partial<ProductInput>) =>
    createProduct(session, {
      packSize: 1,
      packUnit: 'l',
      doseLitresPer100L: 1,
      radiatorsPerPack: 10,
      shelfLifeMonths: 24,
      ...data,
    });
  const cleaner = await product({ name: `Offline cleaner ${id}`, kind: 'cleaner', minCirculationMinutes: 60 });
  const inhibitor = await product({
    name: `Offline inhibitor ${id}`,
    kind: 'inhibitor',
    targetMin: 1,
    targetMax: 1.5,
    targetUnit: '% v/v',
  });
  if (stocked) {
    const lines = [cleaner, inhibitor].map((p) => ({ productId: p.id, quantity: 1 }));
    await receiveStock(session, {
      locationId: crew.depot.id,
      reference: `Offline sheet ${id}`,
      lines: lines.map((l) => ({ ...l, lotNumber: `O${id.slice(-6)}`, expiresOn: isoDaysFromNow(400) })),
    });
    await transferStock(session, { fromLocationId: crew.depot.id, toLocationId: crew.van.id, lines });
  }
  const rig = await createKit(session, 'Rig 1');
  const agitator = await addKitItem(session, {
    assetTag: `AGI-${id}`.slice(0, 32),
    kindId: (await itemKindNamed(session, 'Agitator head')).id,
    kitId: rig.id,
  });
  await setVibration(session, agitator.id, 10);
  await checkOutKit(session, rig.id, crew.van.id);
  const customer = await addCustomer(session, { name: `Loft household ${id}` });
  const site = await addSite(session, customer.id, { address: `9 Signal Lane, Brackenford BF2 ${id.slice(-3)}` });
  const job = await bookJob(session, {
    siteId: site.id,
    scheduledOn: isoDaysFromNow(0),
    engineerMemberId: crew.engineer.memberId,
    survey: {
      systemType: 'sealed',
      boilerKind: 'combi',
      fuel: 'gas',
      radiators: [
        { room: 'Lounge', panel: 'double', heightMm: 600, lengthMm: 1200 },
        { room: 'Hall', panel: 'single', heightMm: 600, lengthMm: 800 },
      ],
      pipeRuns: [],
    },
    productIds: [cleaner.id, inhibitor.id],
  });
  return { crew, job: job.job, agitatorTag: agitator.assetTag };
}

async function jobOnServer(session: ApiSession, jobId: number): Promise<JobDetail> {
  return callApi<JobDetail>(session, 'get', `/api/jobs/${jobId}`);
}

/** Signs in, opens the job, and waits until the page and its data are kept on the phone. */
async function openJob(page: Page, email: string, password: string, jobId: number) {
  await signIn(page, email, password);
  await page.goto(`/jobs/${jobId}`);
  await expect(page.getByRole('heading', { level: 1, name: /^Job at / })).toBeVisible();
  await waitForServiceWorker(page);
  // From now on the service worker sees the page's reads and keeps a copy of each: load the page once more.
  await page.reload();
  await expect(page.getByRole('heading', { level: 1, name: /^Job at / })).toBeVisible();
  await expect(statusLine(page)).toHaveText('All saved');
  await expectSaved(page, ['jobs', 'detail', jobId]);
}

/** Opens a radiator's card from the list (or from the card showing, through "All radiators"). */
async function openRadiator(page: Page, name: string): Promise<Locator> {
  const radiators = page.getByRole('region', { name: 'Radiators', exact: true });
  const back = radiators.getByRole('button', { name: 'All radiators' });
  if (await back.isVisible()) await back.click();
  await radiators
    .getByRole('list', { name: 'Radiators in the flush order' })
    .getByRole('button', { name: new RegExp(name) })
    .click();
  const card = radiators.getByRole('group', { name: new RegExp(`^Radiator \\d+: ${name}$`) });
  await expect(card).toBeVisible();
  return card;
}

/** A card's part (before, agitate and flush, after), opened if folded. */
async function part(card: Locator, title: 'Before the clean' | 'Agitate and flush' | 'After the clean') {
  const details = card
    .locator('details[data-part]')
    .filter({ has: card.page().locator(`summary:has-text("${title}")`) });
  if (!(await details.evaluate((d: HTMLDetailsElement) => d.open))) await details.locator('summary').first().click();
  return details;
}

/** A folded section of the sheet (Photos, Notes), opened. */
async function section(page: Page, title: string): Promise<Locator> {
  const region = page.getByRole('region', { name: title, exact: true });
  const details = region.locator('details').first();
  if (!(await details.evaluate((d: HTMLDetailsElement) => d.open))) await details.locator('summary').first().click();
  return region;
}

async function readBefore(page: Page, name: string, top: string, bottom: string) {
  const card = await openRadiator(page, name);
  const before = (await part(card, 'Before the clean')).getByRole('group', { name: 'Readings before' });
  await before.getByLabel('Top (°C)', { exact: true }).fill(top);
  await before.getByLabel('Bottom (°C)', { exact: true }).fill(bottom);
  await before.getByLabel('Bottom (°C)', { exact: true }).blur();
  return before;
}

test.use(phone);

test('with no signal an engineer records readings, agitation, a flush tick, water tests, a photo and notes; after a reload and a new page, each reaches the server once with its tap time', async ({
  page,
  context,
  baseURL,
}) => {
  test.setTimeout(420_000);
  const { crew, job, agitatorTag } = await prepareJob(baseURL!);
  const writes = watchWrites(context, /^\/api\/jobs\/\d+\//);
  await openJob(page, crew.engineer.email, crew.engineer.password, job.id);

  await context.setOffline(true);
  const tappedFrom = Date.now();
  await expect(statusLine(page)).toContainText('Offline');

  const before = await readBefore(page, 'Lounge', '68', '48');
  await expect(before.getByRole('status')).toHaveText('✓ Saved on this phone');
  await expect(before.getByText('Cold bottom', { exact: true })).toBeVisible();

  const lounge = page.getByRole('group', { name: /^Radiator \d+: Lounge$/ });
  const agitation = (await part(lounge, 'Agitate and flush')).getByRole('group', { name: 'Agitation' });
  const tool = agitation.getByLabel('Vibrating tool');
  await tool.selectOption((await tool.locator('option', { hasText: agitatorTag }).getAttribute('value'))!);
  await agitation.getByLabel('Agitation (minutes)').fill('3');
  await agitation.getByLabel('Agitation (minutes)').blur();
  await expect(agitation.getByRole('status')).toHaveText('✓ Saved on this phone');
  await lounge.getByRole('button', { name: 'Flushed until clear' }).click();
  await expect(lounge.getByText(/Flushed until clear at \d\d:\d\d/)).toBeVisible();

  const water = page.getByRole('group', { name: 'Water tests' });
  await water.getByLabel('Mains TDS (ppm)').fill('180');
  await water.getByLabel('System TDS (ppm)').fill('190');
  await water.getByLabel('System TDS (ppm)').blur();
  await expect(water.getByRole('status').filter({ hasText: 'Saved' })).toHaveText('✓ Saved on this phone');

  const photos = await section(page, 'Photos');
  await photos
    .getByLabel('Photo', { exact: true })
    .setInputFiles({ name: 'magnet.png', mimeType: 'image/png', buffer: cameraPhoto });
  await photos.getByRole('button', { name: 'Add the photo' }).click();
  // Shrinking a 12-megapixel photo takes a while on a slow phone (or a busy test machine).
  await expect(photos.getByText('Saved on this phone; goes when there is signal')).toBeVisible({ timeout: 60_000 });

  const notes = await section(page, 'Notes');
  await notes.getByLabel('Notes for the record').fill('Valve in the airing cupboard is stiff.');
  await notes.getByLabel('Notes for the record').blur();
  await expect(notes.getByRole('status')).toHaveText('✓ Saved on this phone');
  // Readings, agitation, flush tick, water tests (a save per valid figure), photo, notes: each one write.
  const queued = await queuedWrites(page);
  const paths = queued.map((w) => w.path.replace(`/api/jobs/${job.id}`, ''));
  expect(new Set(paths)).toEqual(
    new Set([
      '/radiators/0/readings/before',
      '/radiators/0/agitation',
      '/radiators/0/flushed',
      '/water-tests',
      '/photos',
      '/notes',
    ]),
  );
  const waiting = `Offline · ${queued.length} changes waiting to send`;
  await expect(statusLine(page)).toContainText(waiting);

  // Half-typed and never valid: only the top of the hall's reading. Kept on the phone as a draft.
  const hall = await openRadiator(page, 'Hall');
  const hallBefore = (await part(hall, 'Before the clean')).getByRole('group', { name: 'Readings before' });
  await hallBefore.getByLabel('Top (°C)', { exact: true }).fill('61');
  await expect.poll(() => storedKeys(page, 'drafts')).toContainEqual(expect.stringMatching(/sheet-fields$/));

  await test.step('a reload with no signal shows every value from the queue and the half-typed one', async () => {
    await page.reload();
    await expect(page.getByRole('heading', { level: 1, name: /^Job at / })).toBeVisible();
    await expect(statusLine(page)).toContainText(waiting);
    const card = await openRadiator(page, 'Lounge');
    const again = (await part(card, 'Before the clean')).getByRole('group', { name: 'Readings before' });
    await expect(again.getByLabel('Top (°C)', { exact: true })).toHaveValue('68');
    await expect((await part(card, 'Agitate and flush')).getByText(/Flushed until clear at \d\d:\d\d/)).toBeVisible();
    const hallCard = await openRadiator(page, 'Hall');
    const hallAgain = (await part(hallCard, 'Before the clean')).getByRole('group', { name: 'Readings before' });
    await expect(hallAgain.getByLabel('Top (°C)', { exact: true })).toHaveValue('61');
    await expect(page.getByRole('group', { name: 'Water tests' }).getByLabel('System TDS (ppm)')).toHaveValue('190');
    await expect((await section(page, 'Notes')).getByLabel('Notes for the record')).toHaveValue(
      'Valve in the airing cupboard is stiff.',
    );
  });

  await test.step('a new page, still with no signal, shows the same; the server has nothing yet', async () => {
    await page.close();
    const next = await context.newPage();
    await next.goto(`/jobs/${job.id}`);
    await expect(statusLine(next)).toContainText(waiting);
    const server = await jobOnServer(crew.owner.session, job.id);
    expect(server.sheet.radiators[0]!.before).toBeNull();
    expect(server.sheet.photos).toHaveLength(0);

    await context.setOffline(false);
    await expect(statusLine(next)).toHaveText('All saved', { timeout: 30_000 });
  });

  // On the server, once each, with the engineer's tap times.
  const { sheet } = await jobOnServer(crew.owner.session, job.id);
  const [loungeRow, hallRow] = sheet.radiators;
  expect(loungeRow!.before).toMatchObject({ topC: 68, bottomC: 48 });
  expect(loungeRow!.agitation).toMatchObject({ minutes: 3, kitItemTag: agitatorTag, magnitudeMs2: 10 });
  expect(Date.parse(loungeRow!.flushedAt!)).toBeGreaterThanOrEqual(tappedFrom - 2_000);
  // The half-typed hall reading was never sent.
  expect(hallRow!.before).toBeNull();
  expect(sheet.water).toMatchObject({ mainsTdsPpm: 180, systemTdsPpm: 190 });
  expect(sheet.notes).toBe('Valve in the airing cupboard is stiff.');
  expect(sheet.notesVersion).toBe(1);
  expect(sheet.photos).toHaveLength(1);
  expect(Date.parse(sheet.photos[0]!.createdAt)).toBeGreaterThanOrEqual(tappedFrom - 2_000);
  const photo = await crew.owner.session.api.get(sheet.photos[0]!.url);
  expect(photo.headers()['content-type']).toBe('image/jpeg');
  expect(jpegSize(await photo.body())).toEqual({ width: 2000, height: 1500 });

  // Each write carried its Idempotency-Key and tap time, the same on every attempt: one key per queued write.
  const sent = writes.filter((w) => w.method !== 'GET');
  for (const write of sent) {
    expect(write.key, write.path).toMatch(/^[0-9a-f-]{36}(:photo)?$/);
    expect(Date.parse(write.tappedAt!)).toBeGreaterThanOrEqual(tappedFrom - 2_000);
  }
  expect(new Set(sent.map((w) => w.key)).size).toBe(queued.length);
});

test('a sign-out mid-queue sends the visit first and loses nothing; a firm switch mid-queue sends nothing into the other firm', async ({
  page,
  context,
  baseURL,
}) => {
  test.setTimeout(420_000);
  const { crew, job } = await prepareJob(baseURL!);
  const other = await joinSecondFirm(baseURL!, crew.engineer);
  await openJob(page, crew.engineer.email, crew.engineer.password, job.id);

  await context.setOffline(true);
  await readBefore(page, 'Lounge', '70', '50');
  await expect(statusLine(page)).toHaveText(/^Offline · 1 change waiting to send/);

  await test.step('a firm switch with a weak signal: the reading waits for its own firm', async () => {
    await page.route('**/api/jobs/*/radiators/**', (route) => route.abort('connectionreset'));
    await context.setOffline(false);
    await expect(statusLine(page)).toHaveText(/^1 change waiting to send/);
    await page.getByLabel('Firm', { exact: true }).selectOption({ label: other.name });
    await expect(page.getByLabel('Firm', { exact: true })).toHaveValue(String(other.id));
    await page.unroute('**/api/jobs/*/radiators/**');
    await expect(statusLine(page)).toContainText(
      `1 change for ${crew.firm.name} waits until you switch to ${crew.firm.name}`,
    );
    // Sent into the other firm it would be refused (not its job); it is not sent at all.
    expect((await jobOnServer(crew.owner.session, job.id)).sheet.radiators[0]!.before).toBeNull();
    await expect(page.getByRole('button', { name: /needs? your attention/ })).toHaveCount(0);
    await page.getByLabel('Firm', { exact: true }).selectOption({ label: crew.firm.name });
    await expect(statusLine(page)).toHaveText('All saved', { timeout: 30_000 });
    expect((await jobOnServer(crew.owner.session, job.id)).sheet.radiators[0]!.before).toMatchObject({
      topC: 70,
      bottomC: 50,
    });
  });

  await test.step('a sign-out with writes waiting sends them first, then wipes the phone', async () => {
    await page.goto(`/jobs/${job.id}`);
    await expect(statusLine(page)).toHaveText('All saved');
    await context.setOffline(true);
    const notes = await section(page, 'Notes');
    await notes.getByLabel('Notes for the record').fill('Written in the loft.');
    await notes.getByLabel('Notes for the record').blur();
    await expect(statusLine(page)).toHaveText(/^Offline · 1 change waiting to send/);
    await context.setOffline(false);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await expect(page).toHaveURL(/\/sign-in$/);
    expect((await jobOnServer(crew.owner.session, job.id)).sheet.notes).toBe('Written in the loft.');
    await expect.poll(() => storedKeys(page, 'outbox')).toEqual([]);
    await expect.poll(() => storedKeys(page, 'drafts')).toEqual([]);
  });
});

test('a completion kept offline that the server refuses when it is sent (the van is short) waits in "needs your attention" with the server\u2019s message', async ({
  page,
  context,
  baseURL,
}) => {
  test.setTimeout(300_000);
  const { crew, job } = await prepareJob(baseURL!, false);
  await openJob(page, crew.engineer.email, crew.engineer.password, job.id);

  await context.setOffline(true);
  await page.getByRole('button', { name: 'Complete the job' }).click();
  const summary = page.getByRole('group', { name: 'Completion summary' });
  for (const reason of await summary.getByRole('textbox').all()) {
    if ((await reason.getAttribute('name'))?.startsWith('reason.')) await reason.fill('Not done in this test');
  }
  await summary.getByRole('button', { name: 'Yes, complete it' }).click();
  await expect(summary.getByText('No signal: the completion is saved on this phone')).toBeVisible();
  // Completing first sends whatever the page holds (here the water tests' chosen inhibitor), then the completion.
  const queued = (await queuedWrites(page)).map((w) => w.path);
  expect(queued.at(-1)).toBe(`/api/jobs/${job.id}/complete`);
  await expect(statusLine(page)).toContainText(`Offline · ${queued.length} change`);

  await context.setOffline(false);
  const attention = page.getByRole('button', { name: '1 change needs your attention' });
  await expect(attention).toBeVisible({ timeout: 30_000 });
  await attention.click();
  const item = page.getByRole('list', { name: 'Needs your attention' }).getByRole('listitem');
  await expect(item).toHaveCount(1);
  await expect(item.first()).toContainText('Completion (job at 9 Signal Lane');
  await expect(item.first()).toContainText(/The van is short of/);
  expect((await jobOnServer(crew.owner.session, job.id)).job.status).toBe('planned');
});
