import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, calendarDateIn, DEFAULT_TIME_ZONE } from '@heatfleet/domain';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';

// Receiving and stocktake safeguards (issue 14). The minimum remaining life of 90 days and what
// counts as a large count are common practice (no source); the ledger rules are DEVELOPERS.md,
// Product rules (balances equal their ledger, never negative).

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

const today = () => calendarDateIn(t.clock.now(), DEFAULT_TIME_ZONE);

async function balance(firm: SeededFirm, locationId: number, batchId: number): Promise<number> {
  const row = (await t.deps
    .db('stock_balances')
    .where({ firm_id: firm.firmId, location_id: locationId, batch_id: batchId })
    .first('quantity')) as { quantity: number } | undefined;
  return row?.quantity ?? 0;
}

async function movementCount(firm: SeededFirm): Promise<number> {
  const [row] = (await t.deps.db('stock_movements').where({ firm_id: firm.firmId }).count({ n: '*' })) as {
    n: number;
  }[];
  return Number(row!.n);
}

describe('receiving', () => {
  it('refuses a lot that has expired, in the user\u2019s words, and records nothing', async () => {
    const firm = await seedFirm(t.deps.db, 'rcv-expired');
    const stores = await signIn(t.app, firm.people.stores.email);
    const before = await movementCount(firm);
    const res = await stores.post('/api/stock/receipts', {
      locationId: firm.depotId,
      lines: [{ productId: firm.product.id, lotNumber: 'OLD-17', expiresOn: addDays(today(), -510), quantity: 4 }],
    });
    expect(res.status).toBe(422);
    expect(res.body.error).toBe('LotExpired');
    expect(res.body.message).toMatch(/Lot OLD-17 expired on .*Write it off instead/);
    expect(res.body.details).toEqual([expect.objectContaining({ path: 'lines.0.expiresOn' })]);
    expect(await movementCount(firm)).toBe(before);
    expect(await t.deps.db('product_batches').where({ firm_id: firm.firmId, lot_number: 'OLD-17' })).toHaveLength(0);
  });

  it('asks to confirm a lot with less than the product\u2019s minimum life, and takes it when confirmed', async () => {
    const firm = await seedFirm(t.deps.db, 'rcv-short');
    const stores = await signIn(t.app, firm.people.stores.email);
    const body = {
      locationId: firm.depotId,
      lines: [{ productId: firm.product.id, lotNumber: 'SHORT-1', expiresOn: addDays(today(), 30), quantity: 2 }],
    };
    const refused = await stores.post('/api/stock/receipts', body);
    expect(refused.status).toBe(422);
    expect(refused.body.error).toBe('ShortShelfLife');
    expect(refused.body.message).toContain('30 days of use left, under the 90 days');
    expect(await t.deps.db('product_batches').where({ firm_id: firm.firmId, lot_number: 'SHORT-1' })).toHaveLength(0);

    const taken = await stores.post('/api/stock/receipts', { ...body, confirmShortLife: true });
    expect(taken.status).toBe(201);
    expect(taken.body.movements).toEqual([expect.objectContaining({ kind: 'received', quantityDelta: 2 })]);

    // A lot with exactly the minimum (90 days) left needs no confirm.
    const fine = await stores.post('/api/stock/receipts', {
      ...body,
      lines: [{ ...body.lines[0]!, lotNumber: 'FINE-90', expiresOn: addDays(today(), 90) }],
    });
    expect(fine.status).toBe(201);
  });

  it('keeps the product\u2019s own minimum life, supplier code and cost price (whole pence)', async () => {
    const firm = await seedFirm(t.deps.db, 'rcv-product');
    const stores = await signIn(t.app, firm.people.stores.email);
    const created = await stores.post('/api/products', {
      name: 'Safeguard inhibitor',
      kind: 'inhibitor',
      packSize: 1,
      packUnit: 'l',
      minShelfLifeDays: 10,
      supplierCode: 'INH-1L-A',
      costPricePence: 1250,
    });
    expect(created.status).toBe(201);
    expect(created.body.product).toMatchObject({
      minShelfLifeDays: 10,
      supplierCode: 'INH-1L-A',
      costPricePence: 1250,
    });
    expect(
      (
        await stores.post('/api/products', {
          name: 'Half pence',
          kind: 'cleaner',
          packSize: 1,
          packUnit: 'l',
          costPricePence: 12.5,
        })
      ).body.message,
    ).toMatch(/whole pence/);
    // 30 days left is fine for a product that asks for 10.
    const res = await stores.post('/api/stock/receipts', {
      locationId: firm.depotId,
      lines: [{ productId: created.body.product.id, lotNumber: 'I-30', expiresOn: addDays(today(), 30), quantity: 1 }],
    });
    expect(res.status).toBe(201);
    // A product made without the setting gets the default of 90 days.
    expect((await stores.get(`/api/products/${firm.product.id}`)).body.product.minShelfLifeDays).toBe(90);
  });
});

