import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, BATCH_EXPIRY_WINDOW_DAYS, calendarDateIn, roles, VAN_DUE_WINDOW_DAYS, type OutboxMessage, type Role } from '@heatfleet/domain';
import { hashPassword } from '@heatfleet/api/modules/auth/password.ts';
import { startReminderWorker } from '@heatfleet/api/jobs/reminder-worker.ts';
import { runReminderScan } from '@heatfleet/api/modules/reminders/reminder-scan.ts';
import { applyMovements, type MovementLine } from '@heatfleet/api/modules/stock/stock-ledger.ts';
import { createTestApp, signIn, TEST_PASSWORD, uniqueEmail, type TestApp } from './support/test-app.ts';
import { startTestEmailWorker } from './support/email-worker.ts';
import { findEmails, waitForEmail } from './support/outbox.ts';

const DAY_MS = 86_400_000;
const ZONE = 'Europe/London';

let t: TestApp;
let emailWorker: ReturnType<typeof startTestEmailWorker>;

beforeAll(() => {
  t = createTestApp();
  // Noon UTC, so a run that happens to straddle midnight cannot change "today" half-way through a test.
  const now = Date.now();
  const noon = new Date(now).setUTCHours(12, 0, 0, 0);
  t.clock.advance(noon - now + (noon < now ? DAY_MS : 0));
  emailWorker = startTestEmailWorker(t);
});
afterAll(async () => {
  await emailWorker.close();
  await t.close();
});

const today = () => calendarDateIn(t.clock.now(), ZONE);

interface Person {
  email: string;
  userId: number;
  memberId: number;
}
interface SeededFirm {
  firmId: number;
  firmName: string;
  people: Record<Role, Person>;
  /** A second engineer, with a van of their own. */
  target: Person;
}

let passwordHash: Promise<string> | undefined;

/**
 * A firm with one member per role and nothing else: the shared seedFirm also lays out kit and vans,
 * which would add lines to the digests these tests count exactly.
 */
