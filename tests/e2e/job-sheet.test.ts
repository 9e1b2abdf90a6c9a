import { statSync, writeFileSync, readFileSync } from 'node:fs';
import { deflateSync, crc32 } from 'node:zlib';
import type { Locator, Page } from '@playwright/test';
import type { ProductInput } from '@heatfleet/domain';
import { firmWithCrew } from './support/crew-fixtures';
import { horizontalOverflow, mainNav, runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { addKitItem, checkOutKit, createKit, itemKindNamed, setVibration } from './support/fleet-fixtures';
import { createProduct, isoDaysFromNow, receiveStock, transferStock } from './support/stock-fixtures';
import { smallTargets } from './support/visit-checks';

// The sheet's words, pinned here so a change to them is a visible decision. A sealed gas system: the
// steps and cautions the API fits to it (packages/domain visit-steps.ts).
const steps = {
  depressurise: 'Isolate the boiler, let the system cool and release its pressure to 0 bar before opening it',
  vessel: 'Check the expansion vessel’s charge at 0 bar against the boiler’s instructions; recharge it if low',
  connect: 'Connect the flushing rig (the boiler still isolated)',
  latch: 'Latch open any motorised zone valve so every circuit is flushed',
  doseCleaner: 'Dose the cleaner',
  circulate: 'Circulate hot for the cleaner’s minimum time',
  agitate: 'Agitate each radiator',
  flush: 'Flush each radiator until clear, the furthest from the rig first',
  doseInhibitor: 'Dose the inhibitor',
  reinstate:
    'Reinstate: refill through the filling loop to the cold fill pressure (about 1 to 1.5 bar, from the boiler’s instructions), vent, release the zone valves and check for leaks',
};
const cautions = {
  electrical: 'Isolate the boiler electrically and prove it dead before working on it.',
  gas: 'Gas appliance: any work on it or its gas supply is for a business on the Gas Safe Register only.',
  chemicals: 'Read the product’s safety data sheet; wear gloves and eye protection; never mix cleaners.',
  drain: 'Flushing water and sludge go to a foul drain, never a surface-water drain.',
  hotWater: 'Hot water and surfaces scald: let the system cool before draining.',
  sealed: 'Sealed system: refill through the filling loop to the cold fill pressure only',
  judgement: 'These figures support your judgement; they do not replace it.',
};

/**
 * A fresh firm whose engineer drives "Van 1", and as its owner: a cleaner (60 minutes hot) and an
 * inhibitor (1 to 1.5 % v/v) with one pack of each on Van 1, and Rig 1 (a filtration rig and an
 * agitator head of 10 m/s²) checked out to Van 1, so every figure the test checks comes from data it set.
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
  const cleaner = await product({ name: `Trial cleaner ${id}`, kind: 'cleaner', minCirculationMinutes: 60 });
  const inhibitor = await product({
    name: `Trial inhibitor ${id}`,
    kind: 'inhibitor',
    targetMin: 1,
    targetMax: 1.5,
    targetUnit: '% v/v',
    testMethod: 'Refractometer',
  });

  const lines = [cleaner, inhibitor].map((p) => ({ productId: p.id, quantity: 1 }));
  const lot = `S${id.slice(-6)}`;
  await receiveStock(session, {
    locationId: depot.id,
    reference: `Job sheet test ${lot}`,
    lines: lines.map((l) => ({ ...l, lotNumber: lot, expiresOn: isoDaysFromNow(400) })),
  });
  await transferStock(session, { fromLocationId: depot.id, toLocationId: van.id, lines });

  const rig = await createKit(session, 'Rig 1');
  await addKitItem(session, {
    assetTag: 'RIG1',
    kindId: (await itemKindNamed(session, 'Filtration rig')).id,
    kitId: rig.id,
    serialNumber: 'SN-1010',
  });
  const agitator = await addKitItem(session, {
    assetTag: 'RIG1-AGI',
    kindId: (await itemKindNamed(session, 'Agitator head')).id,
    kitId: rig.id,
    serialNumber: 'SN-1014',
  });
  await setVibration(session, agitator.id, 10);
  await checkOutKit(session, rig.id, van.id);
  return { cleaner, inhibitor, agitatorTag: agitator.assetTag, engineer };
}

/** A small PNG (8 x 8, one colour) built byte by byte, so the test needs no image file in the repo. */
function writePng(path: string): void {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const length = Buffer.alloc(4);
    length.writeUInt32BE(data.length);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(body));
    return Buffer.concat([length, body, crc]);
  };
  const size = 8;
  const header = Buffer.alloc(13);
  header.writeUInt32BE(size, 0);
  header.writeUInt32BE(size, 4);
  header.set([8, 2, 0, 0, 0], 8); // 8-bit RGB, no interlace
  const row = Buffer.concat([Buffer.from([0]), Buffer.from(Array.from({ length: size }, () => [21, 85, 87]).flat())]);
  const pixels = deflateSync(Buffer.concat(Array.from({ length: size }, () => row)));
  writeFileSync(
    path,
    Buffer.concat([
      Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      chunk('IHDR', header),
      chunk('IDAT', pixels),
      chunk('IEND', Buffer.alloc(0)),
    ]),
  );
}