describe('stocktake', () => {
  it('refuses to count a whole van down to nothing unless confirmed, then records it', async () => {
    const firm = await seedFirm(t.deps.db, 'st-zero');
    const stores = await signIn(t.app, firm.people.stores.email);
    const body = { locationId: firm.van.id, counts: [{ batchId: firm.product.batchId, counted: 0 }] };
    const refused = await stores.post('/api/stock/stocktakes', body);
    expect(refused.status).toBe(422);
    expect(refused.body.error).toBe('ConfirmZeroing');
    expect(refused.body.message).toMatch(/leaves .* with no stock at all/);
    expect(await balance(firm, firm.van.id, firm.product.batchId)).toBe(2);

    const done = await stores.post('/api/stock/stocktakes', { ...body, confirmZeroing: true });
    expect(done.status).toBe(201);
    // The answer is the summary the screen shows: one adjustment of -2.
    expect(done.body.movements).toEqual([expect.objectContaining({ kind: 'counted', quantityDelta: -2 })]);
    expect(await balance(firm, firm.van.id, firm.product.batchId)).toBe(0);
  });

  it('records a found lot with its product, lot and expiry, beside the counted ones', async () => {
    const firm = await seedFirm(t.deps.db, 'st-found');
    const stores = await signIn(t.app, firm.people.stores.email);
    const expiresOn = addDays(today(), 200);
    const res = await stores.post('/api/stock/stocktakes', {
      locationId: firm.depotId,
      counts: [{ batchId: firm.product.batchId, counted: 9 }],
      found: [{ productId: firm.product.id, lotNumber: 'FOUND-7', expiresOn, counted: 3 }],
      note: 'Back shelf',
    });
    expect(res.status).toBe(201);
    const deltas = res.body.movements.map((m: { batch: { lotNumber: string }; quantityDelta: number }) => [
      m.batch.lotNumber,
      m.quantityDelta,
    ]);
    expect(deltas).toEqual(
      expect.arrayContaining([
        [firm.product.lotNumber, -1],
        ['FOUND-7', 3],
      ]),
    );
    const found = (await t.deps
      .db('product_batches')
      .where({ firm_id: firm.firmId, lot_number: 'FOUND-7' })
      .first('id', 'expires_on')) as { id: number; expires_on: string };
    expect(found.expires_on).toBe(expiresOn);
    expect(await balance(firm, firm.depotId, found.id)).toBe(3);

    // The same lot with another expiry is refused (a lot has one expiry).
    const clash = await stores.post('/api/stock/stocktakes', {
      locationId: firm.depotId,
      found: [{ productId: firm.product.id, lotNumber: 'FOUND-7', expiresOn: addDays(expiresOn, 1), counted: 1 }],
    });
    expect(clash.status).toBe(400);
    expect(await balance(firm, firm.depotId, found.id)).toBe(3);
  });

  it('refuses a stocktake with nothing counted, and another firm\u2019s product as a found lot', async () => {
    const firm = await seedFirm(t.deps.db, 'st-empty');
    const other = await seedFirm(t.deps.db, 'st-other');
    const stores = await signIn(t.app, firm.people.stores.email);
    const none = await stores.post('/api/stock/stocktakes', { locationId: firm.depotId });
    expect(none.status).toBe(422);
    expect(none.body.message).toMatch(/Count at least one batch/);
    const foreign = await stores.post('/api/stock/stocktakes', {
      locationId: firm.depotId,
      found: [{ productId: other.product.id, lotNumber: 'X', expiresOn: addDays(today(), 200), counted: 1 }],
    });
    expect(foreign.status).toBe(404);
  });
});
