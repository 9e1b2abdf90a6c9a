import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, addMonths, calendarDateIn } from '@heatfleet/domain';
import { startOfDayIn } from '@heatfleet/api/modules/overview/overview-service.ts';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

const DAY = 86_400_000;

/**
 * A firm whose overview is known by hand: every figure below is counted from the rows written here
 * (dates relative to today, so the answers hold whenever the test runs).
 */
async function seedKnownFirm(): Promise<{ firm: SeededFirm; today: string; inhibitorId: number; kindTimeId: number }> {
  const firm = await seedFirm(t.deps.db, 'overview');
  const db = t.deps.db;
  const f = firm.firmId;
  const now = t.clock.now();
  const today = calendarDateIn(now, 'Europe/London');
  const by = firm.people.stores.userId;

  // Stock. The seed leaves the van 2 packs of cleaner against a minimum of 3, the depot 10 against 20.
  const [inhibitorId] = (await db('products').insert({
    firm_id: f,
    name: `Overview inhibitor ${f}`,
    kind: 'inhibitor',
    pack_size_ml: 500,
  })) as number[];
  // An inhibitor minimum on the van with none on board: empty (out of stock), and below minimum.
  await db('par_levels').insert({
    firm_id: f,
    location_id: firm.van.id,
    product_id: inhibitorId,
    minimum: 2,
    target: 4,
  });
  const [expiredBatch] = (await db('product_batches').insert({
    firm_id: f,
    product_id: firm.product.id,
    lot_number: `EXP${f}`,
    expires_on: addDays(today, -1),
  })) as number[];
  const [soonBatch] = (await db('product_batches').insert({
    firm_id: f,
    product_id: inhibitorId,
    lot_number: `SOON${f}`,
    expires_on: addDays(today, 30),
  })) as number[];
  const [laterBatch] = (await db('product_batches').insert({
    firm_id: f,
    product_id: inhibitorId,
    lot_number: `LATER${f}`,
    expires_on: addDays(today, 90),
  })) as number[];
  await db('stock_balances').insert([
    // Expired packs on the van count for nothing usable.
    { firm_id: f, location_id: firm.van.id, batch_id: expiredBatch, product_id: firm.product.id, quantity: 3 },
    { firm_id: f, location_id: firm.depotId, batch_id: soonBatch, product_id: inhibitorId, quantity: 4 },
    { firm_id: f, location_id: firm.depotId, batch_id: laterBatch, product_id: inhibitorId, quantity: 6 },
    // Used up on the spare van: a place holding none of a lot is not one of its places.
    { firm_id: f, location_id: firm.spareVanId, batch_id: expiredBatch, product_id: firm.product.id, quantity: 0 },
  ]);

  // Vans: the van's MOT in 10 days (due soon), the spare van's service yesterday (overdue).
  await db('locations')
    .where({ firm_id: f, id: firm.van.id })
    .update({ mot_due_on: addDays(today, 10), service_due_on: addDays(today, 100) });
  await db('locations')
    .where({ firm_id: f, id: firm.spareVanId })
    .update({ service_due_on: addDays(today, -1) });

  // Kit: the seeded items move to a kind without a rule, so only the items below count.
  const [noRule] = (await db('item_kinds').insert({
    firm_id: f,
    name: 'Overview no rule',
    interval_days: null,
    interval_uses: null,
    due_soon_days: 7,
  })) as number[];
  await db('kit_items').where({ firm_id: f }).update({ kind_id: noRule });
  const [kindTimeId] = (await db('item_kinds').insert({
    firm_id: f,
    name: 'Overview every 30 days',
    interval_days: 30,
    interval_uses: null,
    due_soon_days: 7,
  })) as number[];
  const [kindUses] = (await db('item_kinds').insert({
    firm_id: f,
    name: 'Overview every 3 uses',
    interval_days: null,
    interval_uses: 3,
    due_soon_days: 0,
  })) as number[];
  const item = async (tag: string, kindId: number, since: string) =>
    (
      (await db('kit_items').insert({
        firm_id: f,
        kind_id: kindId,
        asset_tag: `${tag}-${f}`,
        location_id: firm.depotId,
        in_service_since: since,
      })) as number[]
    )[0]!;
  await item('T1', kindTimeId!, addDays(today, -40)); // due today - 10: overdue
  await item('T2', kindTimeId!, addDays(today, -25)); // due today + 5, within 7: due soon
  const t3 = await item('T3', kindTimeId!, addDays(today, -400));
  await db('inspections').insert({
    firm_id: f,
    item_id: t3,
    result: 'passed',
    by_user_id: by,
    inspected_on: addDays(today, -31),
    created_at: new Date(now.getTime() - 31 * DAY),
  }); // due today - 1: overdue
  await item('T4', kindTimeId!, addDays(today, -5)); // ok
  const u1 = await item('U1', kindUses!, addDays(today, -60));
  const u2 = await item('U2', kindUses!, addDays(today, -60));
  const checkIn = (itemId: number, daysAgo: number) => ({
    firm_id: f,
    item_id: itemId,
    action: 'check_in',
    to_location_id: firm.depotId,
    by_user_id: by,
    condition: 'in_service',
    created_at: new Date(now.getTime() - daysAgo * DAY),
  });
  await db('inspections').insert([
    {
      firm_id: f,
      item_id: u1,
      result: 'passed',
      by_user_id: by,
      inspected_on: addDays(today, -10),
      created_at: new Date(now.getTime() - 10 * DAY),
    },
    {
      firm_id: f,
      item_id: u2,
      result: 'passed',
      by_user_id: by,
      inspected_on: addDays(today, -10),
      created_at: new Date(now.getTime() - 10 * DAY),
    },
  ]);
  // U1: one use before its inspection (not counted) and three after: none left, overdue. U2: two after, one left: due soon.
  await db('custody_events').insert([
    checkIn(u1, 20),
    checkIn(u1, 5),
    checkIn(u1, 4),
    checkIn(u1, 3),
    checkIn(u2, 5),
    checkIn(u2, 4),
  ]);

  // Jobs: the seeded job moves to today (planned); one completed this month; one planned last month (not counted).
  const monthStart = `${today.slice(0, 7)}-01`;
  await db('jobs').where({ firm_id: f, id: firm.jobId }).update({ scheduled_on: today });
  const survey = JSON.stringify({
    systemType: 'sealed',
    boilerKind: 'combi',
    fuel: 'gas',
    radiators: [],
    pipeRuns: [],
  });
  await db('jobs').insert([
    { firm_id: f, site_id: firm.siteId, scheduled_on: monthStart, status: 'completed', survey, completed_at: now },
    { firm_id: f, site_id: firm.siteId, scheduled_on: addDays(monthStart, -1), status: 'planned', survey },
  ]);

  // Chemical used: 2 x 1 L cleaner this month, 3 x 500 ml inhibitor three months ago, 5 packs 13 months ago (outside).
  const midMonth = (monthsBack: number) => new Date(`${addMonths(monthStart, -monthsBack).slice(0, 7)}-15T12:00:00Z`);
  const used = (productId: number, batchId: number, packs: number, at: Date, kind = 'used') => ({
    firm_id: f,
    group_id: randomUUID(),
    kind,
    location_id: firm.van.id,
    product_id: productId,
    batch_id: batchId,
    quantity_delta: -packs,
    by_user_id: by,
    created_at: at,
  });
  const thisMonthAt = new Date(
    Math.max(startOfDayIn(monthStart, 'Europe/London').getTime() + 3_600_000, now.getTime() - 60_000),
  );
  await db('stock_movements').insert([
    used(firm.product.id, firm.product.batchId, 2, thisMonthAt),
    used(inhibitorId!, soonBatch!, 3, midMonth(3)),
    used(firm.product.id, firm.product.batchId, 5, midMonth(13)),
    // A transfer out is not chemical used.
    used(firm.product.id, firm.product.batchId, 4, thisMonthAt, 'transfer_out'),
  ]);

  // Reminders: twelve, a minute apart; the overview shows the ten newest.
  await db('reminders').insert(
    Array.from({ length: 12 }, (_, i) => ({
      firm_id: f,
      kind: 'mot_due',
      subject_type: 'van',
      subject_id: firm.van.id,
      period_key: `p${i}`,
      summary: `Reminder ${i}`,
      created_at: new Date(now.getTime() - (12 - i) * 60_000),
    })),
  );

  // Vibration today: the engineer 30 minutes at 10 m/s^2 (100 points, HSE's own example); the other engineer none.
  await db('job_agitations').insert({
    firm_id: f,
    job_id: firm.jobId,
    radiator_index: 0,
    minutes: 30,
    magnitude_ms2: 10,
    engineer_member_id: firm.people.engineer.memberId,
    recorded_on: today,
    recorded_by_user_id: firm.people.engineer.userId,
    recorded_at: now,
  });
  return { firm, today, inhibitorId: inhibitorId!, kindTimeId: kindTimeId! };
}