async function expectNoOverflow(page: Page, what: string) {
  const overflow = await horizontalOverflow(page);
  expect(overflow.scrollWidth, `${what} overflows: ${overflow.widest ?? ''}`).toBeLessThanOrEqual(360);
}

/** The caution is on screen and sits above the tick it protects. */
async function expectAbove(caution: Locator, tick: Locator) {
  await expect(caution).toBeVisible();
  const [c, t] = [await caution.boundingBox(), await tick.boundingBox()];
  expect(c && t && c.y + c.height <= t.y, 'the caution comes before its tick').toBe(true);
}

async function tick(section: Locator, label: string) {
  await section.getByRole('button', { name: label, exact: true }).click();
  await expect(
    section.getByRole('button', {
      name: new RegExp(`^Untick step \\d+: ${label.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}$`),
    }),
  ).toBeVisible();
}

type ReadingLabel =
  'Top (°C)' | 'Bottom (°C)' | 'Flow (°C), if taken' | 'Return (°C), if taken' | 'Room (°C), if taken';

/** Types into a reading's boxes (each saves itself once top and bottom are valid); the optional three are folded. */
async function fillReadings(group: Locator, values: Partial<Record<ReadingLabel, string>>) {
  const fold = group.locator('details');
  if (
    Object.keys(values).some((l) => l.endsWith('if taken')) &&
    !(await fold.evaluate((d: HTMLDetailsElement) => d.open))
  ) {
    await fold.locator('summary').click();
  }
  for (const [label, value] of Object.entries(values)) await group.getByLabel(label, { exact: true }).fill(value);
}

/** Opens a radiator's card from the list (or from the card showing, through "All radiators"). */
async function openRadiator(radiators: Locator, name: string) {
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

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true, isMobile: true });

