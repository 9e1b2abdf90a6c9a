import { completionCodes, type JobDetail } from '@heatfleet/domain';
import { callApi } from './support/api-session';
import { firmWithCrew } from './support/crew-fixtures';
import { signIn } from './support/e2e-helpers';
import { addCustomer, addSite, bookJob } from './support/job-fixtures';
import { isoDaysFromNow } from './support/stock-fixtures';
import { expect, test } from './support/fixture-test';

// Issue 15: on a phone, the owner sets the firm VAT registered at the standard rate and prices a full clean on
// Settings, Prices; a completed job's invoice is made from that price and issued from the invoice's own page, which
// then shows its number and no longer offers its lines for editing (an issued invoice never changes).

interface PriceList {
  settings: { vatRegistered: boolean; vatNumber: string | null; vatRateBp: number; invoiceOnCompletion: boolean };
  items: Array<{ name: string; pricing: string | null; basePence: number; perRadiatorPence: number }>;
}

test('the owner sets VAT and a visit price, then issues an invoice from its page', async ({ browser, baseURL }) => {
  test.setTimeout(240_000);
  const crew = await firmWithCrew(baseURL!);
  const owner = crew.owner.session;
  const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  const page = await phone.newPage();
  await signIn(page, crew.owner.email, crew.owner.password);

  // Settings, Prices: VAT registered at 20%, invoices made by hand (so completion does not issue one itself).
  await page.goto('/settings');
  await page.getByRole('link', { name: 'Prices', exact: true }).click();
  await page.getByLabel('Registered for VAT', { exact: true }).check();
  await page.getByLabel('VAT number', { exact: true }).fill('GB 123 4567 89');
  await page.getByLabel('VAT rate (%)', { exact: true }).fill('20');
  await page.getByLabel(/Invoice on completion/).uncheck();
  await page.getByRole('button', { name: 'Save money settings' }).click();
  await expect(page.getByText('Money settings saved.')).toBeVisible();

  // A full clean priced £60.00 + £12.50 a radiator, typed in pounds and pence.
  await page.getByRole('button', { name: 'Add a price' }).click();
  await page.getByLabel('Name', { exact: true }).fill('Full clean');
  await page.getByLabel('Base price (£)').fill('60');
  await page.getByLabel('Per radiator (£)').fill('12.50');
  await expect(page.getByLabel('Per radiator (£)')).toHaveAttribute('inputmode', 'decimal');
  await page.getByRole('button', { name: 'Add price' }).click();
  await expect(page.getByText('Full clean: £60.00 + £12.50 a radiator')).toBeVisible();

  const prices = await callApi<PriceList>(owner, 'get', '/api/money/prices');
  // The UK standard rate, 20% since 4 January 2011 (Value Added Tax Act 1994, section 2, as amended).
  expect(prices.settings).toMatchObject({
    vatRegistered: true,
    vatNumber: 'GB123456789',
    vatRateBp: 2000,
    invoiceOnCompletion: false,
  });
  // Whole pence: "12.50" is 1250 pence, "60" is 6000.
  expect(prices.items).toEqual([
    expect.objectContaining({ name: 'Full clean', pricing: 'per_radiator', basePence: 6000, perRadiatorPence: 1250 }),
  ]);

  // A job with two radiators, booked and completed by the engineer; the office makes its draft invoice (the API).
  const customer = await addCustomer(owner, { name: 'Perrin Ashdown', email: 'perrin@customer.example' });
  const site = await addSite(owner, customer.id, { address: '11 Tanner Close, Fallowby FB3 8LN' });
  const booked = await bookJob(owner, {
    siteId: site.id,
    scheduledOn: isoDaysFromNow(0),
    engineerMemberId: crew.engineer.memberId,
    productIds: [],
    survey: {
      systemType: 'sealed',
      boilerKind: 'combi',
      fuel: 'gas',
      radiators: [
        { room: 'Hall', panel: 'double' },
        { room: 'Kitchen', panel: 'single' },
      ],
      pipeRuns: [],
    },
  });
  await callApi<JobDetail>(crew.engineer.session, 'post', `/api/jobs/${booked.job.id}/complete`, {
    status: 200,
    data: { confirmations: completionCodes.map((code) => ({ code, reason: 'Shown in the prices test only' })) },
  });
  const draft = await callApi<{ id: number }>(owner, 'post', '/api/invoices', { data: { jobId: booked.job.id } });

  // From the Money page's list to the invoice's own page.
  await page.goto('/money');
  await page.getByRole('link', { name: 'Draft', exact: true }).click();
  await page.waitForURL(`**/invoices/${draft.id}`);
  // £60.00 + 2 × £12.50 = £85.00 net; VAT at 20% £17.00 (per line, half a penny up: HMRC VAT Notice 700,
  // paragraph 17.5); total £102.00.
  await expect(page.getByTestId('invoice-total')).toHaveText('£102.00');
  await expect(page.getByLabel('Line 1', { exact: true })).toBeEditable();

  await page.getByRole('button', { name: 'Issue invoice' }).click();
  await expect(page.getByText('An issued invoice cannot be changed')).toBeVisible();
  await page.getByRole('button', { name: 'Yes, issue it' }).click();
  await expect(page.getByTestId('invoice-state')).toHaveText('Issued');

  const issued = await callApi<{ number: string; status: string }>(owner, 'get', `/api/invoices/${draft.id}`);
  expect(issued.status).toBe('issued');
  await expect(page.getByTestId('invoice-number')).toHaveText(issued.number);
  await expect(page.getByRole('heading', { name: `Invoice ${issued.number}` })).toBeVisible();
  // No editing once issued: the line boxes and the save are gone, and the API refuses a change (409).
  await expect(page.getByLabel('Line 1', { exact: true })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Save lines' })).toHaveCount(0);
  await expect(page.getByText('Issued: these lines never change.')).toBeVisible();
  await callApi(owner, 'put', `/api/invoices/${draft.id}/lines`, {
    status: 409,
    data: { lines: [{ kind: 'other', description: 'Changed after issue', quantity: 1, unitPence: 100 }] },
  });
  await phone.close();
});
