import { randomUUID } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';
import { horizontalOverflow, mainNav, runId, signIn, signInToApi } from './support/e2e-helpers';

// Demo accounts seeded by the API's db-cli (invented data); the seed books three jobs for the engineer.
const password = 'heatfleet-demo-2026';
const stores = 'stores@brackenford.example';
const engineer = 'engineer@brackenford.example';

interface PlannedDose {
  product: { id: number; name: string };
  packs: number;
  shortfall: number;
}

/**
 * Picks one of the engineer's booked demo jobs and makes sure their van holds what it needs: the demo
 * van has used its chemicals. A fresh delivery of the same amount keeps the depot's totals as seeded,
 * so the other browser tests see the stock they expect.
 */
async function prepareJob(baseURL: string) {
  const asEngineer = await signInToApi(baseURL, engineer);
  const { jobs } = (await (await asEngineer.api.get('/api/jobs')).json()) as { jobs: { id: number; status: string; customerName: string; address: string }[] };
  const job = jobs.find((j) => j.status === 'planned');
  expect(job, 'the engineer has a booked demo job').toBeDefined();
  const detail = (await (await asEngineer.api.get(`/api/jobs/${job!.id}`)).json()) as { doses: PlannedDose[]; job: { vanLocationId: number } };
  await asEngineer.api.dispose();
  expect(detail.doses.length, 'the demo job doses a cleaner and an inhibitor').toBe(2);

  const { api, csrf } = await signInToApi(baseURL, stores);
  const grid = (await (await api.get('/api/stock')).json()) as { locations: { id: number; kind: string }[] };
  const depot = grid.locations.find((l) => l.kind === 'depot');
  expect(depot, 'the demo firm has a depot').toBeDefined();
  const short = detail.doses.filter((d) => d.shortfall > 0);
  if (short.length > 0) {
    const lot = `J${runId().slice(-6).toUpperCase()}`;
    const expiresOn = new Date(Date.now() + 400 * 86_400_000).toISOString().slice(0, 10);
    const lines = short.map((d) => ({ productId: d.product.id, quantity: d.shortfall }));
    const received = await api.post('/api/stock/receipts', {
      data: { locationId: depot!.id, reference: `Job test ${lot}`, lines: lines.map((l) => ({ ...l, lotNumber: lot, expiresOn })) },
      headers: { 'X-CSRF-Token': csrf, 'Idempotency-Key': randomUUID() },
    });
    expect(received.status(), await received.text()).toBe(201);
    const moved = await api.post('/api/stock/transfers', {
      data: { fromLocationId: depot!.id, toLocationId: detail.job.vanLocationId, lines },
      headers: { 'X-CSRF-Token': csrf, 'Idempotency-Key': randomUUID() },
    });
    expect(moved.status(), await moved.text()).toBe(201);
  }
  await api.dispose();
  return { job: job!, doses: detail.doses };
}

async function expectNoOverflow(page: Page, what: string) {
  const overflow = await horizontalOverflow(page);
  expect(overflow.scrollWidth, `${what} overflows: ${overflow.widest ?? ''}`).toBeLessThanOrEqual(360);
}

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true, isMobile: true });