test('an engineer on a phone records a cleaning job from the survey to the report', async ({
  page,
  baseURL,
}, testInfo) => {
  test.setTimeout(180_000);
  const { cleaner, inhibitor, agitatorTag, engineer } = await prepare(baseURL!);
  const engineerName = engineer.name;
  const shot = (name: string) => page.screenshot({ path: testInfo.outputPath(`${name}.png`), fullPage: true });

  // The survey: two sized radiators with their rated outputs, one pipe run; the firm's cleaner and inhibitor are pre-chosen.
  await signIn(page, engineer.email, engineer.password);
  await mainNav(page).getByRole('link', { name: 'Jobs' }).click();
  await page.getByRole('link', { name: 'Book a job' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Book a job' })).toBeVisible();
  const customerName = `Sheet household ${runId().toUpperCase()}`;
  const address = `3 Sheet Row, Brackenford BF8 ${runId().slice(-3).toUpperCase()}`;
  await page.getByRole('button', { name: 'A new customer' }).click();
  await page.getByRole('group', { name: 'New customer' }).getByLabel('Customer name').fill(customerName);
  await page.getByRole('button', { name: 'Add the customer' }).click();
  await expect(page.getByText(customerName, { exact: true })).toBeVisible();
  // A new customer has no site yet, so the site form opens by itself.
  await page.getByRole('group', { name: 'New site' }).getByLabel('Site address').fill(address);
  await page.getByRole('button', { name: 'Add the site' }).click();
  await expect(page.getByRole('radio', { name: address })).toBeChecked();

  const live = page.getByRole('status', { name: 'Live system volume' });
  await page.getByText('Rooms and details, one by one').click();
  await page.getByRole('button', { name: 'Add a radiator' }).click();
  await page.getByRole('button', { name: 'Add a radiator' }).click();
  const lounge = page.getByRole('group', { name: 'Radiator 1' });
  await lounge.getByLabel('Room').fill('Lounge');
  await lounge.getByLabel('Panel type').selectOption('double');
  await lounge.getByLabel('Height (mm)').fill('600');
  await lounge.getByLabel('Length (mm)').fill('1200');
  await lounge.getByLabel('Rated output (W), if known').fill('1800');
  const bedroom = page.getByRole('group', { name: 'Radiator 2' });
  await bedroom.getByLabel('Room').fill('Bedroom');
  await bedroom.getByLabel('Height (mm)').fill('600');
  await bedroom.getByLabel('Length (mm)').fill('800');
  await bedroom.getByLabel('Rated output (W), if known').fill('700');
  await page.getByText('Pipework', { exact: true }).click();
  await page.getByRole('button', { name: 'Add a pipe run' }).click();
  await page.getByRole('group', { name: 'Pipe run 1' }).getByLabel('Length (m)').fill('12');
  // 7.2 L double panel + 2.4 L single + 12 m of 15 mm copper (0.1453 L/m, EN 1057) + 1 L gas combi heat exchanger.
  await expect(live).toHaveText('Volume 12.3 L');
  const plan = page.getByRole('status', { name: 'The plan' });
  await expect(plan.getByText(`${cleaner.name}: 1 pack`)).toBeVisible();
  await expect(plan.getByText(`${inhibitor.name}: 1 pack`)).toBeVisible();
  await expectNoOverflow(page, 'the new job form');
  await page.getByRole('button', { name: 'Book the job' }).click();

  // The sheet: the plan first, nothing short on the van.
  await expect(page.getByRole('heading', { level: 1, name: `Job at ${address}` })).toBeVisible();
  await expect(page.getByLabel('System volume').getByText('System volume 12.3 L', { exact: true })).toBeVisible();
  await expect(page.getByText(/^The van is \d+ packs? short of/)).toHaveCount(0);
  await shot('sheet-top-360');
  await expectNoOverflow(page, 'the job sheet');

  const stepsBefore = page.getByRole('region', { name: 'Before the radiators' });
  const first = stepsBefore.getByRole('button', { name: steps.depressurise, exact: true });
  await expectAbove(stepsBefore.getByText(cautions.electrical), first);
  await expectAbove(stepsBefore.getByText(cautions.gas), first);
  await tick(stepsBefore, steps.depressurise);
  await expect(stepsBefore.getByText(new RegExp(`^Done at \\d{2}:\\d{2} by ${engineerName}$`))).toHaveCount(1);
  await tick(stepsBefore, steps.vessel);
  await tick(stepsBefore, steps.connect);
  await tick(stepsBefore, steps.latch);
  await expectAbove(
    stepsBefore.getByRole('list', { name: 'Cautions before step 5' }).getByText(cautions.chemicals),
    stepsBefore.getByRole('button', { name: steps.doseCleaner, exact: true }),
  );
  const circulation = stepsBefore.getByRole('status', { name: 'Circulation' });
  await expect(circulation).toContainText(
    'circulation clock starts when the cleaner is dosed; this cleaner needs at least 60 minutes hot',
  );
  await tick(stepsBefore, steps.doseCleaner);
  await expect(circulation).toContainText('Circulated 0 of 60 minutes');
  await expect(circulation).toContainText('Not yet');

  // Unticking clears the time; ticking again records a new one.
  await stepsBefore.getByRole('button', { name: `Untick step 1: ${steps.depressurise}` }).click();
  await expect(first).toBeVisible();
  await tick(stepsBefore, steps.depressurise);

  // Readings before, each saved by itself: the lounge has a cold bottom (20 K against the default 10 K threshold).
  const radiators = page.getByRole('region', { name: 'Radiators', exact: true });
  await expect(radiators.getByText(cautions.judgement)).toBeVisible();
  let loungeCard = await openRadiator(radiators, 'Lounge');
  const loungeBefore = loungeCard.getByRole('group', { name: 'Readings before' });
  await fillReadings(loungeBefore, { 'Top (°C)': '168', 'Bottom (°C)': '48' });
  await expect(loungeBefore.getByText('Top temperature must be between -10 and 110 °C.')).toBeVisible();
  await fillReadings(loungeBefore, { 'Top (°C)': '68' });
  // EN 442: 1800 W x ((68 + 48) / 2 - 20 = 38 K / 50)^1.3 = 1260 W, worked out as typed.
  await expect(loungeBefore.getByText('Top to bottom 20 K')).toBeVisible();
  await expect(loungeBefore.getByText('Cold bottom', { exact: true })).toBeVisible();
  await expect(loungeBefore.getByText('Output about 1,260 W of 1,800 W rated (EN 442)')).toBeVisible();
  await expect(loungeBefore.getByRole('status')).toHaveText('✓ Saved');

  let bedroomCard = await openRadiator(radiators, 'Bedroom');
  const bedroomBefore = bedroomCard.getByRole('group', { name: 'Readings before' });
  await fillReadings(bedroomBefore, { 'Top (°C)': '62', 'Bottom (°C)': '58', 'Room (°C), if taken': '19' });
  await expect(bedroomBefore.getByText('No cold bottom', { exact: true })).toBeVisible();
  await expect(bedroomBefore.getByText('Output about 541 W of 700 W rated (EN 442)')).toBeVisible();
  await expect(bedroomBefore.getByRole('status')).toHaveText('✓ Saved');
  await shot('sheet-radiators-360');

  await tick(stepsBefore, steps.circulate);
  await expect(circulation).toContainText('ticked before the minimum time');

  // Agitation with Rig 1's agitator at 10 m/s²: 2 x 10² x (12/60) h = 40 points, then 50 more.
  for (const [name, minutes, points] of [
    ['Lounge', '12', '40'],
    ['Bedroom', '15', '50'],
  ] as const) {
    const card = await openRadiator(radiators, name);
    const agitation = (await part(card, 'Agitate and flush')).getByRole('group', { name: 'Agitation' });
    const tool = agitation.getByLabel('Vibrating tool');
    const value = await tool.locator('option', { hasText: agitatorTag }).getAttribute('value');
    await tool.selectOption(value!);
    await agitation.getByLabel('Agitation (minutes)').fill(minutes);
    await expect(agitation.getByText(`${points} vibration points`)).toBeVisible();
    await expect(agitation.getByRole('status')).toHaveText('✓ Saved');
    // Each radiator is ticked as flushed until clear, with its time; the flush cautions come first.
    const flushed = card.getByRole('button', { name: 'Flushed until clear' });
    await expectAbove(
      radiators.getByRole('list', { name: 'Cautions before flushing' }).getByText(cautions.drain),
      flushed,
    );
    await flushed.click();
    await expect(card.getByText(/Flushed until clear at \d\d:\d\d/)).toBeVisible();
  }
  // 90 points is within 80% of the exposure action value of 100 (HSE points system): a warning.
  const vibration = page
    .getByRole('region', { name: 'Vibration today' })
    .getByRole('alert', { name: 'Vibration today' });
  await expect(vibration).toContainText('90');
  await expect(vibration).toContainText('nearing the exposure action value of 100');
  // The last radiator flushed ticks the agitate and flush steps, with the time.
  await radiators.getByRole('button', { name: 'All radiators' }).click();
  await expect(radiators.getByRole('button', { name: `Untick step 7: ${steps.agitate}` })).toBeVisible();
  await expect(radiators.getByRole('button', { name: `Untick step 8: ${steps.flush}` })).toBeVisible();

  // Readings after: the lounge's cold bottom is gone; flow and return give the mean water temperature.
  loungeCard = await openRadiator(radiators, 'Lounge');
  const loungeAfter = (await part(loungeCard, 'After the clean')).getByRole('group', { name: 'Readings after' });
  await fillReadings(loungeAfter, {
    'Top (°C)': '70',
    'Bottom (°C)': '64',
    'Flow (°C), if taken': '72',
    'Return (°C), if taken': '62',
  });
  await expect(loungeAfter.getByText('No cold bottom', { exact: true })).toBeVisible();
  await expect(loungeAfter.getByText(/^Mean water to room 47 K/)).toBeVisible();
  await expect(loungeAfter.getByText('Output about 1,661 W of 1,800 W rated (EN 442)')).toBeVisible();
  await expect(loungeAfter.getByRole('status')).toHaveText('✓ Saved');
  bedroomCard = await openRadiator(radiators, 'Bedroom');
  const bedroomAfter = (await part(bedroomCard, 'After the clean')).getByRole('group', { name: 'Readings after' });
  await fillReadings(bedroomAfter, { 'Top (°C)': '66', 'Bottom (°C)': '62' });
  await expect(bedroomAfter.getByRole('status')).toHaveText('✓ Saved');
  await radiators.getByRole('button', { name: 'All radiators' }).click();
  await expect(page.getByText('2 of 2 flushed · 2 read after')).toBeVisible();

  // Water tests: not yet at 250 ppm against 180 (38.9% off), complete at 190 (5.6%) with clear water.
  const water = page.getByRole('group', { name: 'Water tests' });
  await expect(water.getByText(cautions.judgement)).toBeVisible();
  await water.getByLabel('Mains TDS (ppm)').fill('180');
  await water.getByLabel('System TDS (ppm)').fill('250');
  await water.getByText('Yes, clear').click();
  await expect(water.getByText('Not yet: 38.9% from mains. Keep flushing until within 10%.')).toBeVisible();
  await water.getByLabel('System TDS (ppm)').fill('190');
  await expect(water.getByText('Flush complete: system water within 5.6% of mains, and clear.')).toBeVisible();
  await expect(water.getByLabel('Inhibitor', { exact: true }).locator('option:checked')).toHaveText(inhibitor.name);
  await water.getByLabel('Inhibitor reading (% v/v)').fill('0.6');
  await expect(water.getByText('Inhibitor low: dose more and test again (target 1 to 1.5 % v/v).')).toBeVisible();
  await water.getByLabel('Inhibitor reading (% v/v)').fill('1.2');
  await expect(water.getByText('Inhibitor pass (target 1 to 1.5 % v/v).')).toBeVisible();
  await water.getByLabel('pH, if taken').fill('7.8');
  await expect(water.getByRole('status').first()).toHaveText('✓ Saved');
  await expect(page.getByText('flush complete · inhibitor pass')).toBeVisible();

  const stepsAfter = page.getByRole('region', { name: 'After the radiators' });
  const doseInhibitor = stepsAfter.getByRole('button', { name: steps.doseInhibitor, exact: true });
  await expectAbove(
    stepsAfter.getByRole('list', { name: 'Cautions before step 9' }).getByText(cautions.chemicals),
    doseInhibitor,
  );
  await tick(stepsAfter, steps.doseInhibitor);
  await expectAbove(
    stepsAfter.getByRole('list', { name: 'Cautions before step 10' }).getByText(cautions.sealed),
    stepsAfter.getByRole('button', { name: steps.reinstate, exact: true }),
  );
  await tick(stepsAfter, steps.reinstate);
  await expect(page.getByText('2 of 2 ticked')).toBeVisible();

  // Kit used: the agitator from the van, saved as it is ticked.
  await page.getByRole('region', { name: 'Kit used' }).getByText('Kit used').first().click();
  const kit = page.getByRole('group', { name: 'Kit used' });
  await kit.getByLabel(new RegExp(`^${agitatorTag}`)).check();
  await expect(kit.getByRole('status')).toHaveText('✓ Saved');
  await expect(page.getByText('1 item', { exact: true })).toBeVisible();

  // A photo of the magnet after the clean, from a PNG this test writes.
  await page.getByRole('region', { name: 'Photos' }).getByText('Photos').first().click();
  const pngPath = testInfo.outputPath('magnet-after.png');
  writePng(pngPath);
  const addPhoto = page.getByRole('form', { name: 'Add a photo' });
  await addPhoto.getByLabel('Photo', { exact: true }).setInputFiles(pngPath);
  await addPhoto.getByLabel('What it shows').selectOption({ label: 'Filter magnet after' });
  await addPhoto.getByLabel('Caption (optional)').fill('Magnet after the clean');
  await addPhoto.getByRole('button', { name: 'Add the photo' }).click();
  const thumbnail = page.getByRole('list', { name: 'Photos' }).getByRole('img', { name: 'Magnet after the clean' });
  await expect(thumbnail).toBeVisible();
  await expect.poll(() => thumbnail.evaluate((img: HTMLImageElement) => img.naturalWidth)).toBeGreaterThan(0);

  await page.getByRole('region', { name: 'Notes' }).getByText('Notes', { exact: true }).first().click();
  const notes = page.getByRole('group', { name: 'Notes' });
  await notes.getByLabel('Notes for the record').fill('Heavy sludge in the lounge radiator; cleared after agitation.');
  await notes.getByLabel('Notes for the record').blur();
  await expect(notes.getByRole('status')).toHaveText('✓ Saved');
  await shot('sheet-filled-360');
  await expectNoOverflow(page, 'the filled job sheet');
  expect(await smallTargets(page), 'tap targets under 48 px').toEqual([]);

  // Completion: the circulation was ticked before the cleaner's minimum, so a reason is asked; the chemicals come off the van.
  await page.getByRole('button', { name: 'Complete the job' }).click();
  const summary = page.getByRole('group', { name: 'Completion summary' });
  const reason = summary.getByLabel('Hot circulation shorter than the cleaner’s minimum');
  await expect(reason).toBeVisible();
  await expect(page.getByText(/off the van\. Complete the job\?$/)).toBeVisible();
  await page.getByRole('button', { name: 'Yes, complete it' }).click();
  await expect(summary.getByText('Give a reason (a few words).')).toBeVisible();
  await reason.fill('The customer needed the heating back on; a second visit is booked.');
  await summary.getByLabel('What you recommend (optional)').fill('Fit a magnetic filter on the return.');
  await page.getByRole('button', { name: 'Yes, complete it' }).click();
  await expect(page.getByText('Completed', { exact: true })).toBeVisible();
  const used = page.getByRole('list', { name: 'Chemicals used' });
  await expect(used.getByText(`1 × ${cleaner.name}`)).toBeVisible();
  await expect(used.getByText(`1 × ${inhibitor.name}`)).toBeVisible();
  await expect(page.getByText(/^Next annual check:/)).toBeVisible();
  await expect(page.getByText('The customer needed the heating back on; a second visit is booked.')).toBeVisible();
  await expect(page.getByText('Recommended: Fit a magnetic filter on the return.')).toBeVisible();
  await expect(page.getByRole('button', { name: /^Untick|^Save|^Add the photo$|^Flushed until clear$/ })).toHaveCount(
    0,
  );
  await expect(page.getByText(new RegExp(`^Done at \\d{2}:\\d{2} by ${engineerName}$`))).toHaveCount(10);
  loungeCard = await openRadiator(radiators, 'Lounge');
  await expect((await part(loungeCard, 'Before the clean')).getByLabel('Top (°C)', { exact: true })).toBeDisabled();
  await shot('sheet-completed-360');
  await expectNoOverflow(page, 'the completed job sheet');

  const report = page.getByRole('link', { name: /^Download the report/ });
  const [download] = await Promise.all([page.waitForEvent('download'), report.click()]);
  const pdfPath = testInfo.outputPath('report.pdf');
  await download.saveAs(pdfPath);
  expect(statSync(pdfPath).size).toBeGreaterThan(0);
  expect(readFileSync(pdfPath).subarray(0, 5).toString('latin1')).toBe('%PDF-');
});
