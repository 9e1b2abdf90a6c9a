import type { MarketingSuppression, OutboxMessage, OutboxMessageSummary } from '@heatfleet/domain';
import { callApi, type ApiSession } from './support/api-session';
import { runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { signUpFirm } from './support/firm-fixtures';
import { addCustomer, addSite } from './support/job-fixtures';
import { createProduct, isoDaysFromNow } from './support/stock-fixtures';

// The yearly check e-mail offers a paid visit, so it is direct marketing by e-mail: each one carries a simple,
// free means of refusing, and once refused no more is sent (Privacy and Electronic Communications (EC Directive)
// Regulations 2003, regulation 22(2) and 22(3)(c)). The link needs no sign-in and opening it changes nothing;
// one tap unsubscribes, and the office sees the address on Settings.

test.describe.configure({ timeout: 180_000 });

test.use({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });

async function messagesTo(session: ApiSession, to: string): Promise<OutboxMessageSummary[]> {
  const { messages } = await callApi<{ messages: OutboxMessageSummary[] }>(session, 'get', '/api/outbox');
  return messages.filter((m) => m.to.some((t) => t.toLowerCase() === to));
}

/**
 * A failed inhibitor check dated `daysAgo` days back sets the site's next check a month after it (DEVELOPERS.md,
 * Product rules), so it falls inside the 30 days the reminder scan looks ahead: the firm's API has no other way
 * to set a site's next check date.
 */
async function failedCheck(session: ApiSession, siteId: number, productId: number, daysAgo: number) {
  await callApi(session, 'post', `/api/sites/${siteId}/checks`, {
    data: {
      checkedOn: isoDaysFromNow(-daysAgo),
      inhibitorProductId: productId,
      inhibitorReading: 10,
      emailCustomer: false,
    },
  });
}

test('a customer opens the reminder e-mail’s link without signing in, unsubscribes with one tap, and the office sees it', async ({
  browser,
  page,
  baseURL,
}) => {
  const firm = await signUpFirm(baseURL!);
  const owner = firm.owner.session;
  const tag = runId();
  const customerEmail = `householder-${tag}@customer.example`;
  const masked = `h•••@customer.example`;
  const inhibitor = await createProduct(owner, {
    name: `Reminder inhibitor ${tag.slice(-5)}`,
    kind: 'inhibitor',
    packSize: 500,
    packUnit: 'ml',
    targetMin: 100,
    targetMax: 300,
    targetUnit: 'ppm',
  });
  const customer = await addCustomer(owner, { name: 'Ivo Penhallow', email: customerEmail });
  const site = await addSite(owner, customer.id, { address: '4 Foundry Yard, Carnwethers', postcode: 'CW4 9FY' });
  await failedCheck(owner, site.id, inhibitor.id, 10);
  await callApi(owner, 'put', '/api/reminder-settings', {
    data: { scanHour: 7, inspectionReminders: true, vanReminders: true, annualCheckCustomerEmails: true },
  });
  await callApi(owner, 'post', '/api/reminders/scan', { status: 200 });

  await expect
    .poll(async () => (await messagesTo(owner, customerEmail)).find((m) => /yearly check is due/.test(m.subject)), {
      message: `the yearly check e-mail to ${customerEmail}`,
      timeout: 30_000,
    })
    .toBeDefined();
  const [summary] = (await messagesTo(owner, customerEmail)).filter((m) => /yearly check is due/.test(m.subject));
  const offer = (await callApi<{ message: OutboxMessage }>(owner, 'get', `/api/outbox/${summary!.id}`)).message;
  expect(offer.text).toMatch(/To stop these e-mails from .+, open this link \(no sign-in needed\)/);
  const link = offer.links.find((l) => new URL(l).pathname.startsWith('/unsubscribe/'));
  expect(link, 'an unsubscribe link in the e-mail').toBeDefined();

  // The customer: a browser that has never signed in to the app.
  const customerContext = await browser.newContext({
    viewport: { width: 390, height: 844 },
    hasTouch: true,
    isMobile: true,
    locale: 'en-GB',
  });
  const phone = await customerContext.newPage();
  await test.step('opening the link shows the firm and the masked address, and changes nothing', async () => {
    await phone.goto(new URL(link!).pathname);
    await expect(
      phone.getByText(`Stop e-mails from ${firm.name} offering your heating system’s yearly check`),
    ).toBeVisible();
    await expect(phone.getByText(masked, { exact: true })).toBeVisible();
    await expect(phone.getByText(customerEmail)).toHaveCount(0);
    // No sign-in was asked for, and none exists in this browser.
    await expect(phone.getByRole('navigation', { name: 'Main' })).toHaveCount(0);
    const { suppressions } = await callApi<{ suppressions: MarketingSuppression[] }>(
      owner,
      'get',
      '/api/marketing-suppressions',
    );
    expect(suppressions).toEqual([]);
  });

  await test.step('one tap unsubscribes', async () => {
    const button = phone.getByRole('button', { name: 'Unsubscribe' });
    expect((await button.boundingBox())!.height).toBeGreaterThanOrEqual(48); // DEVELOPERS.md: 48 px targets
    await button.tap();
    await expect(phone.getByText('You are unsubscribed')).toBeVisible();
    await expect(phone.getByText(`${firm.name} will not send reminder offers to ${masked} again.`)).toBeVisible();
    // Opened again later: still unsubscribed, no button to tap.
    await phone.reload();
    await expect(phone.getByText('You are unsubscribed')).toBeVisible();
    await expect(phone.getByRole('button', { name: 'Unsubscribe' })).toHaveCount(0);
    await customerContext.close();
  });

  await test.step('the office sees the address on Settings, from the e-mail', async () => {
    const { suppressions } = await callApi<{ suppressions: MarketingSuppression[] }>(
      owner,
      'get',
      '/api/marketing-suppressions',
    );
    expect(suppressions).toEqual([expect.objectContaining({ email: customerEmail, source: 'unsubscribe_link' })]);
    await signIn(page, firm.owner.email, firm.owner.password);
    await page.goto('/settings');
    const list = page.getByRole('list', { name: 'Addresses not sent offers' });
    await expect(list.getByRole('listitem')).toHaveCount(1);
    await expect(list).toContainText(customerEmail);
    await expect(list).toContainText('Unsubscribed from an e-mail');
  });

  await test.step('the next reminder for the site reaches the office, not the customer', async () => {
    // Another failed check moves the next check date: a new reminder period.
    await failedCheck(owner, site.id, inhibitor.id, 5);
    const { sent } = await callApi<{ sent: number }>(owner, 'post', '/api/reminders/scan', { status: 200 });
    expect(sent).toBeGreaterThanOrEqual(1);
    await expect
      .poll(async () => (await messagesTo(owner, firm.owner.email)).filter((m) => /check/i.test(m.subject)).length, {
        timeout: 30_000,
      })
      .toBeGreaterThanOrEqual(2);
    expect((await messagesTo(owner, customerEmail)).filter((m) => /yearly check/.test(m.subject))).toHaveLength(1);
  });
});
