import type { Page } from '@playwright/test';
import type { CreateJobInput, ProductInput } from '@heatfleet/domain';
import { firmWithCrew } from './support/crew-fixtures';
import { mainNav, runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { addKitItem, checkOutKit, createKit, itemKindNamed, setVibration } from './support/fleet-fixtures';
import { addCustomer, addSite, bookJob } from './support/job-fixtures';
import { createProduct, isoDaysFromNow, receiveStock, transferStock } from './support/stock-fixtures';
import { TapCounter } from './support/tap-counter';
import { checkScreen } from './support/visit-checks';

// The tap budget (DEVELOPERS.md, Product rules: the visit on a phone): booking an existing customer's job in at
// most 40 taps, the sheet of an 18-radiator open-vented full clean in at most 160.
const BOOKING_TAPS = 40;
const SHEET_TAPS = 160;
const RADIATORS = 18;

/**
 * A fresh firm: an engineer driving "Van 1" with five packs each of a cleaner and an inhibitor on it
 * and an agitator head (2.5 m/s²) checked out to it, and an existing customer with one site.
 */
async function prepare(baseURL: string) {
  const { owner, engineer, van, depot } = await firmWithCrew(baseURL);
  const session = owner.session;
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
  const cleaner = await product({ name: `Visit cleaner ${id}`, kind: 'cleaner' });
  const inhibitor = await product({
    name: `Visit inhibitor ${id}`,
    kind: 'inhibitor',
    targetMin: 1,
    targetMax: 1.5,
    targetUnit: '% v/v',
    testMethod: 'Refractometer',
  });
  const lines = [cleaner, inhibitor].map((p) => ({ productId: p.id, quantity: 5 }));
  const lot = `V${id.slice(-6)}`;
  await receiveStock(session, {
    locationId: depot.id,
    reference: `Visit test ${lot}`,
    lines: lines.map((l) => ({ ...l, lotNumber: lot, expiresOn: isoDaysFromNow(400) })),
  });
  await transferStock(session, { fromLocationId: depot.id, toLocationId: van.id, lines });
  const rig = await createKit(session, 'Rig 1');
  const agitator = await addKitItem(session, {
    assetTag: 'RIG1-AGI',
    kindId: (await itemKindNamed(session, 'Agitator head')).id,
    kitId: rig.id,
    serialNumber: 'SN-2014',
  });
  await setVibration(session, agitator.id, 2.5);
  await checkOutKit(session, rig.id, van.id);
  const customerName = `Odile Varnham ${id.slice(-4)}`;
  const customer = await addCustomer(session, { name: customerName, email: 'odile@customer.example' });
  const site = await addSite(session, customer.id, {
    address: `14 Weir Cottages, Brackenford ${id.slice(-5)}`,
    postcode: 'BF2 4LN',
  });
  return { engineer, customerName, address: site.address };
}

/** The radiators' card or list, whichever is showing. */
function radiators(page: Page) {
  return page.getByRole('region', { name: 'Radiators', exact: true });
}

test.use({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });

test('an engineer books an 18-radiator job and records the whole visit within the tap budget', async ({
  page,
  baseURL,
}, testInfo) => {
  test.setTimeout(360_000);
  const { engineer, customerName, address } = await prepare(baseURL!);
  const shot = (name: string) => page.screenshot({ path: testInfo.outputPath(`${name}.png`), fullPage: true });
  await signIn(page, engineer.email, engineer.password);
  const count = new TapCounter(page);
  await count.install();
  await mainNav(page).getByRole('link', { name: 'Jobs' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Jobs' })).toBeVisible();
  // The in-page counter starts with a fresh document; the route is the same.
  await page.reload();
  await expect(page.getByRole('heading', { level: 1, name: 'Jobs' })).toBeVisible();

  // Booking: the customer by four letters, the system in three taps, the radiators by count.
  await count.tap(page.getByRole('link', { name: 'Book a job' }));
  await expect(page.getByRole('heading', { level: 1, name: 'Book a job' })).toBeVisible();
  await count.tap(page.getByLabel('Find the customer'));
  await count.type(customerName.slice(0, 4));
  const match = page.getByRole('list', { name: 'Matching customers' }).getByRole('button', { name: customerName });
  await count.tap(match);
  await expect(page.getByText(customerName, { exact: true })).toBeVisible();
  await expect(page.getByRole('radio', { name: address })).toBeChecked();
  await count.tap(page.getByRole('radio', { name: 'Open-vented' }));
  await count.tap(page.getByRole('radio', { name: 'Regular' }));
  await count.tap(page.getByRole('radio', { name: 'Oil' }));
  const adder = page.getByRole('group', { name: 'Add radiators by count' });
  // Double panels at 600 x 1000 are chosen to start with.
  await expect(adder.getByRole('radio', { name: 'Double', exact: true })).toBeChecked();
  await expect(adder.getByRole('radio', { name: '600 × 1000' })).toBeChecked();
  await count.tap(adder.getByLabel('How many double panels'));
  await count.type('10');
  await count.enter();
  await count.tap(adder.getByRole('radio', { name: 'Single', exact: true }));
  await count.tap(adder.getByRole('radio', { name: '600 × 800' }));
  await count.tap(adder.getByLabel('How many single panels'));
  await count.type('6');
  await count.enter();
  await count.tap(adder.getByRole('radio', { name: 'Towel rail' }));
  await count.tap(adder.getByLabel('How many towel rails'));
  await count.type('2');
  await count.enter();
  const listed = page.getByRole('status', { name: 'Radiators listed' });
  await expect(listed).toHaveText(
    '18 radiators: 10 double panel 600 × 1000, 6 single panel 600 × 800, 2 towel rail 800 × 500',
  );
  // No pipe runs measured: the volume is estimated, and says so; the oil regular boiler's default is 15 L.
  const plan = page.getByRole('status', { name: 'The plan' });
  await expect(plan).toContainText('(estimated)');
  // 295 L (280 by radiators, 15 the oil boiler) at 1 L per 100 L: 2.95 L, so 3 packs; the engineer's van holds 5.
  await expect(plan).toContainText(/Visit cleaner \w+: 3 packs \(2\.95 L\) · the van holds 5/);
  await shot('booking-390');
  await checkScreen(page, 'the booking form');
  await count.tap(page.getByRole('button', { name: 'Book the job' }));
  await expect(page.getByRole('heading', { level: 1, name: `Job at ${address}` })).toBeVisible();
  const booking = count.phase('Booking');

  // The sheet. Before the work: the customer acknowledges on the phone; the name comes from the booking.
  const start = page.getByRole('region', { name: 'Before you start' });
  await expect(start.getByText(/Oil appliance: any work on it/)).toBeVisible();
  await expect(start.getByText(/Gas Safe/)).toHaveCount(0);
  await expect(start.getByLabel("The customer's name")).toHaveValue(customerName);
  await checkScreen(page, 'the job sheet');
  await count.sign(start.locator('canvas'));
  await count.tap(start.getByRole('button', { name: 'Signed: start the work' }));
  await expect(start.getByText(`✓ Acknowledged by ${customerName} at`)).toBeVisible();
  await expect
    .poll(() =>
      start
        .getByRole('img', { name: `Signature of ${customerName}` })
        .evaluate((i: HTMLImageElement) => i.naturalWidth),
    )
    .toBeGreaterThan(0);

  // Before readings, radiator by radiator: Next opens the card with the cursor in the top box.
  const list = radiators(page);
  await expect(list.getByRole('status', { name: 'Radiator count' })).toContainText(`0 of ${RADIATORS} flushed`);
  await count.tap(list.getByRole('button', { name: /^Next: / }));
  for (let i = 0; i < RADIATORS; i++) {
    const card = list.getByRole('group', { name: /^Radiator \d+: / });
    const before = card.getByRole('group', { name: 'Readings before' });
    await expect(before.getByLabel('Top (°C)')).toBeFocused();
    await count.type(String(60 + (i % 5)));
    await count.enter();
    await count.type(i % 3 === 0 ? '38' : '55');
    await count.enter();
    await expect(before.getByRole('status')).toHaveText('✓ Saved');
    if (i === 0) {
      await shot('card-before-390');
      await checkScreen(page, 'a radiator card');
    }
    if (i < RADIATORS - 1) await count.tap(card.getByRole('button', { name: /^Next radiator: / }));
    else await count.tap(card.getByRole('button', { name: 'All radiators' }));
  }
  await expect(list.getByRole('status', { name: 'Radiator count' })).toContainText(`${RADIATORS} read before`);

  // The steps before the radiators, one tap each: open-vented, so the cistern and never "pressurise".
  const beforeSteps = page.getByRole('region', { name: 'Before the radiators' });
  await expect(beforeSteps.getByText(/feed-and-expansion cistern/).first()).toBeVisible();
  const openBefore = beforeSteps.locator('li button:not([aria-label^="Untick"])');
  const stepCount = await openBefore.count();
  expect(stepCount, 'open-vented full clean: the steps before the radiators').toBe(5);
  for (let i = 0; i < stepCount; i++) {
    await count.tap(openBefore.first());
    await expect(openBefore).toHaveCount(stepCount - i - 1);
  }

  // Agitation and flush in the flush order: the tool is kept, Enter goes to the flush tick.
  await count.tap(list.getByRole('button', { name: /^Next: / }));
  for (let i = 0; i < RADIATORS; i++) {
    const card = list.getByRole('group', { name: /^Radiator \d+: / });
    const agitation = card.getByRole('group', { name: 'Agitation' });
    await expect(agitation.getByLabel('Agitation (minutes)')).toBeFocused();
    await expect(agitation.getByLabel('Vibrating tool').locator('option:checked')).toHaveText(/^RIG1-AGI/);
    await count.type('5');
    await count.enter();
    await expect(card.getByRole('button', { name: 'Flushed until clear' })).toBeFocused();
    await count.tap(card.getByRole('button', { name: 'Flushed until clear' }));
    await expect(card.getByText(/^✓ Flushed until clear at \d\d:\d\d$/)).toBeVisible();
    await expect(agitation.getByRole('status')).toHaveText('✓ Saved');
    await count.tap(card.getByRole('button', { name: /^Next radiator: / }));
  }

  // After readings: the last flush ticked the agitate and flush steps; Next has come round to the first radiator.
  for (let i = 0; i < RADIATORS; i++) {
    const card = list.getByRole('group', { name: /^Radiator \d+: / });
    const after = card.getByRole('group', { name: 'Readings after' });
    await expect(after.getByLabel('Top (°C)')).toBeFocused();
    await count.type('66');
    await count.enter();
    await count.type('61');
    await count.enter();
    await expect(after.getByRole('status')).toHaveText('✓ Saved');
    const next = card.getByRole('button', { name: /^Next radiator: |^Every radiator done/ });
    await count.tap(next);
  }
  await expect(list.getByRole('status', { name: 'Radiator count' })).toContainText(
    `${RADIATORS} of ${RADIATORS} flushed`,
  );
  await expect(list.getByText('Every radiator is read before, flushed and read after.')).toBeVisible();
  await expect(list.getByText(/^Done at \d\d:\d\d/)).toHaveCount(2);
  await shot('radiators-done-390');

  // The steps after the radiators.
  const afterSteps = page.getByRole('region', { name: 'After the radiators' });
  const openAfter = afterSteps.locator('li button:not([aria-label^="Untick"])');
  const afterCount = await openAfter.count();
  for (let i = 0; i < afterCount; i++) {
    await count.tap(openAfter.first());
    await expect(openAfter).toHaveCount(afterCount - i - 1);
  }
  // Open-vented: refilled from the cistern; the only "pressurise" is the caution never to.
  await expect(afterSteps.getByText(/refill from the feed-and-expansion cistern/)).toBeVisible();
  await expect(afterSteps.getByText(/\bpressurise\b(?! it)/i)).toHaveCount(0);

  // Water tests: clear (one tap), the two TDS figures and the inhibitor reading, the verdicts as typed.
  const water = page.getByRole('group', { name: 'Water tests' });
  await count.tap(water.getByText('Yes, clear'));
  await count.tap(water.getByLabel('Mains TDS (ppm)'));
  await count.type('180');
  await count.enter();
  await count.type('190');
  await count.enter();
  await expect(water.getByText('Flush complete: system water within 5.6% of mains, and clear.')).toBeVisible();
  await expect(water.getByLabel('Inhibitor reading (% v/v)')).toBeFocused();
  await count.type('1.2');
  await count.enter();
  await expect(water.getByText('Inhibitor pass (target 1 to 1.5 % v/v).')).toBeVisible();
  await expect(water.getByRole('status').first()).toHaveText('✓ Saved');

  // Completion: nothing is missing, so no reason is asked; the customer signs to accept.
  await count.tap(page.getByRole('button', { name: 'Complete the job' }));
  const summary = page.getByRole('group', { name: 'Completion summary' });
  await expect(summary.getByText('Nothing is missing.')).toBeVisible();
  await expect(
    summary.getByText(`${RADIATORS} of ${RADIATORS} radiators flushed, ${RADIATORS} read after.`),
  ).toBeVisible();
  await checkScreen(page, 'the completion summary');
  await shot('completion-390');
  await count.sign(summary.locator('canvas'));
  await count.tap(summary.getByRole('button', { name: 'Yes, complete it' }));
  await expect(page.getByRole('heading', { name: 'Done' })).toBeVisible();
  await expect(page.getByText(/report HF-\d{6}/)).toBeVisible();
  await expect(page.getByText(`✓ Accepted by ${customerName} at`)).toBeVisible();
  const sheet = count.phase('The sheet');

  const seen = await count.seenByPage();
  const line = (name: string, c: { taps: number; keys: number }) => `${name}: ${c.taps} taps, ${c.keys} keystrokes`;
  const report = [
    `Visit on a phone (390 x 844, touch), ${RADIATORS} radiators, open-vented oil, full clean:`,
    count.report(),
    line('Total', { taps: count.taps, keys: count.keys }),
    line('Seen by the page (pointer-downs, key-downs)', seen),
  ].join('\n');
  console.log(report);
  await testInfo.attach('tap-counts.txt', { body: report, contentType: 'text/plain' });
  // Every tap and keystroke went through the counter: the page saw no more and no fewer.
  expect(seen).toEqual({ taps: count.taps, keys: count.keys });
  expect(booking.taps, 'booking taps').toBeLessThanOrEqual(BOOKING_TAPS);
  expect(sheet.taps, 'sheet taps').toBeLessThanOrEqual(SHEET_TAPS);
  await checkScreen(page, 'the completed job');
});

test('jobs where people need them: the next ones on the engineer’s home, the flush order kept for the next visit, reschedule, cancel, filters, an inhibitor visit', async ({
  page,
  baseURL,
}) => {
  test.setTimeout(240_000);
  const { owner, engineer, van, depot } = await firmWithCrew(baseURL!);
  const session = owner.session;
  const id = runId().toUpperCase();
  const inhibitor = await createProduct(session, {
    name: `Plain inhibitor ${id}`,
    kind: 'inhibitor',
    packSize: 1,
    packUnit: 'l',
    doseLitresPer100L: 1,
    radiatorsPerPack: 10,
    shelfLifeMonths: 24,
    targetMin: 1,
    targetMax: 1.5,
    targetUnit: '% v/v',
  });
  await receiveStock(session, {
    locationId: depot.id,
    reference: `Plain ${id}`,
    lines: [{ productId: inhibitor.id, quantity: 1, lotNumber: `P${id.slice(-5)}`, expiresOn: isoDaysFromNow(400) }],
  });
  await transferStock(session, {
    fromLocationId: depot.id,
    toLocationId: van.id,
    lines: [{ productId: inhibitor.id, quantity: 1 }],
  });
  const customer = await addCustomer(session, { name: `Perpetua Lund ${id.slice(-4)}` });
  const site = await addSite(session, customer.id, { address: `9 Orchard Rise, Brackenford ${id.slice(-5)}` });
  const rooms = ['Hall', 'Lounge', 'Bedroom'];
  const survey = {
    systemType: 'sealed' as const,
    boilerKind: 'combi' as const,
    fuel: 'gas' as const,
    radiators: rooms.map((room) => ({ room, panel: 'single' as const })),
    pipeRuns: [],
  };
  const book = (days: number, patch: Partial<CreateJobInput> = {}) =>
    bookJob(session, {
      siteId: site.id,
      scheduledOn: isoDaysFromNow(days),
      engineerMemberId: engineer.memberId,
      survey,
      productIds: [inhibitor.id],
      visitKind: 'full_clean',
      ...patch,
    });
  // Two visits of 1 pack each against the 1 pack on the van: the first is covered, the later one would be short.
  const later = await book(5);
  const sooner = await book(2);

  await signIn(page, engineer.email, engineer.password);
  const mine = page.getByRole('list', { name: 'Your next jobs' });
  await expect(mine.getByRole('link')).toHaveCount(2);
  await expect(mine.getByRole('link').first()).toContainText(formatUkDate(sooner.job.scheduledOn));
  await expect(mine.getByRole('link').first()).toContainText('Full clean, sealed, 3 radiators');
  await expect(mine.getByRole('link').first()).toContainText(`1 × ${inhibitor.name}`);
  await expect(mine.getByText('The van holds them').first()).toBeVisible();
  await checkScreen(page, 'the engineer’s home');

  // The change-password form lives on the account page, a tap on the name in the header.
  await page.getByRole('link', { name: engineer.name }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Your account' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Change your password' })).toBeVisible();

  // The flush order, set once by numbering, is kept on the site for the next visit.
  await page.goto(`/jobs/${sooner.job.id}`);
  const radiators = page.getByRole('region', { name: 'Radiators', exact: true });
  await expect(radiators.getByText('The flush order is the survey’s until you set it.')).toBeVisible();
  await radiators.getByRole('button', { name: 'Set the flush order' }).click();
  const ordering = radiators.getByRole('group', { name: 'Flush order' });
  for (const room of ['Bedroom', 'Hall', 'Lounge'])
    await ordering.getByRole('button', { name: new RegExp(room) }).click();
  await ordering.getByRole('button', { name: 'Save this order' }).click();
  const order = radiators.getByRole('list', { name: 'Radiators in the flush order' }).getByRole('button');
  await expect(order.nth(0)).toContainText('Bedroom');
  await expect(order.nth(1)).toContainText('Hall');
  await expect(radiators.getByRole('button', { name: /^Next: Radiator 3: Bedroom/ })).toBeVisible();
  await page.goto(`/jobs/${later.job.id}`);
  await expect(radiators.getByText('The flush order is the one kept from the last visit to this site.')).toBeVisible();
  await expect(order.nth(0)).toContainText('Bedroom');

  // Reschedule the later visit; cancel the sooner one with a reason.
  const change = page.getByRole('region', { name: 'Change the booking' });
  await change.getByText('Change the booking').click();
  await change.getByRole('link', { name: 'Edit or reschedule the job' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Edit the job' })).toBeVisible();
  const newDate = isoDaysFromNow(9);
  await page.getByLabel('Date').fill(newDate);
  await page.getByRole('button', { name: 'Save the changes' }).click();
  await expect(page.getByRole('heading', { level: 1, name: `Job at ${site.address}` })).toBeVisible();
  await expect(page.getByText(formatUkDate(newDate)).first()).toBeVisible();
  await page.goto(`/jobs/${sooner.job.id}`);
  await change.getByText('Change the booking').click();
  await change.getByLabel('Why is the job cancelled?').fill('The customer is away that week.');
  await change.getByRole('button', { name: 'Cancel the job' }).click();
  await expect(page.getByText('Cancelled', { exact: true }).first()).toBeVisible();
  await expect(page.getByText(/The customer is away that week\.$/)).toBeVisible();
  await expect(page.getByRole('button', { name: 'Complete the job' })).toHaveCount(0);

  // The jobs list: the next booked visit first, an engineer column, and filters.
  await mainNav(page).getByRole('link', { name: 'Jobs' }).click();
  const table = page.getByRole('table', { name: 'Cleaning jobs of the firm' });
  // On a phone each row is a card (the header row is hidden); the engineer is a cell of its own.
  const rows = table.getByRole('row');
  await expect(rows.first()).toContainText(formatUkDate(newDate));
  await expect(rows.first().locator('td[data-label="Engineer"]')).toHaveText(engineer.name);
  await page.getByLabel('Status').selectOption('cancelled');
  await expect(rows).toHaveCount(1);
  await expect(rows.first()).toContainText('Cancelled');
  await checkScreen(page, 'the jobs list');

  // An inhibitor-only visit: dose, circulate, test; no cleaner, agitation or flush.
  const inhibitorVisit = await book(3, { visitKind: 'inhibitor_only' });
  await page.goto(`/jobs/${inhibitorVisit.job.id}`);
  const stepList = page.getByRole('region', { name: 'Steps', exact: true });
  await expect(stepList.locator('li button:not([aria-label^="Untick"])')).toHaveCount(3);
  await expect(page.getByRole('region', { name: 'Radiators', exact: true })).toHaveCount(0);
  await expect(page.getByRole('region', { name: 'Before you start' }).getByText(/foul drain/)).toHaveCount(0);
  await expect(page.getByText('Dose the cleaner', { exact: true })).toHaveCount(0);
});

/** A calendar day as the app shows it, "8 Dec 2026". */
function formatUkDate(iso: string): string {
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(`${iso}T12:00:00Z`),
  );
}
