import { addDays, calendarDateIn, roles, type Role } from '@heatfleet/domain';
import { hashPassword } from '@heatfleet/api/modules/auth/password.ts';
import { createTestApp, TEST_PASSWORD, uniqueEmail, type TestApp, type TestClock } from './test-app.ts';
import { startTestEmailWorker } from './email-worker.ts';

export const DAY_MS = 86_400_000;
export const ZONE = 'Europe/London';

/** The test app with the real e-mail worker beside it; close() stops both. */
export function createReminderTestApp(): TestApp {
  const t = createTestApp();
  const emailWorker = startTestEmailWorker(t);
  return {
    ...t,
    close: async () => {
      await emailWorker.close();
      await t.close();
    },
  };
}

/**
 * Puts the clock at the next noon UTC, wherever an earlier case left it, so each case starts from the same
 * point and a run that straddles midnight cannot change "today" half-way through a case.
 */
export function startAtNoonUtc(clock: TestClock): void {
  const now = Date.now();
  const noon = new Date(now).setUTCHours(12, 0, 0, 0);
  clock.advance(noon + (noon < now ? DAY_MS : 0) - clock.now().getTime());
}

export function todayOn(clock: TestClock): string {
  return calendarDateIn(clock.now(), ZONE);
}

export interface Person {
  email: string;
  userId: number;
  memberId: number;
}
export interface ReminderFirm {
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
export async function seedBareFirm(t: TestApp, label: string): Promise<ReminderFirm> {
  passwordHash ??= hashPassword(TEST_PASSWORD);
  const hash = await passwordHash;
  const firmName = `Reminder test ${label} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
  return t.deps.db.transaction(async (trx) => {
    const [firmId] = (await trx('firms').insert({ name: firmName, time_zone: ZONE })) as number[];
    const add = async (role: Role, name: string): Promise<Person> => {
      const email = uniqueEmail(`${label}-${name}`);
      const [userId] = (await trx('users').insert({
        email,
        name: `${label} ${name}`,
        password_hash: hash,
      })) as number[];
      const [memberId] = (await trx('memberships').insert({
        firm_id: firmId,
        user_id: userId,
        role,
        active: true,
      })) as number[];
      return { email, userId: userId!, memberId: memberId! };
    };
    const people = {} as Record<Role, Person>;
    for (const role of roles) people[role] = await add(role, role);
    const target = await add('engineer', 'target');
    return { firmId: firmId!, firmName, people, target };
  });
}

/** Fleet rows written straight to the tables, as the brief's scenario: dates relative to today. */
export async function addVan(
  t: TestApp,
  firm: ReminderFirm,
  v: {
    name: string;
    registration: string;
    engineerMemberId: number;
    motDueOn: string | null;
    serviceDueOn: string | null;
  },
) {
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

export async function addDepot(t: TestApp, firm: ReminderFirm, name: string) {
  const [id] = (await t.deps.db('locations').insert({ firm_id: firm.firmId, kind: 'depot', name })) as number[];
  return id!;
}

export async function addKind(
  t: TestApp,
  firm: ReminderFirm,
  k: { name: string; intervalDays: number | null; intervalUses: number | null; dueSoonDays: number },
) {
  const [id] = (await t.deps.db('item_kinds').insert({
    firm_id: firm.firmId,
    name: k.name,
    interval_days: k.intervalDays,
    interval_uses: k.intervalUses,
    due_soon_days: k.dueSoonDays,
  })) as number[];
  return id!;
}

export async function addItem(
  t: TestApp,
  firm: ReminderFirm,
  i: { tag: string; kindId: number; locationId: number; inServiceSince: string; condition?: string },
) {
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

export async function addInspection(t: TestApp, firm: ReminderFirm, itemId: number, on: string, at: Date) {
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
export async function addCheckIns(
  t: TestApp,
  firm: ReminderFirm,
  itemId: number,
  count: number,
  after: Date,
  vanId: number,
) {
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

export interface FleetFirm {
  firm: ReminderFirm;
  /** The calendar day the fleet's dates were written relative to. */
  seededOn: string;
  ids: Record<'north' | 'south' | 'h1' | 'h2' | 'h3' | 'h4' | 'm1' | 't1', number>;
}

/**
 * Two vans and six kit items whose first scan makes six reminders: RT-H1 overdue, RT-H2 due soon, RT-M1 used up,
 * RT-T1 overdue at the depot, Van-North's MOT and Van-South's service; RT-T2 (inspected) and RT-H4 (out of
 * service) are not due.
 */
export async function seedFleetFirm(t: TestApp): Promise<FleetFirm> {
  const firm = await seedBareFirm(t, 'reminders');
  const seededOn = todayOn(t.clock);
  const d = (days: number) => addDays(seededOn, days);
  const ids = {} as FleetFirm['ids'];
  // Scan hour 0: the sweep finds this firm due whatever the hour the tests run at.
  await t.deps.db('reminder_settings').insert({ firm_id: firm.firmId, scan_hour: 0 });
  ids.north = await addVan(t, firm, {
    name: 'Van-North',
    registration: 'RT11 NRT',
    engineerMemberId: firm.people.engineer.memberId,
    motDueOn: d(10),
    serviceDueOn: d(90),
  });
  ids.south = await addVan(t, firm, {
    name: 'Van-South',
    registration: 'RT22 STH',
    engineerMemberId: firm.target.memberId,
    motDueOn: d(80),
    serviceDueOn: d(-3),
  });
  const hoses = await addKind(t, firm, { name: 'Hose set', intervalDays: 30, intervalUses: null, dueSoonDays: 7 });
  const magnets = await addKind(t, firm, { name: 'Magnet set', intervalDays: null, intervalUses: 3, dueSoonDays: 7 });
  const meters = await addKind(t, firm, { name: 'Test meter', intervalDays: 365, intervalUses: null, dueSoonDays: 14 });
  const depot = await addDepot(t, firm, 'Depot');
  ids.h1 = await addItem(t, firm, { tag: 'RT-H1', kindId: hoses, locationId: ids.north, inServiceSince: d(-40) }); // overdue since d(-10)
  ids.h2 = await addItem(t, firm, { tag: 'RT-H2', kindId: hoses, locationId: ids.south, inServiceSince: d(-25) }); // due soon, d(5)
  ids.h3 = await addItem(t, firm, { tag: 'RT-T2', kindId: meters, locationId: ids.north, inServiceSince: d(-400) });
  await addInspection(t, firm, ids.h3, d(-5), new Date(t.clock.now().getTime() - 5 * DAY_MS)); // next due d(360): fine
  ids.h4 = await addItem(t, firm, {
    tag: 'RT-H4',
    kindId: hoses,
    locationId: depot,
    inServiceSince: d(-60),
    condition: 'out_of_service',
  });
  ids.m1 = await addItem(t, firm, { tag: 'RT-M1', kindId: magnets, locationId: ids.north, inServiceSince: d(-20) });
  await addCheckIns(t, firm, ids.m1, 3, new Date(t.clock.now().getTime() - DAY_MS), ids.north); // 3 of 3 uses: overdue
  ids.t1 = await addItem(t, firm, { tag: 'RT-T1', kindId: meters, locationId: depot, inServiceSince: d(-400) }); // overdue since d(-35)
  return { firm, seededOn, ids };
}