describe('owner overview', () => {
  it('a calendar day starts at local midnight in the firm\u2019s zone, across the clock change', () => {
    expect(startOfDayIn('2026-07-01', 'Europe/London').toISOString()).toBe('2026-06-30T23:00:00.000Z');
    expect(startOfDayIn('2026-12-01', 'Europe/London').toISOString()).toBe('2026-12-01T00:00:00.000Z');
    expect(startOfDayIn('2026-03-29', 'Europe/London').toISOString()).toBe('2026-03-29T00:00:00.000Z');
    expect(startOfDayIn('2026-03-30', 'Europe/London').toISOString()).toBe('2026-03-29T23:00:00.000Z');
  });

  it('gives the hand-counted figures of a known firm', async () => {
    const { firm, today } = await seedKnownFirm();
    const owner = await signIn(t.app, firm.people.owner.email);
    const res = await owner.get('/api/overview');
    expect(res.status).toBe(200);
    const o = res.body.overview;
    expect(o.today).toBe(today);

    const van = o.vans.find((v: { id: number }) => v.id === firm.van.id);
    // Cleaner 2 usable (< 3: below minimum; the 3 expired packs do not count); inhibitor 0 against 2: empty.
    // Health per product by the domain's one rule; the van's is its worst product's (packs never added across products).
    expect(van.stock).toMatchObject({
      health: 'empty',
      belowMinimum: 2,
      outOfStock: 1,
      belowTarget: 0,
      productsNotOk: 2,
    });
    expect(van.stock.products.map((p: { usable: number; health: string }) => [p.usable, p.health])).toEqual([
      [0, 'empty'],
      [2, 'below_minimum'],
    ]);
    expect(van.nextDue).toMatchObject({ what: 'MOT', on: addDays(today, 10), daysLeft: 10, state: 'due_soon' });
    const spare = o.vans.find((v: { id: number }) => v.id === firm.spareVanId);
    expect(spare.stock).toMatchObject({
      health: 'no_par',
      belowMinimum: 0,
      outOfStock: 0,
      productsNotOk: 0,
      products: [],
    });
    expect(spare.nextDue).toMatchObject({ what: 'service', state: 'overdue', daysLeft: -1 });
    expect(o.vansDue).toBe(2);

    expect(o.kit.overdueCount).toBe(3);
    expect(o.kit.dueSoonCount).toBe(2);
    expect(o.kit.overdue.map((i: { assetTag: string }) => i.assetTag)).toEqual([
      `T1-${firm.firmId}`,
      `T3-${firm.firmId}`,
      `U1-${firm.firmId}`,
    ]);
    expect(o.kit.dueSoon.map((i: { assetTag: string }) => i.assetTag)).toEqual([
      `T2-${firm.firmId}`,
      `U2-${firm.firmId}`,
    ]);
    expect(o.kit.overdue[2]).toMatchObject({ usesLeft: 0, reason: 'uses' });

    // Expired yesterday (3 on the van) and expiring in 30 days (4 at the depot); the 90-day batch is outside 60 days.
    expect(o.expiringBatches).toMatchObject({ withinDays: 60, count: 2, packs: 7 });
    expect(
      o.expiringBatches.batches.map((b: { lotNumber: string; expired: boolean; packs: number }) => [
        b.lotNumber,
        b.expired,
        b.packs,
      ]),
    ).toEqual([
      [`EXP${firm.firmId}`, true, 3],
      [`SOON${firm.firmId}`, false, 4],
    ]);
    const placeName = async (id: number) =>
      ((await t.deps.db('locations').where({ firm_id: firm.firmId, id }).first('name')) as { name: string }).name;
    expect(o.expiringBatches.batches.map((b: { places: unknown }) => b.places)).toEqual([
      [{ name: await placeName(firm.van.id), quantity: 3 }],
      [{ name: await placeName(firm.depotId), quantity: 4 }],
    ]);

    expect(o.jobsThisMonth).toEqual({ month: today.slice(0, 7), planned: 1, completed: 1 });

    expect(o.usageByMonth).toHaveLength(12);
    const monthStart = `${today.slice(0, 7)}-01`;
    expect(o.usageByMonth[11]).toEqual({
      month: today.slice(0, 7),
      byKind: [{ kind: 'cleaner', litres: 2 }],
      totalLitres: 2,
    });
    expect(o.usageByMonth[8]).toEqual({
      month: addMonths(monthStart, -3).slice(0, 7),
      byKind: [{ kind: 'inhibitor', litres: 1.5 }],
      totalLitres: 1.5,
    });
    expect(o.usageByMonth[0].month).toBe(addMonths(monthStart, -11).slice(0, 7));
    expect(o.usageByMonth.reduce((n: number, m: { totalLitres: number }) => n + m.totalLitres, 0)).toBe(3.5);

    expect(o.reminders.map((r: { summary: string }) => r.summary)).toEqual([
      'Reminder 11',
      'Reminder 10',
      'Reminder 9',
      'Reminder 8',
      'Reminder 7',
      'Reminder 6',
      'Reminder 5',
      'Reminder 4',
      'Reminder 3',
      'Reminder 2',
    ]);

    // 2 x 10^2 x 0.5 h = 100 points: the exposure action value (HSE points system).
    expect(o.hav.engineers).toHaveLength(2);
    expect(o.hav.engineers[0]).toMatchObject({
      memberId: firm.people.engineer.memberId,
      points: 100,
      level: 'above_action',
    });
    expect(o.hav.engineers[1]).toMatchObject({ memberId: firm.target.memberId, points: 0, level: 'low' });
  });

  it('a month starts at local midnight: a use at 00:30 on 1 July (BST) counts in July, not June', async () => {
    const firm = await seedFirm(t.deps.db, 'overview-bst');
    const today = calendarDateIn(t.clock.now(), 'Europe/London');
    const year = Number(today.slice(5, 7)) >= 8 ? Number(today.slice(0, 4)) : Number(today.slice(0, 4)) - 1;
    await t.deps.db('stock_movements').insert({
      firm_id: firm.firmId,
      group_id: randomUUID(),
      kind: 'used',
      location_id: firm.van.id,
      product_id: firm.product.id,
      batch_id: firm.product.batchId,
      quantity_delta: -1,
      by_user_id: firm.people.owner.userId,
      created_at: new Date(`${year}-06-30T23:30:00Z`),
    });
    const owner = await signIn(t.app, firm.people.owner.email);
    const o = (await owner.get('/api/overview').expect(200)).body.overview;
    const month = (m: string) => o.usageByMonth.find((x: { month: string }) => x.month === m);
    expect(month(`${year}-07`)?.totalLitres).toBe(1);
    expect(month(`${year}-06`)?.totalLitres ?? 0).toBe(0);
  });

  it('counts every lot near expiry and its packs, and names the places of the first ten, most packs first', async () => {
    const firm = await seedFirm(t.deps.db, 'overview-lots');
    const db = t.deps.db;
    const f = firm.firmId;
    const today = calendarDateIn(t.clock.now(), 'Europe/London');
    // Twelve lots out of date on days 1 to 12 from today, each 2 packs on the van and i packs at the depot.
    for (let i = 1; i <= 12; i += 1) {
      const [batchId] = (await db('product_batches').insert({
        firm_id: f,
        product_id: firm.product.id,
        lot_number: `L${String(i).padStart(2, '0')}-${f}`,
        expires_on: addDays(today, i),
      })) as number[];
      await db('stock_balances').insert([
        { firm_id: f, location_id: firm.van.id, batch_id: batchId, product_id: firm.product.id, quantity: 2 },
        { firm_id: f, location_id: firm.depotId, batch_id: batchId, product_id: firm.product.id, quantity: i },
      ]);
    }
    const owner = await signIn(t.app, firm.people.owner.email);
    const o = (await owner.get('/api/overview').expect(200)).body.overview;
    const lots = o.expiringBatches.batches as { lotNumber: string; packs: number; places: { quantity: number }[] }[];
    // Counted by hand: 12 lots; 12 x 2 on the van plus 1 + 2 + ... + 12 = 78 at the depot.
    expect(o.expiringBatches).toMatchObject({ count: 12, packs: 24 + 78 });
    expect(lots.map((l) => l.lotNumber)).toEqual(
      Array.from({ length: 10 }, (_, n) => `L${String(n + 1).padStart(2, '0')}-${f}`),
    );
    expect(lots.map((l) => l.packs)).toEqual(Array.from({ length: 10 }, (_, n) => n + 1 + 2));
    expect(lots[0]!.places.map((p) => p.quantity)).toEqual([2, 1]);
    expect(lots[9]!.places.map((p) => p.quantity)).toEqual([10, 2]);
  });

  it('an engineer sees the overview with their own vibration points only, and no reminders', async () => {
    const { firm } = await seedKnownFirm();
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const o = (await engineer.get('/api/overview').expect(200)).body.overview;
    expect(o.reminders).toBeNull();
    expect(o.hav.engineers).toEqual([
      expect.objectContaining({ memberId: firm.people.engineer.memberId, points: 100 }),
    ]);
  });

  it('shows only the signed-in firm\u2019s figures', async () => {
    const { firm } = await seedKnownFirm();
    const other = await seedFirm(t.deps.db, 'overview-other');
    const owner = await signIn(t.app, other.people.owner.email);
    const o = (await owner.get('/api/overview').expect(200)).body.overview;
    expect(o.vans.map((v: { id: number }) => v.id).sort()).toEqual([other.van.id, other.spareVanId].sort());
    expect(o.reminders).toEqual([]);
    expect(JSON.stringify(o)).not.toContain(firm.firmName);
    expect(JSON.stringify(o)).not.toContain(`T1-${firm.firmId}`);
  });
});
