import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { addDays, BATCH_EXPIRY_WINDOW_DAYS, formatUkCalendarDate } from '@heatfleet/domain';
import { runReminderScan } from '@heatfleet/api/modules/reminders/reminder-scan.ts';
import { signIn, type TestApp } from './support/test-app.ts';
import {
  addDepot,
  addVan,
  createReminderTestApp,
  DAY_MS,
  seedBareFirm,
  startAtNoonUtc,
  todayOn,
} from './support/reminder-fixtures.ts';
import { addBatch, addProduct, move, seedStockFirm, setPar, transfer } from './support/reminder-stock-fixtures.ts';
import { onlyEmailTo, reminderEmailsTo, sectionsOf, settle, waitFor } from './support/reminder-mail.ts';

let t: TestApp;
beforeAll(() => {
  t = createReminderTestApp();
});
beforeEach(() => startAtNoonUtc(t.clock));
afterAll(() => t.close());

const today = () => todayOn(t.clock);

/** The stock firm after its first scan: three reminders, e-mailed to the office and Van-North's engineer. */
async function seedScannedStockFirm() {
  const stock = await seedStockFirm(t);
  await runReminderScan(t.deps, stock.firm.firmId, t.clock.now());
  return stock;
}

describe('restock reminders', () => {
  it('sends Stores and Owner a digest of vans below minimum, depot reorders and expiring batches; the engineer gets their van', async () => {
    const { firm, ids, seededOn } = await seedStockFirm(t);
    const result = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(result).toEqual({ reminders: 3, emails: 3, ran: true });

    // The reorder list's rule (the domain's planReorder, packages/domain/src/stock/restock.ts): cover = usable after
    // transfers / (packs used in 90 days / 90); 6 / (2 / 90) = 270 days. The 60-day expiry window is common practice
    // (no source).
    expect(BATCH_EXPIRY_WINDOW_DAYS).toBe(60);
    const expected = {
      'Vans below their minimum stock': [
        'Van-North (RT11 NRT): Test Cleaner Alpha 1 usable, under its minimum of 2 (target 4)',
      ],
      'Depot stock to reorder': [
        "Test Cleaner Alpha at Depot-Main: 6 usable after the planned restock, under its minimum of 8; order 6 packs to reach 12 (about 270 days of cover at the last 90 days' use)",
      ],
      'Batches expiring': [
        `Test Cleaner Alpha lot RT-C1: expires on ${formatUkCalendarDate(addDays(seededOn, 30))} (in 30 days); 2 packs held: Depot-Main 2`,
      ],
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

    const rows = await t.deps
      .db('reminders')
      .where({ firm_id: firm.firmId })
      .orderBy('id')
      .select('kind', 'subject_type', 'subject_id', 'period_key');
    const lastArrival = (locationId: number, productId: number) =>
      t.deps
        .db('stock_movements')
        .where({ firm_id: firm.firmId, location_id: locationId, product_id: productId })
        .where('quantity_delta', '>', 0)
        .max({ id: 'id' })
        .first();
    const northIn = Number((await lastArrival(ids.north, ids.cleaner))!.id);
    const depotIn = Number((await lastArrival(ids.depot, ids.cleaner))!.id);
    expect(rows).toEqual([
      {
        kind: 'van_below_minimum',
        subject_type: 'van',
        subject_id: ids.north,
        period_key: `p${ids.cleaner}:in${northIn}`,
      },
      {
        kind: 'depot_reorder',
        subject_type: 'product',
        subject_id: ids.cleaner,
        period_key: `d${ids.depot}:in${depotIn}`,
      },
      { kind: 'batch_expiring', subject_type: 'batch', subject_id: ids.c1, period_key: addDays(seededOn, 30) },
    ]);

    const stores = await signIn(t.app, firm.people.stores.email);
    const page = (await stores.get('/api/reminders').expect(200)).body.reminders as {
      kind: string;
      subjectType: string;
    }[];
    expect(page.map((r) => `${r.kind}/${r.subjectType}`).sort()).toEqual(
      [
        'batch_expiring/batch',
        'batch_expiring/batch',
        'depot_reorder/product',
        'depot_reorder/product',
        'van_below_minimum/van',
        'van_below_minimum/van',
        'van_below_minimum/van',
      ].sort(),
    );
  });

  it('a second scan sends nothing; the next day only a batch that has just come within 60 days', async () => {
    const { firm, seededOn } = await seedScannedStockFirm();
    expect(await runReminderScan(t.deps, firm.firmId, t.clock.now())).toEqual({ reminders: 0, emails: 0, ran: true });
    await settle();
    expect(await reminderEmailsTo(firm.people.owner.email)).toHaveLength(1);

    // A day on, RT-I2 expires in exactly 60 days. The rest are the same dip and the same expiry: not again.
    t.clock.advance(DAY_MS);
    expect(await runReminderScan(t.deps, firm.firmId, t.clock.now())).toEqual({ reminders: 1, emails: 2, ran: true });
    const owner = await waitFor("the next day's office digest", async () => {
      const all = await reminderEmailsTo(firm.people.owner.email);
      return all.length === 2 ? all.find((m) => m.text.includes('RT-I2')) : undefined;
    });
    expect(sectionsOf(owner)).toEqual({
      'Batches expiring': [
        `Test Inhibitor Beta lot RT-I2: expires on ${formatUkCalendarDate(addDays(seededOn, 61))} (in 60 days); 1 pack held: Depot-Main 1`,
      ],
    });
    expect(await runReminderScan(t.deps, firm.firmId, t.clock.now())).toEqual({ reminders: 0, emails: 0, ran: true });
    await settle();
    expect(await reminderEmailsTo(firm.people.owner.email)).toHaveLength(2);
    expect(await reminderEmailsTo(firm.people.engineer.email)).toHaveLength(1);
  });

  it('reminds again when a van dips under its minimum a second time, not while the depot line is unchanged', async () => {
    const { firm, ids } = await seedScannedStockFirm();
    // The next day's scan too (RT-I2 comes within 60 days), so the office has had two digests before this dip.
    t.clock.advance(DAY_MS);
    await runReminderScan(t.deps, firm.firmId, t.clock.now());

    // A restock brings Van-North to 4 (its target); jobs then take it back down to 1.
    await move(t, firm, transfer(ids.depot, ids.north, ids.cleaner, ids.c2, 3));
    expect(await runReminderScan(t.deps, firm.firmId, t.clock.now())).toEqual({ reminders: 0, emails: 0, ran: true });
    await move(t, firm, [
      {
        kind: 'used',
        locationId: ids.north,
        productId: ids.cleaner,
        batchId: ids.c2,
        quantityDelta: -3,
        reason: 'Cleaning job',
      },
    ]);

    const result = await runReminderScan(t.deps, firm.firmId, t.clock.now());
    expect(result).toEqual({ reminders: 1, emails: 3, ran: true });
    const engineerDigests = await waitFor('the second digest to the engineer', async () => {
      const all = await reminderEmailsTo(firm.people.engineer.email);
      return all.length === 2 ? all : undefined;
    });
    for (const m of engineerDigests)
      expect(sectionsOf(m)).toEqual({
        'Vans below their minimum stock': [
          expect.stringContaining('Van-North (RT11 NRT): Test Cleaner Alpha 1 usable'),
        ],
      });
    const owner = await waitFor('the office digest of the second dip', async () => {
      const all = await reminderEmailsTo(firm.people.owner.email);
      return all.length === 3
        ? all.find((m) => m.text.includes('Van-North') && m.subject.includes('1 reminder '))
        : undefined;
    });
    expect(sectionsOf(owner)).toEqual({
      'Vans below their minimum stock': [
        'Van-North (RT11 NRT): Test Cleaner Alpha 1 usable, under its minimum of 2 (target 4)',
      ],
    });
    expect(await t.deps.db('reminders').where({ firm_id: firm.firmId, kind: 'van_below_minimum' })).toHaveLength(2);
  });

  it('with stock reminders switched off none is sent; a save that leaves the switch out keeps it; switched on, they come', async () => {
    const other = await seedBareFirm(t, 'stock-switch');
    const depot = await addDepot(t, other, 'Depot-West');
    const van = await addVan(t, other, {
      name: 'Van-West',
      registration: 'RT55 WST',
      engineerMemberId: other.people.engineer.memberId,
      motDueOn: null,
      serviceDueOn: null,
    });
    const product = await addProduct(t, other, 'Test Cleaner Delta', 'cleaner');
    const batch = await addBatch(t, other, product, 'SW-C1', addDays(today(), 20));
    await move(t, other, [
      { kind: 'received', locationId: depot, productId: product, batchId: batch, quantityDelta: 1 },
    ]);
    await setPar(t, other, van, product, 1, 2);
    await setPar(t, other, depot, product, 2, 4);

    const admin = await signIn(t.app, other.people.admin.email);
    const off = await admin.put('/api/reminder-settings', {
      scanHour: 7,
      inspectionReminders: true,
      vanReminders: true,
      stockReminders: false,
    });
    expect(off.status).toBe(200);
    expect(off.body.settings).toMatchObject({ stockReminders: false });
    // The settings form of an older client sends no stockReminders: the switch stays off.
    const kept = await admin.put('/api/reminder-settings', {
      scanHour: 8,
      inspectionReminders: true,
      vanReminders: true,
    });
    expect(kept.body.settings).toMatchObject({ scanHour: 8, stockReminders: false });
    expect(
      (
        await admin.put('/api/reminder-settings', {
          scanHour: 8,
          inspectionReminders: true,
          vanReminders: true,
          stockReminders: 'no',
        })
      ).status,
    ).toBe(422);

    expect((await admin.post('/api/reminders/scan')).body).toEqual({ sent: 0 });
    await settle();
    expect(await reminderEmailsTo(other.people.owner.email)).toHaveLength(0);
    expect(await t.deps.db('reminders').where({ firm_id: other.firmId })).toHaveLength(0);

    expect(
      (
        await admin.put('/api/reminder-settings', {
          scanHour: 8,
          inspectionReminders: true,
          vanReminders: true,
          stockReminders: true,
        })
      ).status,
    ).toBe(200);
    expect((await admin.post('/api/reminders/scan')).body).toEqual({ sent: 3 });
    const digest = await onlyEmailTo(other.people.owner.email, /reminder/);
    expect(Object.keys(sectionsOf(digest))).toEqual([
      'Vans below their minimum stock',
      'Depot stock to reorder',
      'Batches expiring',
    ]);
    expect(sectionsOf(digest)['Depot stock to reorder']).toEqual([
      // Nothing used yet: no rate to give days of cover from.
      'Test Cleaner Delta at Depot-West: 0 usable after the planned restock, under its minimum of 2; order 4 packs to reach 4 (none used in the last 90 days)',
    ]);
  });
});
