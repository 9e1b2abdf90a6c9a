import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { addDays, formatUkCalendarDate, VAN_DUE_WINDOW_DAYS } from '@heatfleet/domain';
import { startReminderWorker } from '@heatfleet/api/jobs/reminder-worker.ts';
import { runReminderScan } from '@heatfleet/api/modules/reminders/reminder-scan.ts';
import { signIn, type TestApp } from './support/test-app.ts';
import { waitForEmail } from './support/outbox.ts';
import {
  addCheckIns,
  addInspection,
  addItem,
  addKind,
  addVan,
  createReminderTestApp,
  DAY_MS,
  seedBareFirm,
  seedFleetFirm,
  startAtNoonUtc,
  todayOn,
} from './support/reminder-fixtures.ts';
import { digestKeys, onlyEmailTo, reminderEmailsTo, settle, waitFor } from './support/reminder-mail.ts';

let t: TestApp;
beforeAll(() => {
  t = createReminderTestApp();
});
beforeEach(() => startAtNoonUtc(t.clock));
afterAll(() => t.close());

const today = () => todayOn(t.clock);

/** The fleet firm after its first scan: six reminders, each e-mailed once (the first case checks them). */
async function seedScannedFleetFirm() {
  const fleet = await seedFleetFirm(t);
  await runReminderScan(t.deps, fleet.firm.firmId, t.clock.now());
  return fleet;
}