async function seedBareFirm(label: string): Promise<SeededFirm> {
  passwordHash ??= hashPassword(TEST_PASSWORD);
  const hash = await passwordHash;
  const firmName = `Reminder test ${label} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
  return t.deps.db.transaction(async (trx) => {
    const [firmId] = (await trx('firms').insert({ name: firmName, time_zone: ZONE })) as number[];
    const add = async (role: Role, name: string): Promise<Person> => {
      const email = uniqueEmail(`${label}-${name}`);
      const [userId] = (await trx('users').insert({ email, name: `${label} ${name}`, password_hash: hash })) as number[];
      const [memberId] = (await trx('memberships').insert({ firm_id: firmId, user_id: userId, role, active: true })) as number[];
      return { email, userId: userId!, memberId: memberId! };
    };
    const people = {} as Record<Role, Person>;
    for (const role of roles) people[role] = await add(role, role);
    const target = await add('engineer', 'target');
    return { firmId: firmId!, firmName, people, target };
  });
}

/** Fleet rows written straight to the tables, as the brief's scenario: dates relative to today. */
async function addVan(firm: SeededFirm, v: { name: string; registration: string; engineerMemberId: number; motDueOn: string | null; serviceDueOn: string | null }) {
  const [id] = (await t.deps.db('locations').insert({
    firm_id: firm.firmId,
    kind: 'van',
    name: v.name,
    registration: v.registration,
    engineer_member_id: v.engineerMemberId,
    mot_due_on: v.motDueOn,
    service_due_on: v.serviceDueOn,
  })) as number[];
  return id!;
}

async function addKind(firm: SeededFirm, k: { name: string; intervalDays: number | null; intervalUses: number | null; dueSoonDays: number }) {
  const [id] = (await t.deps.db('item_kinds').insert({
    firm_id: firm.firmId,
    name: k.name,
    interval_days: k.intervalDays,
    interval_uses: k.intervalUses,
    due_soon_days: k.dueSoonDays,
  })) as number[];
  return id!;
}

async function addItem(firm: SeededFirm, i: { tag: string; kindId: number; locationId: number; inServiceSince: string; condition?: string }) {
  const [id] = (await t.deps.db('kit_items').insert({
    firm_id: firm.firmId,
    kind_id: i.kindId,
    asset_tag: i.tag,
    location_id: i.locationId,
    in_service_since: i.inServiceSince,
    condition: i.condition ?? 'in_service',
  })) as number[];
  return id!;
}

async function addInspection(firm: SeededFirm, itemId: number, on: string, at: Date) {
  await t.deps.db('inspections').insert({
    firm_id: firm.firmId,
    item_id: itemId,
    result: 'passed',
    inspected_on: on,
    by_user_id: firm.people.stores.userId,
    created_at: at,
  });
}

/** Check-ins count as uses; `after` puts them after a given inspection was recorded. */
async function addCheckIns(firm: SeededFirm, itemId: number, count: number, after: Date, vanId: number) {
  for (let n = 1; n <= count; n += 1) {
    await t.deps.db('custody_events').insert({
      firm_id: firm.firmId,
      item_id: itemId,
      action: 'check_in',
      from_location_id: vanId,
      by_user_id: firm.people.engineer.userId,
      condition: 'in_service',
      created_at: new Date(after.getTime() + n * 1000),
    });
  }
}

/** The digest's lines, each named by what it is about: an asset tag, or a van and which date. */
function digestKeys(message: OutboxMessage): string[] {
  return message.text
    .split('\n')
    .filter((line) => line.startsWith('- '))
    .map((line) => {
      const name = line.slice(2).split(' ')[0] ?? '';
      if (line.includes(': MOT ')) return `${name} MOT`;
      if (line.includes(': service ')) return `${name} service`;
      return name;
    })
    .sort();
}

async function onlyEmailTo(to: string, subject: RegExp): Promise<OutboxMessage> {
  await waitForEmail(to, { subject });
  const all = (await findEmails(to)).filter((m) => subject.test(m.subject));
  expect(all, `e-mails to ${to}`).toHaveLength(1);
  return all[0]!;
}

async function reminderEmailsTo(to: string): Promise<OutboxMessage[]> {
  return (await findEmails(to)).filter((m) => /reminder/.test(m.subject));
}

/** Lets any e-mail that a wrong second send would have produced reach the catcher before counting. */
async function settle(): Promise<void> {
  await new Promise((r) => setTimeout(r, 1500));
}

async function waitFor<T>(what: string, probe: () => Promise<T | undefined>, timeoutMs = 15_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const value = await probe();
    if (value !== undefined) return value;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`Timed out waiting for ${what}`);
}

describe('service-due reminders', () => {
  let firm: SeededFirm;
  const ids = {} as Record<'north' | 'south' | 'h1' | 'h2' | 'h3' | 'h4' | 'm1' | 't1', number>;
  let seededOn: string;

  beforeAll(async () => {
    firm = await seedBareFirm('reminders');
    seededOn = today();
    const d = (days: number) => addDays(seededOn, days);
    // Scan hour 0: the sweep finds this firm due whatever the hour the tests run at.
    await t.deps.db('reminder_settings').insert({ firm_id: firm.firmId, scan_hour: 0 });
    ids.north = await addVan(firm, { name: 'Van-North', registration: 'RT11 NRT', engineerMemberId: firm.people.engineer.memberId, motDueOn: d(10), serviceDueOn: d(90) });
    ids.south = await addVan(firm, { name: 'Van-South', registration: 'RT22 STH', engineerMemberId: firm.target.memberId, motDueOn: d(80), serviceDueOn: d(-3) });
    const hoses = await addKind(firm, { name: 'Hose set', intervalDays: 30, intervalUses: null, dueSoonDays: 7 });
    const magnets = await addKind(firm, { name: 'Magnet set', intervalDays: null, intervalUses: 3, dueSoonDays: 7 });
    const meters = await addKind(firm, { name: 'Test meter', intervalDays: 365, intervalUses: null, dueSoonDays: 14 });
    const [depot] = (await t.deps.db('locations').insert({ firm_id: firm.firmId, kind: 'depot', name: 'Depot' })) as number[];
    ids.h1 = await addItem(firm, { tag: 'RT-H1', kindId: hoses, locationId: ids.north, inServiceSince: d(-40) }); // overdue since d(-10)
    ids.h2 = await addItem(firm, { tag: 'RT-H2', kindId: hoses, locationId: ids.south, inServiceSince: d(-25) }); // due soon, d(5)
    ids.h3 = await addItem(firm, { tag: 'RT-T2', kindId: meters, locationId: ids.north, inServiceSince: d(-400) });
    await addInspection(firm, ids.h3, d(-5), new Date(t.clock.now().getTime() - 5 * DAY_MS)); // next due d(360): fine
    ids.h4 = await addItem(firm, { tag: 'RT-H4', kindId: hoses, locationId: depot!, inServiceSince: d(-60), condition: 'out_of_service' });
    ids.m1 = await addItem(firm, { tag: 'RT-M1', kindId: magnets, locationId: ids.north, inServiceSince: d(-20) });
    await addCheckIns(firm, ids.m1, 3, new Date(t.clock.now().getTime() - DAY_MS), ids.north); // 3 of 3 uses: overdue
    ids.t1 = await addItem(firm, { tag: 'RT-T1', kindId: meters, locationId: depot!, inServiceSince: d(-400) }); // overdue since d(-35)
  });

  it('sends the office one digest of everything due and each engineer a digest of their own van', async () => {
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
    expect(north.text).toContain(`Van-North (RT11 NRT): MOT due on ${addDays(seededOn, 10)}`);
    // 30 days ahead for MOT and service: common practice (no source).
    expect(VAN_DUE_WINDOW_DAYS).toBe(30);
    expect(north.text).toContain(`RT-H1 (Hose set, on Van-North): inspection overdue since ${addDays(seededOn, -10)}`);
    expect(north.text).toContain('RT-M1 (Magnet set, on Van-North): inspection overdue: used 3 times since the last one (rule: every 3 uses)');
    const south = await onlyEmailTo(firm.target.email, /reminder/);
    expect(digestKeys(south)).toEqual(['RT-H2', 'Van-South service']);
    expect(south.text).toContain(`RT-H2 (Hose set, on Van-South): inspection due by ${addDays(seededOn, 5)}`);
    expect(south.text).toContain(`Van-South (RT22 STH): service overdue since ${addDays(seededOn, -3)}`);
    // The Admin manages settings but is not on the digest (PRODUCT.md: Owner and Stores watch stock and kit).
    expect(await reminderEmailsTo(firm.people.admin.email)).toHaveLength(0);

    const periods = await t.deps.db('reminders').where({ firm_id: firm.firmId }).orderBy('id').select('kind', 'subject_type', 'subject_id', 'period_key');
    expect(periods).toEqual(
      expect.arrayContaining([
        { kind: 'inspection_due', subject_type: 'kit_item', subject_id: ids.h1, period_key: addDays(seededOn, -10) },
        { kind: 'inspection_due', subject_type: 'kit_item', subject_id: ids.m1, period_key: 'uses:0' },
        { kind: 'mot_due', subject_type: 'van', subject_id: ids.north, period_key: addDays(seededOn, 10) },
      ]),
    );
    expect(await t.deps.db('reminder_deliveries').where({ firm_id: firm.firmId }).count({ n: '*' })).toEqual([{ n: 6 + 6 + 3 + 2 }]);
  });

  it('lists what was sent to whom on the Reminders page, for Owner, Admin and Stores only', async () => {
    const stores = await signIn(t.app, firm.people.stores.email);
    const res = await stores.get('/api/reminders').expect(200);
    const reminders = res.body.reminders as { recipient: string; summary: string; kind: string; subjectType: string; subjectId: number; sentAt: string | null }[];
    expect(reminders).toHaveLength(17);
    expect(reminders).toContainEqual(
      expect.objectContaining({ recipient: firm.people.engineer.email, kind: 'mot_due', subjectType: 'van', subjectId: ids.north }),
    );
    expect(reminders.filter((r) => r.recipient === firm.people.engineer.email).map((r) => r.summary).sort()).toEqual(
      expect.arrayContaining([expect.stringContaining('RT-H1'), expect.stringContaining('RT-M1'), expect.stringContaining('Van-North')]),
    );
    await waitFor('every digest marked sent', async () => {
      const again = await stores.get('/api/reminders').expect(200);
      return (again.body.reminders as { sentAt: string | null }[]).every((r) => r.sentAt !== null) ? true : undefined;
    });
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await engineer.get('/api/reminders').expect(403);
  });

  it('sends nothing twice: a second scan, the sweep at worker start and a restarted worker', async () => {
    const again = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(again).toEqual({ reminders: 0, emails: 0, ran: true });

    // A worker starting up runs the sweep at once; it scans the firm (its scan hour has come) and finds nothing new.
    const first = startReminderWorker({ env: t.deps.env, db: t.deps.db, logger: t.deps.logger, clock: t.clock, firmIds: [firm.firmId] });
    try {
      await first.ready;
      const schedulers = await first.queue.getJobSchedulers();
      expect(schedulers.find((s) => s.key === 'reminder-sweep')).toMatchObject({ pattern: '0 * * * *', tz: 'Europe/London' });
      await waitFor('the start-up sweep to mark today scanned', async () => {
        const row = await t.deps.db('reminder_settings').where({ firm_id: firm.firmId }).first('last_scan_on');
        return row?.last_scan_on === today() ? true : undefined;
      });
    } finally {
      await first.close();
    }

    // The worker was down for a day; meanwhile a van was added whose MOT is 5 days off.
    t.clock.advance(DAY_MS);
    const east = await addVan(firm, { name: 'Van-East', registration: 'RT33 EST', engineerMemberId: firm.people.engineer.memberId, motDueOn: addDays(seededOn, 5), serviceDueOn: null });
    const second = startReminderWorker({ env: t.deps.env, db: t.deps.db, logger: t.deps.logger, clock: t.clock, firmIds: [firm.firmId] });
    try {
      await waitFor('the restarted worker to catch up the missed day', async () => {
        const row = await t.deps.db('reminder_settings').where({ firm_id: firm.firmId }).first('last_scan_on');
        return row?.last_scan_on === today() ? true : undefined;
      });
    } finally {
      await second.close();
    }
    const caughtUp = await waitForEmail(firm.people.owner.email, { subject: /1 reminder /});
    expect(digestKeys(caughtUp)).toEqual(['Van-East MOT']);
    expect(await t.deps.db('reminders').where({ firm_id: firm.firmId, subject_type: 'van', subject_id: east })).toHaveLength(1);

    // A third start on the same day: already scanned, so no scan and nothing sent.
    const third = startReminderWorker({ env: t.deps.env, db: t.deps.db, logger: t.deps.logger, clock: t.clock, firmIds: [firm.firmId] });
    try {
      const swept = await new Promise<unknown>((resolve) => third.worker.once('completed', (_job, result) => resolve(result)));
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
    const racer = await seedBareFirm('reminders-race');
    await addVan(racer, { name: 'Van-Race', registration: 'RT44 RCE', engineerMemberId: racer.people.engineer.memberId, motDueOn: addDays(today(), 3), serviceDueOn: null });
    const results = await Promise.all([1, 2, 3].map(() => runReminderScan(t.deps, racer.firmId, t.clock.now())));
    expect(results.map((r) => r.reminders).sort()).toEqual([0, 0, 1]);
    await onlyEmailTo(racer.people.owner.email, /reminder/);
    await settle();
    expect(await reminderEmailsTo(racer.people.owner.email)).toHaveLength(1);
  });

  it('reminds again when the clock reaches the next due period', async () => {
    // RT-H1 inspected today: next due in 30 days. RT-M1 inspected, then used 3 more times: a new use period.
    const inspectedAt = t.clock.now();
    await addInspection(firm, ids.h1, today(), inspectedAt);
    await addInspection(firm, ids.m1, today(), inspectedAt);
    const nextDue = addDays(today(), 30);
    await addCheckIns(firm, ids.m1, 3, inspectedAt, ids.north);
    t.clock.advance(25 * DAY_MS);

    const result = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(result.reminders).toBe(2);
    const latest = await waitForEmail(firm.people.engineer.email, { subject: /2 reminders/ });
    expect(digestKeys(latest)).toEqual(['RT-H1', 'RT-M1']);
    expect(latest.text).toContain(`RT-H1 (Hose set, on Van-North): inspection due by ${nextDue}`);
    const periods = await t.deps.db('reminders').where({ firm_id: firm.firmId, subject_id: ids.m1, kind: 'inspection_due' }).orderBy('id').pluck('period_key');
    expect(periods).toEqual(['uses:0', 'uses:1']);
    expect(await runReminderScan(t.deps, firm.firmId, t.clock.now())).toMatchObject({ reminders: 0 });
  });

  it('a kind of reminder switched off sends none of it; switched on, it is reminded from then', async () => {
    const other = await seedBareFirm('reminders-switch');
    await addVan(other, { name: 'Van-West', registration: 'RT55 WST', engineerMemberId: other.people.engineer.memberId, motDueOn: addDays(today(), 10), serviceDueOn: null });
    const hoses = await addKind(other, { name: 'Hose set', intervalDays: 30, intervalUses: null, dueSoonDays: 7 });
    await addItem(other, { tag: 'SW-H1', kindId: hoses, locationId: (await t.deps.db('locations').where({ firm_id: other.firmId }).first('id')).id, inServiceSince: addDays(today(), -40) });

    const admin = await signIn(t.app, other.people.admin.email);
    const defaults = await admin.get('/api/reminder-settings').expect(200);
    expect(defaults.body.settings).toEqual({ scanHour: 7, inspectionReminders: true, vanReminders: true, stockReminders: true, annualCheckReminders: true, annualCheckCustomerEmails: false, lastScanOn: null });
    const off = await admin.put('/api/reminder-settings', { scanHour: 6, inspectionReminders: false, vanReminders: true });
    expect(off.status).toBe(200);
    expect(off.body.settings).toMatchObject({ scanHour: 6, inspectionReminders: false, vanReminders: true, stockReminders: true });
    const bad = await admin.put('/api/reminder-settings', { scanHour: 24, inspectionReminders: false, vanReminders: true });
    expect(bad.status).toBe(422);

    const scan = await admin.post('/api/reminders/scan');
    expect(scan.status).toBe(200);
    expect(scan.body).toEqual({ sent: 1 });
    const vansOnly = await onlyEmailTo(other.people.owner.email, /reminder/);
    expect(digestKeys(vansOnly)).toEqual(['Van-West MOT']);

    expect((await admin.put('/api/reminder-settings', { scanHour: 6, inspectionReminders: true, vanReminders: false })).status).toBe(200);
    await addVan(other, { name: 'Van-Quiet', registration: 'RT66 QUT', engineerMemberId: other.target.memberId, motDueOn: addDays(today(), 2), serviceDueOn: null });
    expect((await admin.post('/api/reminders/scan')).body).toEqual({ sent: 1 });
    await waitFor('the second digest', async () => ((await reminderEmailsTo(other.people.owner.email)).length === 2 ? true : undefined));
    const second = (await reminderEmailsTo(other.people.owner.email)).find((m) => m.text.includes('SW-H1'));
    expect(second && digestKeys(second)).toEqual(['SW-H1']);
    expect(await t.deps.db('reminders').where({ firm_id: other.firmId, kind: 'mot_due' })).toHaveLength(1);

    const stores = await signIn(t.app, other.people.stores.email);
    await stores.get('/api/reminder-settings').expect(403);
    expect((await stores.post('/api/reminders/scan')).status).toBe(403);
  });
});

describe('restock reminders', () => {
  let firm: SeededFirm;
  const ids = {} as Record<'depot' | 'north' | 'south' | 'cleaner' | 'inhibitor' | 'c1' | 'c2' | 'i1' | 'i2', number>;
  let seededOn: string;

  /** Movements through the real ledger, so balances and movements agree as they do in the app. */
  async function move(f: SeededFirm, lines: MovementLine[]) {
    await t.deps.db.transaction((trx) => applyMovements(trx, f.firmId, f.people.stores.userId, lines, t.clock.now()));
  }
  const transfer = (from: number, to: number, productId: number, batchId: number, n: number): MovementLine[] => [
    { kind: 'transfer_out', locationId: from, productId, batchId, quantityDelta: -n },
    { kind: 'transfer_in', locationId: to, productId, batchId, quantityDelta: n },
  ];

  async function addProduct(f: SeededFirm, name: string, kind: string) {
    const [id] = (await t.deps.db('products').insert({ firm_id: f.firmId, name, kind, pack_size_ml: 1000 })) as number[];
    return id!;
  }
  async function addBatch(f: SeededFirm, productId: number, lot: string, expiresOn: string) {
    const [id] = (await t.deps.db('product_batches').insert({ firm_id: f.firmId, product_id: productId, lot_number: lot, expires_on: expiresOn })) as number[];
    return id!;
  }
  async function setPar(f: SeededFirm, locationId: number, productId: number, minimum: number, target: number) {
    await t.deps.db('par_levels').insert({ firm_id: f.firmId, location_id: locationId, product_id: productId, minimum, target });
  }

  /** Each digest line under a section heading, by heading. */
  function sectionsOf(message: OutboxMessage): Record<string, string[]> {
    const out: Record<string, string[]> = {};
    let current = '';
    for (const line of message.text.split('\n')) {
      if (line.endsWith(':') && !line.startsWith('- ')) current = line.slice(0, -1);
      else if (line.startsWith('- ')) (out[current] ??= []).push(line.slice(2));
    }
    return out;
  }

  beforeAll(async () => {
    firm = await seedBareFirm('stock');
    seededOn = today();
    const d = (days: number) => addDays(seededOn, days);
    const [depot] = (await t.deps.db('locations').insert({ firm_id: firm.firmId, kind: 'depot', name: 'Depot-Main' })) as number[];
    ids.depot = depot!;
    // No MOT or service dates: these digests carry stock lines only.
    ids.north = await addVan(firm, { name: 'Van-North', registration: 'RT11 NRT', engineerMemberId: firm.people.engineer.memberId, motDueOn: null, serviceDueOn: null });
    ids.south = await addVan(firm, { name: 'Van-South', registration: 'RT22 STH', engineerMemberId: firm.target.memberId, motDueOn: null, serviceDueOn: null });
    ids.cleaner = await addProduct(firm, 'Test Cleaner Alpha', 'cleaner');
    ids.inhibitor = await addProduct(firm, 'Test Inhibitor Beta', 'inhibitor');
    ids.c1 = await addBatch(firm, ids.cleaner, 'RT-C1', d(30)); // expires within the window
    ids.c2 = await addBatch(firm, ids.cleaner, 'RT-C2', d(400));
    ids.i1 = await addBatch(firm, ids.inhibitor, 'RT-I1', d(500));
    ids.i2 = await addBatch(firm, ids.inhibitor, 'RT-I2', d(BATCH_EXPIRY_WINDOW_DAYS + 1)); // one day outside it

    await move(firm, [
      { kind: 'received', locationId: ids.depot, productId: ids.cleaner, batchId: ids.c1, quantityDelta: 2 },
      { kind: 'received', locationId: ids.depot, productId: ids.cleaner, batchId: ids.c2, quantityDelta: 10 },
      { kind: 'received', locationId: ids.depot, productId: ids.inhibitor, batchId: ids.i1, quantityDelta: 10 },
      { kind: 'received', locationId: ids.depot, productId: ids.inhibitor, batchId: ids.i2, quantityDelta: 1 },
    ]);
    await move(firm, [...transfer(ids.depot, ids.north, ids.cleaner, ids.c2, 3), ...transfer(ids.depot, ids.north, ids.inhibitor, ids.i1, 2), ...transfer(ids.depot, ids.south, ids.inhibitor, ids.i1, 2)]);
    await move(firm, [{ kind: 'used', locationId: ids.north, productId: ids.cleaner, batchId: ids.c2, quantityDelta: -2, reason: 'Cleaning job' }]);

    // Van-North: 1 cleaner against a minimum of 2. Van-South and both inhibitor levels are fine.
    await setPar(firm, ids.north, ids.cleaner, 2, 4);
    await setPar(firm, ids.north, ids.inhibitor, 1, 2);
    await setPar(firm, ids.south, ids.inhibitor, 1, 2);
    // Depot cleaner: 9 usable (RT-C1 2, RT-C2 7); the restock run plans 3 to Van-North, leaving 6 against a minimum of 8.
    await setPar(firm, ids.depot, ids.cleaner, 8, 12);
    await setPar(firm, ids.depot, ids.inhibitor, 2, 4);
  });

  it('sends Stores and Owner a digest of vans below minimum, depot reorders and expiring batches; the engineer gets their van', async () => {
    const result = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(result).toEqual({ reminders: 3, emails: 3, ran: true });

    // The reorder list's rule (PRODUCT.md, computation 3): cover = usable after transfers / (packs used in 90 days / 90);
    // 6 / (2 / 90) = 270 days. The 60-day expiry window is common practice (no source).
    expect(BATCH_EXPIRY_WINDOW_DAYS).toBe(60);
    const expected = {
      'Vans below their minimum stock': ['Van-North (RT11 NRT): Test Cleaner Alpha 1 usable, under its minimum of 2 (target 4)'],
      'Depot stock to reorder': [
        "Test Cleaner Alpha at Depot-Main: 6 usable after the planned restock, under its minimum of 8; order 6 packs to reach 12 (about 270 days of cover at the last 90 days' use)",
      ],
      'Batches expiring': [`Test Cleaner Alpha lot RT-C1: expires on ${addDays(seededOn, 30)} (in 30 days); 2 packs held: Depot-Main 2`],
    };
    for (const person of [firm.people.owner, firm.people.stores]) {
      const digest = await onlyEmailTo(person.email, /reminder/);
      expect(digest.subject).toBe(`${firm.firmName}: 3 reminders for stock`);
      expect(sectionsOf(digest)).toEqual(expected);
    }
    const north = await onlyEmailTo(firm.people.engineer.email, /reminder/);
    expect(north.subject).toBe(`Your van: 1 reminder from ${firm.firmName}`);
    expect(sectionsOf(north)).toEqual({ 'Vans below their minimum stock': expected['Vans below their minimum stock'] });
    await settle();
    expect(await reminderEmailsTo(firm.target.email)).toHaveLength(0);
    expect(await reminderEmailsTo(firm.people.admin.email)).toHaveLength(0);

    const rows = await t.deps.db('reminders').where({ firm_id: firm.firmId }).orderBy('id').select('kind', 'subject_type', 'subject_id', 'period_key');
    const lastArrival = (locationId: number, productId: number) =>
      t.deps.db('stock_movements').where({ firm_id: firm.firmId, location_id: locationId, product_id: productId }).where('quantity_delta', '>', 0).max({ id: 'id' }).first();
    const northIn = Number((await lastArrival(ids.north, ids.cleaner))!.id);
    const depotIn = Number((await lastArrival(ids.depot, ids.cleaner))!.id);
    expect(rows).toEqual([
      { kind: 'van_below_minimum', subject_type: 'van', subject_id: ids.north, period_key: `p${ids.cleaner}:in${northIn}` },
      { kind: 'depot_reorder', subject_type: 'product', subject_id: ids.cleaner, period_key: `d${ids.depot}:in${depotIn}` },
      { kind: 'batch_expiring', subject_type: 'batch', subject_id: ids.c1, period_key: addDays(seededOn, 30) },
    ]);

    const stores = await signIn(t.app, firm.people.stores.email);
    const page = (await stores.get('/api/reminders').expect(200)).body.reminders as { kind: string; subjectType: string }[];
    expect(page.map((r) => `${r.kind}/${r.subjectType}`).sort()).toEqual(
      ['batch_expiring/batch', 'batch_expiring/batch', 'depot_reorder/product', 'depot_reorder/product', 'van_below_minimum/van', 'van_below_minimum/van', 'van_below_minimum/van'].sort(),
    );
  });

  it('a second scan sends nothing; the next day only a batch that has just come within 60 days', async () => {
    expect(await runReminderScan(t.deps, firm.firmId, t.clock.now())).toEqual({ reminders: 0, emails: 0, ran: true });
    await settle();
    expect(await reminderEmailsTo(firm.people.owner.email)).toHaveLength(1);

    // A day on, RT-I2 expires in exactly 60 days. The rest are the same dip and the same expiry: not again.
    t.clock.advance(DAY_MS);
    expect(await runReminderScan(t.deps, firm.firmId, t.clock.now())).toEqual({ reminders: 1, emails: 2, ran: true });
    const owner = await waitFor('the next day\'s office digest', async () => {
      const all = await reminderEmailsTo(firm.people.owner.email);
      return all.length === 2 ? all.find((m) => m.text.includes('RT-I2')) : undefined;
    });
    expect(sectionsOf(owner)).toEqual({ 'Batches expiring': [`Test Inhibitor Beta lot RT-I2: expires on ${addDays(seededOn, 61)} (in 60 days); 1 pack held: Depot-Main 1`] });
    expect(await runReminderScan(t.deps, firm.firmId, t.clock.now())).toEqual({ reminders: 0, emails: 0, ran: true });
    await settle();
    expect(await reminderEmailsTo(firm.people.owner.email)).toHaveLength(2);
    expect(await reminderEmailsTo(firm.people.engineer.email)).toHaveLength(1);
  });

  it('reminds again when a van dips under its minimum a second time, not while the depot line is unchanged', async () => {
    // A restock brings Van-North to 4 (its target); jobs then take it back down to 1.
    await move(firm, transfer(ids.depot, ids.north, ids.cleaner, ids.c2, 3));
    expect(await runReminderScan(t.deps, firm.firmId, t.clock.now())).toEqual({ reminders: 0, emails: 0, ran: true });
    await move(firm, [{ kind: 'used', locationId: ids.north, productId: ids.cleaner, batchId: ids.c2, quantityDelta: -3, reason: 'Cleaning job' }]);

    const result = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(result).toEqual({ reminders: 1, emails: 3, ran: true });
    const engineerDigests = await waitFor('the second digest to the engineer', async () => {
      const all = await reminderEmailsTo(firm.people.engineer.email);
      return all.length === 2 ? all : undefined;
    });
    for (const m of engineerDigests) expect(sectionsOf(m)).toEqual({ 'Vans below their minimum stock': [expect.stringContaining('Van-North (RT11 NRT): Test Cleaner Alpha 1 usable')] });
    const owner = await waitFor('the office digest of the second dip', async () => {
      const all = await reminderEmailsTo(firm.people.owner.email);
      return all.length === 3 ? all.find((m) => m.text.includes('Van-North') && m.subject.includes('1 reminder ')) : undefined;
    });
    expect(sectionsOf(owner)).toEqual({ 'Vans below their minimum stock': ['Van-North (RT11 NRT): Test Cleaner Alpha 1 usable, under its minimum of 2 (target 4)'] });
    expect(await t.deps.db('reminders').where({ firm_id: firm.firmId, kind: 'van_below_minimum' })).toHaveLength(2);
  });

  it('with stock reminders switched off none is sent; a save that leaves the switch out keeps it; switched on, they come', async () => {
    const other = await seedBareFirm('stock-switch');
    const [depot] = (await t.deps.db('locations').insert({ firm_id: other.firmId, kind: 'depot', name: 'Depot-West' })) as number[];
    const van = await addVan(other, { name: 'Van-West', registration: 'RT55 WST', engineerMemberId: other.people.engineer.memberId, motDueOn: null, serviceDueOn: null });
    const product = await addProduct(other, 'Test Cleaner Delta', 'cleaner');
    const batch = await addBatch(other, product, 'SW-C1', addDays(today(), 20));
    await move(other, [{ kind: 'received', locationId: depot!, productId: product, batchId: batch, quantityDelta: 1 }]);
    await setPar(other, van, product, 1, 2);
    await setPar(other, depot!, product, 2, 4);

    const admin = await signIn(t.app, other.people.admin.email);
    const off = await admin.put('/api/reminder-settings', { scanHour: 7, inspectionReminders: true, vanReminders: true, stockReminders: false });
    expect(off.status).toBe(200);
    expect(off.body.settings).toMatchObject({ stockReminders: false });
    // The settings form of an older client sends no stockReminders: the switch stays off.
    const kept = await admin.put('/api/reminder-settings', { scanHour: 8, inspectionReminders: true, vanReminders: true });
    expect(kept.body.settings).toMatchObject({ scanHour: 8, stockReminders: false });
    expect((await admin.put('/api/reminder-settings', { scanHour: 8, inspectionReminders: true, vanReminders: true, stockReminders: 'no' })).status).toBe(422);

    expect((await admin.post('/api/reminders/scan')).body).toEqual({ sent: 0 });
    await settle();
    expect(await reminderEmailsTo(other.people.owner.email)).toHaveLength(0);
    expect(await t.deps.db('reminders').where({ firm_id: other.firmId })).toHaveLength(0);

    expect((await admin.put('/api/reminder-settings', { scanHour: 8, inspectionReminders: true, vanReminders: true, stockReminders: true })).status).toBe(200);
    expect((await admin.post('/api/reminders/scan')).body).toEqual({ sent: 3 });
    const digest = await onlyEmailTo(other.people.owner.email, /reminder/);
    expect(Object.keys(sectionsOf(digest))).toEqual(['Vans below their minimum stock', 'Depot stock to reorder', 'Batches expiring']);
    expect(sectionsOf(digest)['Depot stock to reorder']).toEqual([
      // Nothing used yet: no rate to give days of cover from.
      'Test Cleaner Delta at Depot-West: 0 usable after the planned restock, under its minimum of 2; order 4 packs to reach 4 (none used in the last 90 days)',
    ]);
  });
});

describe('annual check reminders', () => {
  it('reminds the office of customers whose annual check falls within 30 days, once, and not when switched off', async () => {
    const firm = await seedBareFirm('annual');
    const [customerId] = (await t.deps.db('customers').insert({ firm_id: firm.firmId, name: 'Annual Test Customer' })) as number[];
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
    expect(mail.text).toContain(`Annual Test Customer, 7 Check Lane: annual inhibitor check due on ${soon}`);
    expect(mail.text).not.toContain('9 Later Lane');
    await waitForEmail(firm.people.stores.email, { subject: /annual checks/ });
    expect((await runReminderScan(t.deps, firm.firmId, t.clock.now())).reminders).toBe(0);

    const owner = await signIn(t.app, firm.people.owner.email);
    const saved = await owner.put('/api/reminder-settings', { scanHour: 7, inspectionReminders: true, vanReminders: true, annualCheckReminders: false });
    expect(saved.status).toBe(200);
    await t.deps.db('sites').where({ firm_id: firm.firmId, address: '9 Later Lane' }).update({ next_check_on: addDays(today(), 5) });
    expect((await runReminderScan(t.deps, firm.firmId, t.clock.now())).reminders).toBe(0);
    expect(await findEmails(firm.people.engineer.email)).toHaveLength(0);
  });

  it('tells the customer too, once, only where the firm has turned it on and the customer has an e-mail', async () => {
    const firm = await seedBareFirm('annual-customer');
    const customerEmail = uniqueEmail('householder');
    const [withEmail] = (await t.deps.db('customers').insert({ firm_id: firm.firmId, name: 'Rowan Householder', email: customerEmail })) as number[];
    const [withoutEmail] = (await t.deps.db('customers').insert({ firm_id: firm.firmId, name: 'No Mail Customer' })) as number[];
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

    const saved = await owner.put('/api/reminder-settings', { scanHour: 7, inspectionReminders: true, vanReminders: true, annualCheckCustomerEmails: true });
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
