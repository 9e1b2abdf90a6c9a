import { callApi } from './support/api-session';
import { firmWithCrew } from './support/crew-fixtures';
import { emailLink } from './support/firm-fixtures';
import { addCustomer, addSite, bookJob } from './support/job-fixtures';
import { signIn } from './support/e2e-helpers';
import { isoDaysFromNow } from './support/stock-fixtures';
import { expect, test } from './support/fixture-test';

// Issue 15: on the job page, on a phone (390 x 844, touch), the engineer makes a quote from the job's priced lines,
// changes a line's price (typed in pounds, kept in whole pence), e-mails it, and the customer accepts on the
// engineer's phone with their name, a tick, the express request to start within the 14-day cancellation period
// (Consumer Contracts (Information, Cancellation and Additional Charges) Regulations 2013, regulation 36) and a
// drawn signature. The API then holds the quote as accepted, by phone, signed, with the express request.

test('the engineer makes, changes and sends a quote, and the customer accepts it on the phone', async ({
  browser,
  baseURL,
}) => {
  test.setTimeout(240_000);
  const crew = await firmWithCrew(baseURL!);
  const owner = crew.owner.session;
  await callApi(owner, 'put', '/api/money/settings', {
    data: {
      vatRegistered: true,
      vatNumber: 'GB 123 4567 89',
      vatRateBp: 2000,
      paymentTermsDays: 14,
      quoteValidityDays: 30,
      firstReminderDays: 7,
      secondReminderDays: 21,
    },
  });
  // A full clean priced at £90.00 plus £15.00 a radiator (the firm's own price list; invented figures).
  await callApi(owner, 'post', '/api/money/price-items', {
    status: 201,
    data: {
      kind: 'visit',
      name: 'Full clean',
      visitKind: 'full_clean',
      pricing: 'per_radiator',
      basePence: 9_000,
      perRadiatorPence: 1_500,
    },
  });
  const email = `quote-phone-${Date.now()}@customer.example`;
  const customer = await addCustomer(owner, { name: 'Morwenna Haskett', email });
  const site = await addSite(owner, customer.id, { address: '3 Tannery Lane, Brookhollow BH4 2QE' });
  const rooms = ['Lounge', 'Kitchen', 'Bedroom 1', 'Bedroom 2'];
  const booked = await bookJob(owner, {
    siteId: site.id,
    scheduledOn: isoDaysFromNow(3),
    engineerMemberId: crew.engineer.memberId,
    productIds: [],
    survey: {
      systemType: 'sealed',
      boilerKind: 'combi',
      fuel: 'gas',
      radiators: rooms.map((room) => ({ room, panel: 'double' as const })),
      pipeRuns: [],
    },
  });
  const jobId = booked.job.id;

  const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  const page = await phone.newPage();
  await signIn(page, crew.engineer.email, crew.engineer.password);
  await page.goto(`/jobs/${jobId}`);
  const section = page.getByRole('heading', { name: 'Quote', exact: true }).locator('xpath=..');
  await expect(section.getByText('No quote for this job yet.')).toBeVisible();
  const make = section.getByRole('button', { name: 'Make a quote' });
  // A finger's target: at least 48 px tall (WCAG 2.2, 2.5.8 asks 24 px; 48 px is common practice (no source)).
  expect((await make.boundingBox())!.height).toBeGreaterThanOrEqual(48);
  await make.tap();

  // £90.00 + 4 × £15.00 = £150.00; VAT at 20% £30.00; total £180.00 (VAT per line: HMRC VAT Notice 700, 17.5).
  await expect(section.getByText('Full clean, 4 radiators')).toBeVisible();
  await expect(section.getByText('£180.00')).toBeVisible();
  await expect(section.getByText('Draft', { exact: true })).toBeVisible();

  // The engineer changes the price to £162.50: net £162.50, VAT 20% £32.50, total £195.00 (arithmetic).
  await section.getByRole('button', { name: 'Change the lines' }).tap();
  const price = section.getByLabel('Unit price excl. VAT (£)');
  await expect(price).toHaveValue('150.00');
  await expect(price).toHaveAttribute('inputmode', 'decimal');
  await price.fill('162.50');
  await section.getByLabel('Description').fill('Full clean, 4 radiators, and a filter check');
  await section.getByRole('button', { name: 'Save the lines' }).tap();
  await expect(section.getByText('Full clean, 4 radiators, and a filter check')).toBeVisible();
  await expect(section.getByText('£195.00')).toBeVisible();
  await expect(section.getByRole('link', { name: 'Download the quote (PDF)' })).toHaveAttribute(
    'href',
    /^\/api\/quotes\/\d+\/quote\.pdf$/,
  );

  await section.getByRole('button', { name: 'E-mail it to the customer' }).tap();
  await expect(section.getByText('Sent', { exact: true })).toBeVisible();
  expect(await emailLink(owner, email, '/q/')).toMatch(/\/q\/[A-Za-z0-9_-]{20,}$/);

  // The customer accepts on the phone. Nothing drawn yet: refused, and nothing is accepted.
  await section.getByRole('button', { name: 'Customer accepts here' }).tap();
  const form = page.getByRole('form', { name: 'Customer accepts here' });
  await expect(form.getByLabel("The customer's name")).toHaveValue('Morwenna Haskett');
  await expect(form.getByText(/you may cancel within 14 days without giving a reason/)).toBeVisible();
  await form.getByLabel(/I accept quote/).check();
  await form.getByRole('button', { name: 'Accept the quote' }).tap();
  await expect(form.getByRole('alert')).toHaveText('The customer signs in the box.');
  await form.getByLabel(/I ask for the work to be done within the 14-day cancellation period/).check();
  const canvas = form.locator('canvas');
  await canvas.scrollIntoViewIfNeeded();
  const r = (await canvas.boundingBox())!;
  await page.mouse.move(r.x + 20, r.y + r.height * 0.7);
  await page.mouse.down();
  for (let i = 1; i <= 24; i++)
    await page.mouse.move(r.x + 20 + i * ((r.width - 40) / 24), r.y + r.height * (0.5 + 0.3 * Math.sin(i / 2)));
  await page.mouse.up();
  await expect(form.getByText('Signed. Clear it to sign again.')).toBeVisible();
  await expect(form.getByRole('alert')).toHaveCount(0);
  await form.getByRole('button', { name: 'Accept the quote' }).tap();
  await expect(section.getByText('Accepted by Morwenna Haskett')).toBeVisible();
  await expect(section.getByText(/asked for the work to be done within the 14-day cancellation period/)).toBeVisible();
  await expect(section.getByRole('button', { name: 'Customer accepts here' })).toHaveCount(0);

  const quotes = await callApi<{
    quotes: {
      status: string;
      totalPence: number;
      lines: { description: string; unitPence: number; quantity: number }[];
      acceptance: { name: string; via: string; expressRequest: boolean; hasSignature: boolean } | null;
    }[];
  }>(owner, 'get', `/api/quotes?jobId=${jobId}`);
  expect(quotes.quotes).toHaveLength(1);
  const quote = quotes.quotes[0]!;
  expect(quote.status).toBe('accepted');
  expect(quote.lines).toEqual([
    expect.objectContaining({
      description: 'Full clean, 4 radiators, and a filter check',
      quantity: 1,
      unitPence: 16_250,
    }),
  ]);
  expect(quote.totalPence).toBe(19_500);
  expect(quote.acceptance).toMatchObject({
    name: 'Morwenna Haskett',
    via: 'phone',
    expressRequest: true,
    hasSignature: true,
  });
  await phone.close();
});
