import { addDays, BATCH_EXPIRY_WINDOW_DAYS } from '@heatfleet/domain';
import { applyMovements, type MovementLine } from '@heatfleet/api/modules/stock/stock-ledger.ts';
import type { TestApp } from './test-app.ts';
import { addDepot, addVan, seedBareFirm, todayOn, type ReminderFirm } from './reminder-fixtures.ts';

/** Movements through the real ledger, so balances and movements agree as they do in the app. */
export async function move(t: TestApp, firm: ReminderFirm, lines: MovementLine[]) {
  await t.deps.db.transaction((trx) =>
    applyMovements(trx, firm.firmId, firm.people.stores.userId, lines, t.clock.now()),
  );
}

export const transfer = (from: number, to: number, productId: number, batchId: number, n: number): MovementLine[] => [
  { kind: 'transfer_out', locationId: from, productId, batchId, quantityDelta: -n },
  { kind: 'transfer_in', locationId: to, productId, batchId, quantityDelta: n },
];

export async function addProduct(t: TestApp, firm: ReminderFirm, name: string, kind: string) {
  const [id] = (await t.deps
    .db('products')
    .insert({ firm_id: firm.firmId, name, kind, pack_size_ml: 1000 })) as number[];
  return id!;
}

export async function addBatch(t: TestApp, firm: ReminderFirm, productId: number, lot: string, expiresOn: string) {
  const [id] = (await t.deps
    .db('product_batches')
    .insert({ firm_id: firm.firmId, product_id: productId, lot_number: lot, expires_on: expiresOn })) as number[];
  return id!;
}

export async function setPar(
  t: TestApp,
  firm: ReminderFirm,
  locationId: number,
  productId: number,
  minimum: number,
  target: number,
) {
  await t.deps
    .db('par_levels')
    .insert({ firm_id: firm.firmId, location_id: locationId, product_id: productId, minimum, target });
}

export interface StockFirm {
  firm: ReminderFirm;
  /** The calendar day the batches' expiry dates were written relative to. */
  seededOn: string;
  ids: Record<'depot' | 'north' | 'south' | 'cleaner' | 'inhibitor' | 'c1' | 'c2' | 'i1' | 'i2', number>;
}

/**
 * A depot and two vans whose first scan makes three reminders: Van-North under its cleaner minimum, the depot's
 * cleaner to reorder, and batch RT-C1 expiring in 30 days. RT-I2 expires one day outside the window.
 */
export async function seedStockFirm(t: TestApp): Promise<StockFirm> {
  const firm = await seedBareFirm(t, 'stock');
  const seededOn = todayOn(t.clock);
  const d = (days: number) => addDays(seededOn, days);
  const ids = {} as StockFirm['ids'];
  ids.depot = await addDepot(t, firm, 'Depot-Main');
  // No MOT or service dates: these digests carry stock lines only.
  ids.north = await addVan(t, firm, {
    name: 'Van-North',
    registration: 'RT11 NRT',
    engineerMemberId: firm.people.engineer.memberId,
    motDueOn: null,
    serviceDueOn: null,
  });
  ids.south = await addVan(t, firm, {
    name: 'Van-South',
    registration: 'RT22 STH',
    engineerMemberId: firm.target.memberId,
    motDueOn: null,
    serviceDueOn: null,
  });
  ids.cleaner = await addProduct(t, firm, 'Test Cleaner Alpha', 'cleaner');
  ids.inhibitor = await addProduct(t, firm, 'Test Inhibitor Beta', 'inhibitor');
  ids.c1 = await addBatch(t, firm, ids.cleaner, 'RT-C1', d(30)); // expires within the window
  ids.c2 = await addBatch(t, firm, ids.cleaner, 'RT-C2', d(400));
  ids.i1 = await addBatch(t, firm, ids.inhibitor, 'RT-I1', d(500));
  ids.i2 = await addBatch(t, firm, ids.inhibitor, 'RT-I2', d(BATCH_EXPIRY_WINDOW_DAYS + 1)); // one day outside it

  await move(t, firm, [
    { kind: 'received', locationId: ids.depot, productId: ids.cleaner, batchId: ids.c1, quantityDelta: 2 },
    { kind: 'received', locationId: ids.depot, productId: ids.cleaner, batchId: ids.c2, quantityDelta: 10 },
    { kind: 'received', locationId: ids.depot, productId: ids.inhibitor, batchId: ids.i1, quantityDelta: 10 },
    { kind: 'received', locationId: ids.depot, productId: ids.inhibitor, batchId: ids.i2, quantityDelta: 1 },
  ]);
  await move(t, firm, [
    ...transfer(ids.depot, ids.north, ids.cleaner, ids.c2, 3),
    ...transfer(ids.depot, ids.north, ids.inhibitor, ids.i1, 2),
    ...transfer(ids.depot, ids.south, ids.inhibitor, ids.i1, 2),
  ]);
  await move(t, firm, [
    {
      kind: 'used',
      locationId: ids.north,
      productId: ids.cleaner,
      batchId: ids.c2,
      quantityDelta: -2,
      reason: 'Cleaning job',
    },
  ]);

  // Van-North: 1 cleaner against a minimum of 2. Van-South and both inhibitor levels are fine.
  await setPar(t, firm, ids.north, ids.cleaner, 2, 4);
  await setPar(t, firm, ids.north, ids.inhibitor, 1, 2);
  await setPar(t, firm, ids.south, ids.inhibitor, 1, 2);
  // Depot cleaner: 9 usable (RT-C1 2, RT-C2 7); the restock run plans 3 to Van-North, leaving 6 against a minimum of 8.
  await setPar(t, firm, ids.depot, ids.cleaner, 8, 12);
  await setPar(t, firm, ids.depot, ids.inhibitor, 2, 4);
  return { firm, seededOn, ids };
}
