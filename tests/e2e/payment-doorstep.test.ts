import { completionCodes, type JobDetail } from '@heatfleet/domain';
import { callApi } from './support/api-session';
import { firmWithCrew } from './support/crew-fixtures';
import { signIn } from './support/e2e-helpers';
import { addCustomer, addSite, bookJob } from './support/job-fixtures';
import { isoDaysFromNow } from './support/stock-fixtures';
import { expect, test } from './support/fixture-test';

// Issue 15: an engineer completes a job, the customer pays on the payment service's hosted page (the local stand-in,
// packages/payfake) from the QR link on the engineer's phone, the invoice shows paid within seconds, and an owner
// refunds part of it. The test card numbers are the service's published test cards (4242... pays).

test('the customer pays on the doorstep from the QR link; the owner refunds part', async ({ browser, baseURL }) => {
  test.setTimeout(300_000);
  const crew = await firmWithCrew(baseURL!);
  const owner = crew.owner.session;

  // The owner connects the firm's own payment account from Settings, on the service's onboarding page.
  const ownerPage = await browser.newPage();
  await signIn(ownerPage, crew.owner.email, crew.owner.password);
  await ownerPage.goto('/settings/payments');
  await expect(ownerPage.getByText('Not connected')).toBeVisible();
  await ownerPage.getByRole('button', { name: 'Connect payment account' }).click();
  await ownerPage.getByRole('button', { name: 'Agree and finish set-up' }).click();
  await ownerPage.waitForURL(/\/settings\/payments\?returned=1/);
  await expect(ownerPage.getByText('Card payments are on')).toBeVisible();

  // A job booked for the engineer, completed by them.
  const customer = await addCustomer(owner, { name: 'Maris Quillon', email: 'maris@customer.example' });
  const site = await addSite(owner, customer.id, { address: '3 Orchard Rise, Fallowby FB4 2QT' });
  const booked = await bookJob(owner, {
    siteId: site.id,
    scheduledOn: isoDaysFromNow(0),
    engineerMemberId: crew.engineer.memberId,
    productIds: [],
    survey: {
      systemType: 'sealed',
      boilerKind: 'combi',
      fuel: 'gas',
      radiators: [{ room: 'Hall', panel: 'double' }],
      pipeRuns: [],
    },
  });
  await callApi<JobDetail>(crew.engineer.session, 'post', `/api/jobs/${booked.job.id}/complete`, {
    status: 200,
    data: { confirmations: completionCodes.map((code) => ({ code, reason: 'Shown in the payments test only' })) },
  });
  // The office invoices the completed job (the money module: a draft from the job, its line, then issued).
  const draft = await callApi<{ id: number }>(owner, 'post', '/api/invoices', { data: { jobId: booked.job.id } });
  await callApi(owner, 'put', `/api/invoices/${draft.id}/lines`, {
    data: { lines: [{ kind: 'other', description: 'System clean, one radiator', quantity: 1, unitPence: 18_000 }] },
  });
  await callApi(owner, 'post', `/api/invoices/${draft.id}/issue`, { status: 200 });

  // On the doorstep: the engineer's phone shows the pay QR code.
  const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  const engineerPage = await phone.newPage();
  await signIn(engineerPage, crew.engineer.email, crew.engineer.password);
  await engineerPage.goto(`/invoices/${draft.id}/payment`);
  await expect(engineerPage.getByTestId('invoice-state')).toHaveText('Issued');
  await engineerPage.getByRole('button', { name: /Show pay QR code/ }).click();
  await expect(engineerPage.getByRole('img', { name: /QR code/ })).toBeVisible();
  const payLink = await engineerPage.getByTestId('pay-link').getAttribute('href');
  expect(payLink).toMatch(/\/pay\/[A-Za-z0-9_-]{40,}\?from=doorstep$/);

  // The customer's own phone opens what the QR code holds and pays on the hosted page.
  const customerPhone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true });
  const customerPage = await customerPhone.newPage();
  await customerPage.goto(payLink!);
  await expect(customerPage.getByTestId('due')).toHaveText('£180.00');
  await customerPage.getByRole('button', { name: 'Pay £180.00 by card' }).click();
  await customerPage.waitForURL(/\/c\/pay\/cs_test_/);
  await customerPage.getByLabel('Card number').fill('4242 4242 4242 4242');
  await customerPage.getByRole('button', { name: 'Pay £180.00' }).click();
  await expect(customerPage.getByText('Paid. Thank you.')).toBeVisible({ timeout: 15_000 });

  // The engineer's screen follows by itself.
  await expect(engineerPage.getByTestId('invoice-state')).toHaveText('Paid', { timeout: 10_000 });
  await expect(engineerPage.getByText('£180.00: Paid')).toBeVisible();
  // Engineers may show the QR code but not refund.
  await expect(engineerPage.getByText('Refund…')).toHaveCount(0);

  // The owner refunds part of it.
  await ownerPage.goto(`/invoices/${draft.id}/payment`);
  await ownerPage.getByText('Refund…').click();
  await ownerPage.getByLabel('Amount to refund (£)').fill('30.00');
  await ownerPage.getByLabel('Reason (optional)').fill('Towel rail valve left for next visit');
  await ownerPage.getByRole('button', { name: 'Refund', exact: true }).click();
  await expect(ownerPage.getByText('Refunded £30.00.')).toBeVisible();
  await expect(ownerPage.getByTestId('invoice-state')).toHaveText('Part paid');
  await expect(ownerPage.getByTestId('invoice-due')).toHaveText('£30.00');
  await expect(ownerPage.getByText('£180.00: Paid, £30.00 refunded')).toBeVisible();

  // The owner's home shows the money owed (the £30.00 refunded is due again, invoiced today: 0 to 30 days).
  await ownerPage.goto('/');
  const money = ownerPage.getByRole('region', { name: 'Money owed' });
  await expect(money.locator('dd').first()).toHaveText('£30.00');
  await expect(money.locator('dd').nth(1)).toHaveText('£30.00');

  await phone.close();
  await customerPhone.close();
});
