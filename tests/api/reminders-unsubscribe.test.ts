import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { addDays, formatUkCalendarDate } from '@heatfleet/domain';
import { runReminderScan } from '@heatfleet/api/modules/reminders/reminder-scan.ts';
import { Client, signIn, uniqueEmail, type TestApp } from './support/test-app.ts';
import { findEmails, linkIn, tokenFrom, waitForEmail } from './support/outbox.ts';
import {
  createReminderTestApp,
  seedBareFirm,
  startAtNoonUtc,
  todayOn,
  type ReminderFirm,
} from './support/reminder-fixtures.ts';

// The customer's annual check e-mail offers a paid visit, so it is direct marketing by e-mail. The Privacy and
// Electronic Communications (EC Directive) Regulations 2003, regulation 22(3)(c): the recipient is given "a simple
// means of refusing (free of charge except for the costs of the transmission of the refusal) the use of his contact
// details for the purposes of such direct marketing ... at the time of each subsequent communication"; once
// refused, no more is sent (regulation 22(2)). Issue 14 asks for a link needing no sign-in, a long single-purpose
// token, and a suppression list the sender honours.

let t: TestApp;
beforeAll(() => {
  t = createReminderTestApp();
});
beforeEach(() => startAtNoonUtc(t.clock));
afterAll(() => t.close());

const today = () => todayOn(t.clock);

async function firmWithCustomer(label: string, customerEmail: string) {
  const firm = await seedBareFirm(t, label);
  const [customerId] = (await t.deps
    .db('customers')
    .insert({ firm_id: firm.firmId, name: 'Ivo Penhallow', email: customerEmail })) as number[];
  await t.deps.db('sites').insert({
    firm_id: firm.firmId,
    customer_id: customerId,
    address: '4 Foundry Yard',
    next_check_on: addDays(today(), 10),
  });
  const owner = await signIn(t.app, firm.people.owner.email);
  const saved = await owner.put('/api/reminder-settings', {
    scanHour: 7,
    inspectionReminders: true,
    vanReminders: true,
    annualCheckCustomerEmails: true,
  });
  expect(saved.status).toBe(200);
  return { firm, owner };
}

/** A later period of the same site (as a check would set): a new reminder, so a new customer e-mail is due. */
async function nextPeriod(firm: ReminderFirm, days: number) {
  await t.deps
    .db('sites')
    .where({ firm_id: firm.firmId })
    .update({ next_check_on: addDays(today(), days) });
  return runReminderScan(t.deps, firm.firmId, t.clock.now());
}