test('the engineer opens a booked job, reads the plan and the cautions, and completes it', async ({ page, baseURL }, testInfo) => {
  const { job, doses } = await prepareJob(baseURL!);

  await signIn(page, engineer, password);
  await mainNav(page).getByRole('link', { name: 'Jobs' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Jobs' })).toBeVisible();
  await page.screenshot({ path: testInfo.outputPath('jobs-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the jobs list');
  // The demo has a year of jobs: find this one by its address rather than paging.
  await page.getByRole('searchbox', { name: 'Find a customer or address' }).fill(job.address);
  await page.getByRole('row').filter({ hasText: job.address }).getByRole('link').click();

  await expect(page.getByRole('heading', { level: 1, name: `Job at ${job.address}` })).toBeVisible();
  // The demo survey has no sizes, so the volume is the quick estimate and says so.
  const volume = page.getByLabel('System volume');
  await expect(volume.getByText(/^System volume \d+\.\d L$/)).toBeVisible();
  await expect(volume.getByText('Estimate', { exact: true })).toBeVisible();
  await expect(page.getByText(/^Estimate: about 10 L per single-panel equivalent/)).toBeVisible();
  await page.getByLabel('Show imperial gallons too').check();
  await expect(volume.getByText(/^System volume \d+\.\d L \(\d+\.\d gal\)$/)).toBeVisible();
  for (const dose of doses) {
    await expect(page.getByText(`${dose.product.name}: ${dose.packs} pack${dose.packs === 1 ? '' : 's'}`)).toBeVisible();
  }
  await expect(page.getByText(/rule wins/).first()).toBeVisible();
  await expect(page.getByText(/short of/)).toHaveCount(0);

  const cautions = page.getByRole('region', { name: 'Before you start' });
  await expect(cautions.getByText('Hot water and surfaces scald: let the system cool before draining.')).toBeVisible();
  await expect(cautions.getByRole('listitem')).toHaveCount(7);
  await page.screenshot({ path: testInfo.outputPath('job-plan-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the job plan');

  await page.getByRole('button', { name: 'Complete the job' }).click();
  await expect(page.getByText(/off the van\. Complete the job\?$/)).toBeVisible();
  await page.getByRole('button', { name: 'Yes, complete it' }).click();

  await expect(page.getByText('Completed', { exact: true })).toBeVisible();
  const used = page.getByRole('list', { name: 'Chemicals used' });
  for (const dose of doses) await expect(used.getByText(`${dose.packs} × ${dose.product.name}`, { exact: false })).toBeVisible();
  await expect(page.getByText(/^Next annual check:/)).toBeVisible();
  await expect(page.getByRole('button', { name: 'Complete the job' })).toHaveCount(0);
  await page.screenshot({ path: testInfo.outputPath('job-completed-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the completed job');
});

test('booking a job: the live volume follows the radiators and pipe run as they are typed', async ({ page }, testInfo) => {
  await signIn(page, engineer, password);
  await page.goto('/jobs/new');
  await expect(page.getByRole('heading', { level: 1, name: 'Book a job' })).toBeVisible();
  const live = page.getByRole('status', { name: 'Live system volume' });
  // A combi boiler alone: its default heat exchanger content.
  await expect(live).toHaveText('Volume 1.0 L');

  await page.getByRole('button', { name: 'Add a radiator' }).click();
  await page.getByRole('button', { name: 'Add a radiator' }).click();
  const first = page.getByRole('group', { name: 'Radiator 1' });
  const second = page.getByRole('group', { name: 'Radiator 2' });
  await first.getByLabel('Room').fill('Lounge');
  await first.getByLabel('Panel type').selectOption('double');
  await second.getByLabel('Room').fill('Bedroom');
  // Unsized radiators and no pipework: the quick estimate, a double counting as two (30 L) plus the boiler.
  await expect(live).toHaveText(/^Volume 31\.0 L\s*Estimate$/);

  await first.getByLabel('Height (mm)').fill('600');
  await first.getByLabel('Length (mm)').fill('1000');
  await second.getByLabel('Or litres, if known').fill('4');
  await page.getByRole('button', { name: 'Add a pipe run' }).click();
  const run = page.getByRole('group', { name: 'Pipe run 1' });
  await run.getByLabel('Tube').selectOption('22');
  await run.getByLabel('Length (m)').fill('10');
  // Measured: 6 L double panel + 4 L typed in + 10 m of 22 mm (0.3205 L/m) + 1 L heat exchanger = 14.2 L.
  await expect(live).toHaveText('Volume 14.2 L');
  await expect(page.getByLabel('System volume').getByText('Measured', { exact: true })).toBeVisible();

  await run.getByLabel('Length (m)').fill('20');
  await expect(live).toHaveText('Volume 17.4 L');
  await page.getByRole('button', { name: 'Remove radiator 2' }).click();
  await expect(live).toHaveText('Volume 13.4 L');
  await page.screenshot({ path: testInfo.outputPath('new-job-360.png'), fullPage: true });
  await expectNoOverflow(page, 'the new job form');

  // A customer and site added on the spot, then the job booked: the API's plan agrees with the live one.
  const customerName = `Trial household ${runId().toUpperCase()}`;
  const address = `7 Test Lane, Brackenford BF9 ${runId().slice(-3).toUpperCase()}`;
  await page.getByLabel('Customer', { exact: true }).selectOption({ label: 'A new customer…' });
  await page.getByRole('group', { name: 'New customer' }).getByLabel('Customer name').fill(customerName);
  await page.getByRole('button', { name: 'Add the customer' }).click();
  await expect(page.getByLabel('Customer', { exact: true }).locator('option:checked')).toHaveText(customerName);
  await page.getByLabel('Site', { exact: true }).selectOption({ label: 'A new site…' });
  await page.getByRole('group', { name: 'New site' }).getByLabel('Site address').fill(address);
  await page.getByRole('button', { name: 'Add the site' }).click();
  await expect(page.getByLabel('Site', { exact: true }).locator('option:checked')).toHaveText(address);
  await page.getByLabel(/^HFL Inhibitor/).check();
  await expect(page.getByText('HFL Inhibitor: 1 pack')).toBeVisible();
  await page.getByRole('button', { name: 'Book the job' }).click();

  await expect(page.getByRole('heading', { level: 1, name: `Job at ${address}` })).toBeVisible();
  const volume = page.getByLabel('System volume');
  await expect(volume.getByText('System volume 13.4 L', { exact: true })).toBeVisible();
  await expect(volume.getByText('Measured', { exact: true })).toBeVisible();
  await expect(page.getByText('HFL Inhibitor: 1 pack')).toBeVisible();
  await expect(page.getByRole('region', { name: 'Before you start' })).toBeVisible();
});
