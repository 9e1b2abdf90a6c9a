import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { addDays, formatUkCalendarDate } from '@heatfleet/domain';
import { runReminderScan } from '@heatfleet/api/modules/reminders/reminder-scan.ts';
import { signIn, uniqueEmail, type TestApp } from './support/test-app.ts';
import { findEmails, waitForEmail } from './support/outbox.ts';
import { createReminderTestApp, seedBareFirm, startAtNoonUtc, todayOn } from './support/reminder-fixtures.ts';

let t: TestApp;
beforeAll(() => {
  t = createReminderTestApp();
});
beforeEach(() => startAtNoonUtc(t.clock));
afterAll(() => t.close());

const today = () => todayOn(t.clock);

describe('annual check reminders', () => {
  it('reminds the office of customers whose annual check falls within 30 days, once, and not when switched off', async () => {
    const firm = await seedBareFirm(t, 'annual');
    const [customerId] = (await t.deps
      .db('customers')
      .insert({ firm_id: firm.firmId, name: 'Annual Test Customer' })) as number[];
    const soon = addDays(today(), 20);
    const later = addDays(today(), 45);
    await t.deps.db('sites').insert([
      { firm_id: firm.firmId, customer_id: customerId, address: '7 Check Lane', next_check_on: soon },
      { firm_id: firm.firmId, customer_id: customerId, address: '9 Later Lane', next_check_on: later },
    ]);
    const first = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(first.reminders).toBe(1);
    // The owner and stores each get the digest (the 30-day window: common practice (no source)).
    const mail = await waitForEmail(firm.people.owner.email, { subject: /annual checks/ });
    expect(mail.text).toContain(
      `Annual Test Customer, 7 Check Lane: annual inhibitor check due on ${formatUkCalendarDate(soon)}`,
    );
    expect(mail.text).not.toContain('9 Later Lane');
    await waitForEmail(firm.people.stores.email, { subject: /annual checks/ });
    expect((await runReminderScan(t.deps, firm.firmId, t.clock.now())).reminders).toBe(0);

    const owner = await signIn(t.app, firm.people.owner.email);
    const saved = await owner.put('/api/reminder-settings', {
      scanHour: 7,
      inspectionReminders: true,
      vanReminders: true,
      annualCheckReminders: false,
    });
    expect(saved.status).toBe(200);
    await t.deps
      .db('sites')
      .where({ firm_id: firm.firmId, address: '9 Later Lane' })
      .update({ next_check_on: addDays(today(), 5) });
    expect((await runReminderScan(t.deps, firm.firmId, t.clock.now())).reminders).toBe(0);
    expect(await findEmails(firm.people.engineer.email)).toHaveLength(0);
  });

  it('tells the customer too, once, only where the firm has turned it on and the customer has an e-mail', async () => {
    const firm = await seedBareFirm(t, 'annual-customer');
    const customerEmail = uniqueEmail('householder');
    const [withEmail] = (await t.deps
      .db('customers')
      .insert({ firm_id: firm.firmId, name: 'Rowan Householder', email: customerEmail })) as number[];
    const [withoutEmail] = (await t.deps
      .db('customers')
      .insert({ firm_id: firm.firmId, name: 'No Mail Customer' })) as number[];
    const due = addDays(today(), 10);
    await t.deps.db('sites').insert([
      { firm_id: firm.firmId, customer_id: withEmail, address: '3 Sludge Row', next_check_on: due },
      { firm_id: firm.firmId, customer_id: withoutEmail, address: '5 Quiet Close', next_check_on: due },
    ]);
    const owner = await signIn(t.app, firm.people.owner.email);
    // Off by default: the office hears of both sites, the customer nothing.
    expect((await owner.get('/api/reminder-settings')).body.settings.annualCheckCustomerEmails).toBe(false);
    expect((await runReminderScan(t.deps, firm.firmId, t.clock.now())).reminders).toBe(2);
    await waitForEmail(firm.people.owner.email, { subject: /annual checks/ });
    expect(await findEmails(customerEmail)).toHaveLength(0);

    const saved = await owner.put('/api/reminder-settings', {
      scanHour: 7,
      inspectionReminders: true,
      vanReminders: true,
      annualCheckCustomerEmails: true,
    });
    expect(saved.status).toBe(200);
    // The next period (the date reset by a later check) is a new reminder, and now the customer hears of it.
    const nextDue = addDays(today(), 12);
    await t.deps.db('sites').where({ firm_id: firm.firmId }).update({ next_check_on: nextDue });
    const second = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(second.reminders).toBe(2);
    expect(second.emails).toBe(3); // owner, stores and the one customer with an e-mail
    const toCustomer = await waitForEmail(customerEmail, { subject: /yearly check is due/ });
    expect(toCustomer.text).toContain('3 Sludge Row');
    expect(toCustomer.text).not.toContain('5 Quiet Close');
    expect((await runReminderScan(t.deps, firm.firmId, t.clock.now())).emails).toBe(0);
    expect(await findEmails(customerEmail)).toHaveLength(1);
  });
});