describe('unsubscribing from the customer reminder e-mails', () => {
  it('each e-mail carries its own unsubscribe link; one click without signing in stops the next one', async () => {
    const customerEmail = uniqueEmail('unsub-householder');
    const { firm, owner } = await firmWithCustomer('unsub', customerEmail);

    expect((await runReminderScan(t.deps, firm.firmId, t.clock.now())).emails).toBe(3); // owner, stores, customer
    const first = await waitForEmail(customerEmail, { subject: /yearly check is due/ });
    // A UK date, not an ISO day (issue 14).
    expect(first.text).toContain(`due its yearly inhibitor check on ${formatUkCalendarDate(addDays(today(), 10))}`);
    expect(first.text).toMatch(/To stop these e-mails from .+, open this link \(no sign-in needed\)/);
    const link = linkIn(first, '/unsubscribe/');
    const token = tokenFrom(link);
    // 32 random bytes, base64url (lib/tokens.ts): long enough that it cannot be guessed.
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(first.html).toContain(link);

    // Somebody not signed in at all: only a CSRF token of an anonymous session.
    const stranger = new Client(t.app);
    const preview = await stranger.get(`/api/unsubscribe/${token}`).expect(200);
    expect(preview.body.unsubscribe).toEqual({
      firmName: expect.any(String),
      maskedEmail: `${customerEmail[0]}•••${customerEmail.slice(customerEmail.indexOf('@'))}`,
      unsubscribed: false,
    });
    const done = await stranger.post(`/api/unsubscribe/${token}`);
    expect(done.status).toBe(200);
    expect(done.body.unsubscribe.unsubscribed).toBe(true);
    // Again: the same answer, one row on the list.
    expect((await stranger.post(`/api/unsubscribe/${token}`)).status).toBe(200);
    const rows = await t.deps.db('marketing_suppressions').where({ firm_id: firm.firmId });
    expect(rows).toHaveLength(1);
    expect(rows[0].email).toBe(customerEmail.toLowerCase());
    expect((await stranger.get(`/api/unsubscribe/${token}`).expect(200)).body.unsubscribe.unsubscribed).toBe(true);

    // The office sees the list.
    const list = await owner.get('/api/marketing-suppressions').expect(200);
    expect(list.body.suppressions).toEqual([
      expect.objectContaining({ email: customerEmail.toLowerCase(), source: 'unsubscribe_link' }),
    ]);

    // The next period: the office is still told, the customer is not e-mailed.
    const second = await nextPeriod(firm, 12);
    expect(second.reminders).toBe(1);
    expect(second.emails).toBe(2);
    await new Promise((r) => setTimeout(r, 1000));
    expect(await findEmails(customerEmail)).toHaveLength(1);
  });

  it('honours the list whatever the case of the address, and only for the firm it was given to', async () => {
    const customerEmail = uniqueEmail('unsub-case');
    const { firm } = await firmWithCustomer('unsub-case', customerEmail);
    await t.deps
      .db('marketing_suppressions')
      .insert({ firm_id: firm.firmId, email: customerEmail.toLowerCase(), source: 'office' });
    await t.deps.db('customers').where({ firm_id: firm.firmId }).update({ email: customerEmail.toUpperCase() });
    const scan = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(scan.reminders).toBe(1);
    expect(scan.emails).toBe(2); // owner and stores only
    expect(await t.deps.db('unsubscribe_tokens').where({ firm_id: firm.firmId })).toHaveLength(0);

    // Another firm the same person deals with has its own list: its e-mail still goes, with its own link.
    const other = await firmWithCustomer('unsub-case-other', customerEmail);
    expect((await runReminderScan(t.deps, other.firm.firmId, t.clock.now())).emails).toBe(3);
    const theirs = await waitForEmail(customerEmail, { subject: /yearly check is due/ });
    expect(linkIn(theirs, '/unsubscribe/')).toMatch(/\/unsubscribe\/[A-Za-z0-9_-]{43}$/);
  });

  it('the office adds an address a customer asked by phone to drop; the next offer is not sent to it', async () => {
    const customerEmail = uniqueEmail('unsub-office');
    const { firm, owner } = await firmWithCustomer('unsub-office', customerEmail);
    const bad = await owner.post('/api/marketing-suppressions', { email: 'not an address' });
    expect(bad.status).toBe(422);
    expect(bad.body.message).toContain('"not an address" is not an e-mail address.');
    expect(await t.deps.db('marketing_suppressions').where({ firm_id: firm.firmId })).toHaveLength(0);

    const added = await owner.post('/api/marketing-suppressions', { email: `  ${customerEmail.toUpperCase()} ` });
    expect(added.status).toBe(200);
    expect(added.body.suppression).toEqual(
      expect.objectContaining({ email: customerEmail.toLowerCase(), source: 'office' }),
    );
    // Again: one row, as it was.
    expect((await owner.post('/api/marketing-suppressions', { email: customerEmail })).body.suppression.id).toBe(
      added.body.suppression.id,
    );
    expect(await t.deps.db('marketing_suppressions').where({ firm_id: firm.firmId })).toHaveLength(1);

    const scan = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(scan.reminders).toBe(1);
    expect(scan.emails).toBe(2); // owner and stores; not the customer
    await new Promise((r) => setTimeout(r, 500));
    expect(await findEmails(customerEmail)).toHaveLength(0);
  });

  it('answers 404 for a link that does not exist and keeps the list from engineers', async () => {
    const stranger = new Client(t.app);
    const made = await stranger.post(`/api/unsubscribe/${'q'.repeat(43)}`);
    expect(made.status).toBe(404);
    expect(made.body.message).toMatch(/unsubscribe link/i);
    expect((await stranger.get('/api/unsubscribe/short')).status).toBe(422);
    const firm = await seedBareFirm(t, 'unsub-roles');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    expect((await engineer.get('/api/marketing-suppressions')).status).toBe(403);
    expect((await engineer.post('/api/marketing-suppressions', { email: 'a@example.test' })).status).toBe(403);
  });
});
