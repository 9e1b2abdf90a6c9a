import type { Page } from '@playwright/test';
import type { ProductInput } from '@heatfleet/domain';
import { firmWithCrew } from './support/crew-fixtures';
import { horizontalOverflow, mainNav, runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { addCustomer, addSite, bookJob } from './support/job-fixtures';
import { createProduct, isoDaysFromNow, receiveStock, transferStock } from './support/stock-fixtures';

// Invented products with the demo's figures: 1 L packs dosed at 1 L per 100 L, or one pack per 10 radiators.
const systemCleaner: ProductInput = {
  name: 'HFL System Cleaner',
  kind: 'cleaner',
  packSize: 1,
  packUnit: 'l',
  doseLitresPer100L: 1,
  radiatorsPerPack: 10,
  shelfLifeMonths: 36,
  minCirculationMinutes: 60,
};
const inhibitor: ProductInput = {
  name: 'HFL Inhibitor',
  kind: 'inhibitor',
  packSize: 1,
  packUnit: 'l',
  doseLitresPer100L: 1,
  radiatorsPerPack: 10,
  shelfLifeMonths: 48,
  targetMin: 1,
  targetMax: 1.5,
  targetUnit: '% v/v',
  testMethod: 'Refractometer',
};

/**
 * A fresh firm whose engineer drives "Van 1", with a job booked for them: a combi with nine radiators
 * and no sizes (the quick estimate), a cleaner and an inhibitor, and the packs its plan needs
 * received at the depot and sent to the van.
 */
async function prepareJob(baseURL: string) {
  const { owner, engineer, van, depot } = await firmWithCrew(baseURL);
  const session = owner.session;
  const products = [await createProduct(session, systemCleaner), await createProduct(session, inhibitor)];
  const customer = await addCustomer(session, { name: 'Odile Farrant', email: 'odile@customer.example' });
  const site = await addSite(session, customer.id, {
    address: '14 Weir Cottages, Brackenford BF2 4LN',
    accessNotes: 'Ring ahead; parking on the street.',
  });
  const booked = await bookJob(session, {
    siteId: site.id,
    scheduledOn: isoDaysFromNow(2),
    engineerMemberId: engineer.memberId,
    survey: {
      systemType: 'sealed',
      boilerKind: 'combi',
      fuel: 'gas',
      radiators: Array.from({ length: 9 }, (_, i) => ({
        room: `Room ${i + 1}`,
        panel: i % 3 === 0 ? ('double' as const) : ('single' as const),
      })),
      pipeRuns: [],
    },
    productIds: products.map((p) => p.id),
  });
  expect(booked.doses.length, 'the job doses a cleaner and an inhibitor').toBe(2);
  expect(booked.job.vanLocationId).toBe(van.id);

  const lot = `J${runId().slice(-6).toUpperCase()}`;
  const lines = booked.doses.map((d) => ({ productId: d.product.id, quantity: d.packs }));
  await receiveStock(session, {
    locationId: depot.id,
    reference: `Job test ${lot}`,
    lines: lines.map((l) => ({ ...l, lotNumber: lot, expiresOn: isoDaysFromNow(400) })),
  });
  await transferStock(session, { fromLocationId: depot.id, toLocationId: van.id, lines });
  return { job: { address: site.address }, doses: booked.doses, engineer };
}

async function expectNoOverflow(page: Page, what: string) {
  const overflow = await horizontalOverflow(page);
  expect(overflow.scrollWidth, `${what} overflows: ${overflow.widest ?? ''}`).toBeLessThanOrEqual(360);
}

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true, isMobile: true });

