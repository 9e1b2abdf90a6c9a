import { callApi } from './support/api-session';
import { firmWithCrew } from './support/crew-fixtures';
import { emailLink } from './support/firm-fixtures';
import { addCustomer, addSite, bookJob } from './support/job-fixtures';
import { isoDaysFromNow } from './support/stock-fixtures';
import { expect, test } from './support/fixture-test';

// Issue 15: the customer accepts a quote from the e-mailed link, on a phone, without signing in: they see the
// lines and totals, the cancellation information and the model cancellation form (Consumer Contracts
// Regulations 2013, Schedule 3), give their name, tick, and ask for the work within the cancellation period.

test('the customer accepts a quote from the e-mailed link, with the express request', async ({ browser, baseURL }) => {
  test.setTimeout(180_000);
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
  const email = `quote-${Date.now()}@customer.example`;
  const customer = await addCustomer(owner, { name: 'Tamsin Orrell', email });
  const site = await addSite(owner, customer.id, { address: '8 Wheelwright Row, Fallowby FB2 7RU' });
  const booked = await bookJob(owner, {
    siteId: site.id,
    scheduledOn: isoDaysFromNow(3),
    engineerMemberId: crew.engineer.memberId,
    productIds: [],
    survey: { systemType: 'sealed', boilerKind: 'combi', fuel: 'gas', radiators: [], pipeRuns: [] },
  });
  const quote = await callApi<{ id: number; number: string }>(crew.engineer.session, 'post', '/api/quotes', {
    status: 201,
    data: {
      jobId: booked.job.id,
      lines: [
        { kind: 'visit', description: 'Full clean, 7 radiators', quantity: 1, unitPence: 25_500 },
        { kind: 'extra', description: 'Filter fitted', quantity: 1, unitPence: 4_500 },
      ],
    },
  });
  await callApi(crew.engineer.session, 'post', `/api/quotes/${quote.id}/send`, { status: 200 });
  const link = await emailLink(owner, email, '/q/');

  const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  const page = await phone.newPage();
  await page.goto(new URL(link).pathname);
  await expect(page.getByText(new RegExp(`^Quote ${quote.number} for Tamsin Orrell`))).toBeVisible();
  // £255 + £45 = £300.00; VAT at 20% £60.00; total £360.00 (VAT per line: HMRC VAT Notice 700, para 17.5).
  await expect(page.getByText('£360.00')).toBeVisible();
  await expect(page.getByText('Model cancellation form', { exact: true })).toBeVisible();
  await expect(page.getByText(/within 14 days without giving any reason/)).toBeVisible();
  await page.getByRole('button', { name: 'Accept the quote' }).click();
  // Nothing given: the answer is refused and shown beside the form; nothing is accepted.
  await expect(page.getByRole('alert')).toBeVisible();
  await page.getByLabel('Your name').fill('Tamsin Orrell');
  await page.getByLabel(/I accept quote/).check();
  await page.getByLabel(/I ask for the work to be done within the 14-day cancellation period/).check();
  await page.getByRole('button', { name: 'Accept the quote' }).click();
  await expect(page.getByText('Thank you: the quote is accepted')).toBeVisible();
  await expect(page.getByText('You asked for the work to be done within the cancellation period.')).toBeVisible();

  const after = await callApi<{ status: string; acceptance: { name: string; via: string; expressRequest: boolean } }>(
    owner,
    'get',
    `/api/quotes/${quote.id}`,
  );
  expect(after.status).toBe('accepted');
  expect(after.acceptance).toMatchObject({ name: 'Tamsin Orrell', via: 'link', expressRequest: true });
  await phone.close();
});