describe('service-due reminders', () => {
  it('sends the office one digest of everything due and each engineer a digest of their own van', async () => {
    const { firm, ids, seededOn } = await seedFleetFirm(t);
    const result = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(result).toEqual({ reminders: 6, emails: 4, ran: true });

    const office = ['RT-H1', 'RT-H2', 'RT-M1', 'RT-T1', 'Van-North MOT', 'Van-South service'];
    for (const person of [firm.people.owner, firm.people.stores]) {
      const digest = await onlyEmailTo(person.email, /reminder/);
      expect(digestKeys(digest)).toEqual(office);
      expect(digest.subject).toContain(firm.firmName);
    }
    const north = await onlyEmailTo(firm.people.engineer.email, /reminder/);
    expect(digestKeys(north)).toEqual(['RT-H1', 'RT-M1', 'Van-North MOT']);
    expect(north.text).toContain(`Van-North (RT11 NRT): MOT due on ${formatUkCalendarDate(addDays(seededOn, 10))}`);
    // 30 days ahead for MOT and service: common practice (no source).
    expect(VAN_DUE_WINDOW_DAYS).toBe(30);
    expect(north.text).toContain(
      `RT-H1 (Hose set, on Van-North): inspection overdue since ${formatUkCalendarDate(addDays(seededOn, -10))}`,
    );
    expect(north.text).toContain(
      'RT-M1 (Magnet set, on Van-North): inspection overdue: used 3 times since the last one (rule: every 3 uses)',
    );
    const south = await onlyEmailTo(firm.target.email, /reminder/);
    expect(digestKeys(south)).toEqual(['RT-H2', 'Van-South service']);
    expect(south.text).toContain(
      `RT-H2 (Hose set, on Van-South): inspection due by ${formatUkCalendarDate(addDays(seededOn, 5))}`,
    );
    expect(south.text).toContain(
      `Van-South (RT22 STH): service overdue since ${formatUkCalendarDate(addDays(seededOn, -3))}`,
    );
    // The Admin manages settings but is not on the digest: Owner and Stores are the ones who watch stock and kit.
    expect(await reminderEmailsTo(firm.people.admin.email)).toHaveLength(0);

    const periods = await t.deps
      .db('reminders')
      .where({ firm_id: firm.firmId })
      .orderBy('id')
      .select('kind', 'subject_type', 'subject_id', 'period_key');
    expect(periods).toEqual(
      expect.arrayContaining([
        { kind: 'inspection_due', subject_type: 'kit_item', subject_id: ids.h1, period_key: addDays(seededOn, -10) },
        { kind: 'inspection_due', subject_type: 'kit_item', subject_id: ids.m1, period_key: 'uses:0' },
        { kind: 'mot_due', subject_type: 'van', subject_id: ids.north, period_key: addDays(seededOn, 10) },
      ]),
    );
    expect(await t.deps.db('reminder_deliveries').where({ firm_id: firm.firmId }).count({ n: '*' })).toEqual([
      { n: 6 + 6 + 3 + 2 },
    ]);
  });

  it('lists what was sent to whom on the Reminders page, for Owner, Admin and Stores only', async () => {
    const { firm, ids } = await seedScannedFleetFirm();
    const stores = await signIn(t.app, firm.people.stores.email);
    const res = await stores.get('/api/reminders').expect(200);
    const reminders = res.body.reminders as {
      recipient: string;
      summary: string;
      kind: string;
      subjectType: string;
      subjectId: number;
      sentAt: string | null;
    }[];
    expect(reminders).toHaveLength(17);
    expect(reminders).toContainEqual(
      expect.objectContaining({
        recipient: firm.people.engineer.email,
        kind: 'mot_due',
        subjectType: 'van',
        subjectId: ids.north,
      }),
    );
    expect(
      reminders
        .filter((r) => r.recipient === firm.people.engineer.email)
        .map((r) => r.summary)
        .sort(),
    ).toEqual(
      expect.arrayContaining([
        expect.stringContaining('RT-H1'),
        expect.stringContaining('RT-M1'),
        expect.stringContaining('Van-North'),
      ]),
    );
    await waitFor('every digest marked sent', async () => {
      const again = await stores.get('/api/reminders').expect(200);
      return (again.body.reminders as { sentAt: string | null }[]).every((r) => r.sentAt !== null) ? true : undefined;
    });
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await engineer.get('/api/reminders').expect(403);
  });

  it('sends nothing twice: a second scan, the sweep at worker start and a restarted worker', async () => {
    const { firm, seededOn } = await seedScannedFleetFirm();
    const again = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(again).toEqual({ reminders: 0, emails: 0, ran: true });

    // A worker starting up runs the sweep at once; it scans the firm (its scan hour has come) and finds nothing new.
    const first = startReminderWorker({
      env: t.deps.env,
      db: t.deps.db,
      logger: t.deps.logger,
      clock: t.clock,
      firmIds: [firm.firmId],
    });
    try {
      await first.ready;
      const schedulers = await first.queue.getJobSchedulers();
      expect(schedulers.find((s) => s.key === 'reminder-sweep')).toMatchObject({
        pattern: '0 * * * *',
        tz: 'Europe/London',
      });
      await waitFor('the start-up sweep to mark today scanned', async () => {
        const row = await t.deps.db('reminder_settings').where({ firm_id: firm.firmId }).first('last_scan_on');
        return row?.last_scan_on === today() ? true : undefined;
      });
    } finally {
      await first.close();
    }

    // The worker was down for a day; meanwhile a van was added whose MOT is 5 days off.
    t.clock.advance(DAY_MS);
    const east = await addVan(t, firm, {
      name: 'Van-East',
      registration: 'RT33 EST',
      engineerMemberId: firm.people.engineer.memberId,
      motDueOn: addDays(seededOn, 5),
      serviceDueOn: null,
    });
    const second = startReminderWorker({
      env: t.deps.env,
      db: t.deps.db,
      logger: t.deps.logger,
      clock: t.clock,
      firmIds: [firm.firmId],
    });
    try {
      await waitFor('the restarted worker to catch up the missed day', async () => {
        const row = await t.deps.db('reminder_settings').where({ firm_id: firm.firmId }).first('last_scan_on');
        return row?.last_scan_on === today() ? true : undefined;
      });
    } finally {
      await second.close();
    }
    const caughtUp = await waitForEmail(firm.people.owner.email, { subject: /1 reminder / });
    expect(digestKeys(caughtUp)).toEqual(['Van-East MOT']);
    expect(
      await t.deps.db('reminders').where({ firm_id: firm.firmId, subject_type: 'van', subject_id: east }),
    ).toHaveLength(1);

    // A third start on the same day: already scanned, so no scan and nothing sent.
    const third = startReminderWorker({
      env: t.deps.env,
      db: t.deps.db,
      logger: t.deps.logger,
      clock: t.clock,
      firmIds: [firm.firmId],
    });
    try {
      const swept = await new Promise<unknown>((resolve) =>
        third.worker.once('completed', (_job, result) => resolve(result)),
      );
      expect(swept).toEqual({ firms: 0, reminders: 0 });
    } finally {
      await third.close();
    }
    await settle();
    expect(await reminderEmailsTo(firm.people.owner.email)).toHaveLength(2);
    expect(await reminderEmailsTo(firm.people.stores.email)).toHaveLength(2);
    expect(await reminderEmailsTo(firm.people.engineer.email)).toHaveLength(2);
    expect(await reminderEmailsTo(firm.target.email)).toHaveLength(1);
  });

  it('two scans racing each other send each reminder once', async () => {
    const racer = await seedBareFirm(t, 'reminders-race');
    await addVan(t, racer, {
      name: 'Van-Race',
      registration: 'RT44 RCE',
      engineerMemberId: racer.people.engineer.memberId,
      motDueOn: addDays(today(), 3),
      serviceDueOn: null,
    });
    const results = await Promise.all([1, 2, 3].map(() => runReminderScan(t.deps, racer.firmId, t.clock.now())));
    expect(results.map((r) => r.reminders).sort()).toEqual([0, 0, 1]);
    await onlyEmailTo(racer.people.owner.email, /reminder/);
    await settle();
    expect(await reminderEmailsTo(racer.people.owner.email)).toHaveLength(1);
  });

  it('reminds again when the clock reaches the next due period', async () => {
    const { firm, ids } = await seedScannedFleetFirm();
    // RT-H1 inspected today: next due in 30 days. RT-M1 inspected, then used 3 more times: a new use period.
    const inspectedAt = t.clock.now();
    await addInspection(t, firm, ids.h1, today(), inspectedAt);
    await addInspection(t, firm, ids.m1, today(), inspectedAt);
    const nextDue = addDays(today(), 30);
    await addCheckIns(t, firm, ids.m1, 3, inspectedAt, ids.north);
    t.clock.advance(25 * DAY_MS);

    const result = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(result.reminders).toBe(2);
    const latest = await waitForEmail(firm.people.engineer.email, { subject: /2 reminders/ });
    expect(digestKeys(latest)).toEqual(['RT-H1', 'RT-M1']);
    expect(latest.text).toContain(`RT-H1 (Hose set, on Van-North): inspection due by ${formatUkCalendarDate(nextDue)}`);
    const periods = await t.deps
      .db('reminders')
      .where({ firm_id: firm.firmId, subject_id: ids.m1, kind: 'inspection_due' })
      .orderBy('id')
      .pluck('period_key');
    expect(periods).toEqual(['uses:0', 'uses:1']);
    expect(await runReminderScan(t.deps, firm.firmId, t.clock.now())).toMatchObject({ reminders: 0 });
  });
  it('a kind of reminder switched off sends none of it; switched on, it is reminded from then', async () => {
    const other = await seedBareFirm(t, 'reminders-switch');
    await addVan(t, other, {
      name: 'Van-West',
      registration: 'RT55 WST',
      engineerMemberId: other.people.engineer.memberId,
      motDueOn: addDays(today(), 10),
      serviceDueOn: null,
    });
    const hoses = await addKind(t, other, { name: 'Hose set', intervalDays: 30, intervalUses: null, dueSoonDays: 7 });
    await addItem(t, other, {
      tag: 'SW-H1',
      kindId: hoses,
      locationId: (await t.deps.db('locations').where({ firm_id: other.firmId }).first('id')).id,
      inServiceSince: addDays(today(), -40),
    });

    const admin = await signIn(t.app, other.people.admin.email);
    const defaults = await admin.get('/api/reminder-settings').expect(200);
    expect(defaults.body.settings).toEqual({
      scanHour: 7,
      inspectionReminders: true,
      vanReminders: true,
      stockReminders: true,
      annualCheckReminders: true,
      annualCheckCustomerEmails: false,
      lastScanOn: null,
    });
    const off = await admin.put('/api/reminder-settings', {
      scanHour: 6,
      inspectionReminders: false,
      vanReminders: true,
    });
    expect(off.status).toBe(200);
    expect(off.body.settings).toMatchObject({
      scanHour: 6,
      inspectionReminders: false,
      vanReminders: true,
      stockReminders: true,
    });
    const bad = await admin.put('/api/reminder-settings', {
      scanHour: 24,
      inspectionReminders: false,
      vanReminders: true,
    });
    expect(bad.status).toBe(422);

    const scan = await admin.post('/api/reminders/scan');
    expect(scan.status).toBe(200);
    expect(scan.body).toEqual({ sent: 1 });
    const vansOnly = await onlyEmailTo(other.people.owner.email, /reminder/);
    expect(digestKeys(vansOnly)).toEqual(['Van-West MOT']);

    expect(
      (await admin.put('/api/reminder-settings', { scanHour: 6, inspectionReminders: true, vanReminders: false }))
        .status,
    ).toBe(200);
    await addVan(t, other, {
      name: 'Van-Quiet',
      registration: 'RT66 QUT',
      engineerMemberId: other.target.memberId,
      motDueOn: addDays(today(), 2),
      serviceDueOn: null,
    });
    expect((await admin.post('/api/reminders/scan')).body).toEqual({ sent: 1 });
    await waitFor('the second digest', async () =>
      (await reminderEmailsTo(other.people.owner.email)).length === 2 ? true : undefined,
    );
    const second = (await reminderEmailsTo(other.people.owner.email)).find((m) => m.text.includes('SW-H1'));
    expect(second && digestKeys(second)).toEqual(['SW-H1']);
    expect(await t.deps.db('reminders').where({ firm_id: other.firmId, kind: 'mot_due' })).toHaveLength(1);

    const stores = await signIn(t.app, other.people.stores.email);
    await stores.get('/api/reminder-settings').expect(403);
    expect((await stores.post('/api/reminders/scan')).status).toBe(403);
  });
});