test('the engineer opens a booked job, reads the plan and the cautions, and completes it', async ({
  page,
  baseURL,
}, testInfo) => {
  const { job, doses, engineer } = await prepareJob(baseURL!);

  await signIn(page, engineer.email, engineer.password);
  await mainNav(page).getByRole('link', { name: 'Jobs' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Jobs' })).toBeVisible();
  await page.screenshot({ path: testInfo.outputPath('jobs-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the jobs list');
  // Found by its address, as an engineer with a long list of jobs would.
  await page.getByRole('searchbox', { name: 'Find a customer or address' }).fill(job.address);
  await page.getByRole('row').filter({ hasText: job.address }).getByRole('link').click();

  await expect(page.getByRole('heading', { level: 1, name: `Job at ${job.address}` })).toBeVisible();
  // The survey has no sizes, so the volume is the quick estimate and says so.
  const volume = page.getByLabel('System volume');
  await expect(volume.getByText(/^System volume \d+\.\d L$/)).toBeVisible();
  await expect(volume.getByText('Estimated', { exact: true })).toBeVisible();
  await expect(page.getByText(/^Estimated: about 10 L per single-panel equivalent/)).toBeVisible();
  await page.getByLabel('Show imperial gallons too').check();
  await expect(volume.getByText(/^System volume \d+\.\d L \(\d+\.\d gal\)$/)).toBeVisible();
  for (const dose of doses) {
    await expect(
      page.getByText(`${dose.product.name}: ${dose.packs} pack${dose.packs === 1 ? '' : 's'}`),
    ).toBeVisible();
  }
  await expect(page.getByText(/rule wins/).first()).toBeVisible();
  await expect(page.getByText(/^The van is \d+ packs? short of/)).toHaveCount(0);

  const cautions = page.getByRole('region', { name: 'Before you start' });
  await expect(cautions.getByText('Hot water and surfaces scald: let the system cool before draining.')).toBeVisible();
  await expect(cautions.getByRole('listitem')).toHaveCount(7);
  await page.screenshot({ path: testInfo.outputPath('job-plan-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the job plan');

  // Nothing was recorded, so completing asks a reason for each thing not done, and keeps them.
  await page.getByRole('button', { name: 'Complete the job' }).click();
  await expect(page.getByText(/off the van\. Complete the job\?$/)).toBeVisible();
  const reasons = page.getByRole('group', { name: 'Completion summary' }).locator('textarea[name^="reason."]');
  await expect(reasons).toHaveCount(4);
  for (const reason of await reasons.all()) await reason.fill('Booked to check the plan; the visit did not go ahead.');
  await page.getByRole('button', { name: 'Yes, complete it' }).click();

  await expect(page.getByText('Completed', { exact: true })).toBeVisible();
  const used = page.getByRole('list', { name: 'Chemicals used' });
  for (const dose of doses)
    await expect(used.getByText(`${dose.packs} × ${dose.product.name}`, { exact: false })).toBeVisible();
  await expect(page.getByText(/^Next annual check:/)).toBeVisible();
  await expect(page.getByRole('button', { name: 'Complete the job' })).toHaveCount(0);
  await page.screenshot({ path: testInfo.outputPath('job-completed-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the completed job');
});

test('booking a job: the live volume follows the radiators and pipe run as they are typed', async ({
  page,
  baseURL,
}, testInfo) => {
  const { owner, engineer } = await firmWithCrew(baseURL!);
  await createProduct(owner.session, inhibitor);
  await signIn(page, engineer.email, engineer.password);
  await page.goto('/jobs/new');
  await expect(page.getByRole('heading', { level: 1, name: 'Book a job' })).toBeVisible();
  const live = page.getByRole('status', { name: 'Live system volume' });
  // A combi boiler alone: its default heat exchanger content.
  await expect(live).toHaveText('Volume 1.0 L');

  await page.getByText('Rooms and details, one by one').click();
  await page.getByRole('button', { name: 'Add a radiator' }).click();
  await page.getByRole('button', { name: 'Add a radiator' }).click();
  const first = page.getByRole('group', { name: 'Radiator 1' });
  const second = page.getByRole('group', { name: 'Radiator 2' });
  await first.getByLabel('Room').fill('Lounge');
  await first.getByLabel('Panel type').selectOption('double');
  await second.getByLabel('Room').fill('Bedroom');
  // Unsized radiators and no pipework: the quick estimate, a double counting as two (30 L) plus the boiler.
  await expect(live).toHaveText(/^Volume 31\.0 L\s*Estimated$/);

  await first.getByLabel('Height (mm)').fill('600');
  await first.getByLabel('Length (mm)').fill('1000');
  await second.getByLabel('Or litres, if known').fill('4');
  await page.getByText('Pipework', { exact: true }).click();
  await page.getByRole('button', { name: 'Add a pipe run' }).click();
  const run = page.getByRole('group', { name: 'Pipe run 1' });
  await run.getByLabel('Tube').selectOption('22');
  await run.getByLabel('Length (m)').fill('10');
  // Measured: 6 L double panel + 4 L typed in + 10 m of 22 mm (0.3205 L/m) + 1 L heat exchanger = 14.2 L.
  await expect(live).toHaveText('Volume 14.2 L');
  await expect(page.getByLabel('System volume').getByText('Calculated from the survey', { exact: true })).toBeVisible();

  await run.getByLabel('Length (m)').fill('20');
  await expect(live).toHaveText('Volume 17.4 L');
  await page.getByRole('button', { name: 'Remove radiator 2' }).click();
  await expect(live).toHaveText('Volume 13.4 L');
  await page.screenshot({ path: testInfo.outputPath('new-job-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the new job form');

  // A customer and site added on the spot, then the job booked: the API's plan agrees with the live one.
  const customerName = `Trial household ${runId().toUpperCase()}`;
  const address = `7 Test Lane, Brackenford BF9 ${runId().slice(-3).toUpperCase()}`;
  await page.getByRole('button', { name: 'A new customer' }).click();
  await page.getByRole('group', { name: 'New customer' }).getByLabel('Customer name').fill(customerName);
  await page.getByRole('button', { name: 'Add the customer' }).click();
  await expect(page.getByText(customerName, { exact: true })).toBeVisible();
  // A new customer has no site yet, so the site form opens by itself.
  await page.getByRole('group', { name: 'New site' }).getByLabel('Site address').fill(address);
  await page.getByRole('button', { name: 'Add the site' }).click();
  await expect(page.getByRole('radio', { name: address })).toBeChecked();
  // The firm's only inhibitor is chosen to start with.
  await expect(page.getByRole('status', { name: 'The plan' }).getByText('HFL Inhibitor: 1 pack')).toBeVisible();
  await page.getByRole('button', { name: 'Book the job' }).click();

  await expect(page.getByRole('heading', { level: 1, name: `Job at ${address}` })).toBeVisible();
  const volume = page.getByLabel('System volume');
  await expect(volume.getByText('System volume 13.4 L', { exact: true })).toBeVisible();
  await expect(volume.getByText('Calculated from the survey', { exact: true })).toBeVisible();
  await expect(page.getByText('HFL Inhibitor: 1 pack')).toBeVisible();
  await expect(page.getByRole('region', { name: 'Before you start' })).toBeVisible();
});
