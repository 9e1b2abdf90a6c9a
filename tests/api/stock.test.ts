import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { parse } from 'csv-parse/sync';
import { createTestApp, signIn, type Client, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';
import { tinyPdf, tinyPng } from './support/route-probes.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

/** Every balance equals the sum of its ledger rows, and none is negative. */
async function ledgerAgrees(firmId: number) {
  const [rows] = (await t.deps.db.raw(
    `SELECT b.location_id, b.batch_id, b.quantity, COALESCE(SUM(m.quantity_delta), 0) AS ledger
       FROM stock_balances b
       LEFT JOIN stock_movements m ON m.firm_id = b.firm_id AND m.location_id = b.location_id AND m.batch_id = b.batch_id
      WHERE b.firm_id = ?
      GROUP BY b.location_id, b.batch_id, b.quantity`,
    [firmId],
  )) as [{ location_id: number; batch_id: number; quantity: number; ledger: string }[]];
  const [orphans] = (await t.deps.db.raw(
    `SELECT COUNT(*) AS n FROM stock_movements m WHERE m.firm_id = ? AND NOT EXISTS
       (SELECT 1 FROM stock_balances b WHERE b.firm_id = m.firm_id AND b.location_id = m.location_id AND b.batch_id = m.batch_id)`,
    [firmId],
  )) as [{ n: number }[]];
  return { rows: rows.map((r) => ({ ...r, ledger: Number(r.ledger) })), orphans: Number(orphans[0]!.n) };
}

async function balance(firm: SeededFirm, locationId: number, batchId = firm.product.batchId): Promise<number> {
  return (
    (
      (await t.deps
        .db('stock_balances')
        .where({ firm_id: firm.firmId, location_id: locationId, batch_id: batchId })
        .first('quantity')) as { quantity: number } | undefined
    )?.quantity ?? 0
  );
}

async function clients(firm: SeededFirm, n: number, email: string): Promise<Client[]> {
  const out: Client[] = [];
  for (let i = 0; i < n; i += 1) {
    const c = await signIn(t.app, email);
    await c.refreshCsrf();
    out.push(c);
  }
  return out;
}

describe('the ledger never goes negative', () => {
  it('20 concurrent "use one pack" requests against 5 packs: exactly 5 succeed, the rest get 409, the balance is 0', async () => {
    const firm = await seedFirm(t.deps.db, 'race20');
    await t.deps.db('stock_balances').where({ firm_id: firm.firmId, location_id: firm.van.id }).update({ quantity: 5 });
    await t.deps.db('stock_movements').insert({
      firm_id: firm.firmId,
      group_id: 'topup',
      kind: 'counted',
      location_id: firm.van.id,
      product_id: firm.product.id,
      batch_id: firm.product.batchId,
      quantity_delta: 3,
      by_user_id: firm.people.stores.userId,
    });
    const engineers = await clients(firm, 20, firm.people.engineer.email);
    const results = await Promise.all(
      engineers.map((c) =>
        c.post('/api/stock/usages', {
          locationId: firm.van.id,
          productId: firm.product.id,
          quantity: 1,
          reason: 'Cleaning job',
        }),
      ),
    );
    const statuses = results.map((r) => r.status);
    expect(statuses.filter((s) => s === 201)).toHaveLength(5);
    expect(statuses.filter((s) => s === 409)).toHaveLength(15);
    expect(await balance(firm, firm.van.id)).toBe(0);
    const used = await t.deps
      .db('stock_movements')
      .where({ firm_id: firm.firmId, location_id: firm.van.id, kind: 'used' });
    expect(used).toHaveLength(5);
    const check = await ledgerAgrees(firm.firmId);
    expect(check.rows.every((r) => r.quantity === r.ledger && r.quantity >= 0)).toBe(true);
    const refused = results.find((r) => r.status === 409)!;
    expect(refused.body.message).toMatch(/usable|on hand/);
  });

  it('the same Idempotency-Key sent several times at once moves stock once', async () => {
    const firm = await seedFirm(t.deps.db, 'idem');
    const [stores] = await clients(firm, 1, firm.people.stores.email);
    const key = randomUUID();
    const send = () =>
      stores!.agent
        .post('/api/stock/transfers')
        .set('X-CSRF-Token', stores!.csrfToken)
        .set('Idempotency-Key', key)
        .send({
          fromLocationId: firm.depotId,
          toLocationId: firm.van.id,
          lines: [{ productId: firm.product.id, quantity: 3 }],
        });
    const results = await Promise.all([send(), send(), send(), send(), send()]);
    expect(results.map((r) => r.status)).toEqual([201, 201, 201, 201, 201]);
    expect(new Set(results.map((r) => r.body.groupId)).size).toBe(1);
    expect(await balance(firm, firm.depotId)).toBe(7);
    expect(await balance(firm, firm.van.id)).toBe(5);
  });

  it('a property test: random movement sequences, some concurrent, keep every balance equal to its ledger and never negative', async () => {
    const firm = await seedFirm(t.deps.db, 'prop');
    const [stores] = await clients(firm, 1, firm.people.stores.email);
    const places = [firm.depotId, firm.van.id, firm.spareVanId];
    const action = fc.oneof(
      fc.record({ type: fc.constant('receive' as const), qty: fc.integer({ min: 1, max: 6 }) }),
      fc.record({
        type: fc.constant('transfer' as const),
        from: fc.constantFrom(...places),
        to: fc.constantFrom(...places),
        qty: fc.integer({ min: 1, max: 8 }),
      }),
      fc.record({
        type: fc.constant('use' as const),
        at: fc.constantFrom(...places),
        qty: fc.integer({ min: 1, max: 5 }),
      }),
      fc.record({
        type: fc.constant('count' as const),
        at: fc.constantFrom(...places),
        counted: fc.integer({ min: 0, max: 12 }),
      }),
      fc.record({
        type: fc.constant('writeOff' as const),
        at: fc.constantFrom(...places),
        qty: fc.integer({ min: 1, max: 4 }),
      }),
    );
    const run = (a: { type: string; qty?: number; from?: number; to?: number; at?: number; counted?: number }) => {
      const x = a;
      switch (x.type) {
        case 'receive':
          return stores!.post('/api/stock/receipts', {
            locationId: firm.depotId,
            lines: [
              {
                productId: firm.product.id,
                lotNumber: firm.product.lotNumber,
                expiresOn: '2030-01-31',
                quantity: x.qty,
              },
            ],
          });
        case 'transfer':
          return stores!.post('/api/stock/transfers', {
            fromLocationId: x.from,
            toLocationId: x.to,
            lines: [{ productId: firm.product.id, quantity: x.qty }],
          });
        case 'use':
          return stores!.post('/api/stock/usages', {
            locationId: x.at,
            productId: firm.product.id,
            quantity: x.qty,
            reason: 'Property test',
          });
        case 'count':
          return stores!.post('/api/stock/stocktakes', {
            locationId: x.at,
            counts: [{ batchId: firm.product.batchId, counted: x.counted }],
          });
        default:
          return stores!.post('/api/stock/write-offs', {
            locationId: x.at,
            batchId: firm.product.batchId,
            quantity: x.qty,
            reason: 'damaged',
          });
      }
    };
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.array(action, { minLength: 1, maxLength: 4 }), { minLength: 1, maxLength: 5 }),
        async (rounds) => {
          for (const round of rounds) {
            // Each round's actions run at the same moment; rounds run one after another.
            const results = await Promise.all(round.map(run));
            for (const r of results) expect([201, 409, 422]).toContain(r.status);
          }
          const check = await ledgerAgrees(firm.firmId);
          expect(check.orphans).toBe(0);
          for (const r of check.rows) {
            expect(r.quantity).toBe(r.ledger);
            expect(r.quantity).toBeGreaterThanOrEqual(0);
          }
        },
      ),
      { numRuns: 12, seed: 20261201 },
    );
  }, 120_000);

  it('refuses to use or move an expired batch, which can only be written off', async () => {
    const firm = await seedFirm(t.deps.db, 'expired');
    await t.deps.db('product_batches').where({ id: firm.product.batchId }).update({ expires_on: '2026-01-31' });
    const [stores] = await clients(firm, 1, firm.people.stores.email);
    const moved = await stores!.post('/api/stock/transfers', {
      fromLocationId: firm.depotId,
      toLocationId: firm.van.id,
      lines: [{ productId: firm.product.id, batchId: firm.product.batchId, quantity: 1 }],
    });
    expect(moved.status).toBe(409);
    expect(moved.body.message).toMatch(/expired on 2026-01-31/);
    const fefo = await stores!.post('/api/stock/transfers', {
      fromLocationId: firm.depotId,
      toLocationId: firm.van.id,
      lines: [{ productId: firm.product.id, quantity: 1 }],
    });
    expect(fefo.status).toBe(409);
    const written = await stores!.post('/api/stock/write-offs', {
      locationId: firm.depotId,
      batchId: firm.product.batchId,
      quantity: 10,
      reason: 'expired',
    });
    expect(written.status).toBe(201);
    expect(await balance(firm, firm.depotId)).toBe(0);
  });

  it('a reversal points at the movement it undoes, undoes a transfer whole, and only once', async () => {
    const firm = await seedFirm(t.deps.db, 'reverse');
    const [stores] = await clients(firm, 1, firm.people.stores.email);
    const moved = await stores!.post('/api/stock/transfers', {
      fromLocationId: firm.depotId,
      toLocationId: firm.van.id,
      lines: [{ productId: firm.product.id, quantity: 4 }],
    });
    const out = moved.body.movements.find((m: { kind: string }) => m.kind === 'transfer_out');
    const undo = await stores!.post(`/api/stock/movements/${out.id}/reverse`, { reason: 'Sent to the wrong van' });
    expect(undo.status).toBe(201);
    expect(undo.body.movements).toHaveLength(2);
    expect(
      undo.body.movements.every((m: { reversesMovementId: number }) =>
        moved.body.movements.some((o: { id: number }) => o.id === m.reversesMovementId),
      ),
    ).toBe(true);
    expect(await balance(firm, firm.depotId)).toBe(10);
    expect(await balance(firm, firm.van.id)).toBe(2);
    expect((await stores!.post(`/api/stock/movements/${out.id}/reverse`, { reason: 'Again' })).status).toBe(409);
  });
});

describe('restock and reorder', () => {
  it('computes the run from par levels FEFO, applies it all at once, and the engineer sees it on My van', async () => {
    const firm = await seedFirm(t.deps.db, 'restock');
    // A second, sooner-expiring lot at the depot: the run must take it first.
    const [soonId] = (await t.deps.db('product_batches').insert({
      firm_id: firm.firmId,
      product_id: firm.product.id,
      lot_number: `SOON${firm.firmId}`,
      expires_on: '2027-03-31',
    })) as number[];
    await t.deps.db('stock_balances').insert({
      firm_id: firm.firmId,
      location_id: firm.depotId,
      batch_id: soonId,
      product_id: firm.product.id,
      quantity: 1,
    });
    await t.deps.db('stock_movements').insert({
      firm_id: firm.firmId,
      group_id: 'soon',
      kind: 'received',
      location_id: firm.depotId,
      product_id: firm.product.id,
      batch_id: soonId,
      quantity_delta: 1,
      by_user_id: firm.people.stores.userId,
    });
    const [stores] = await clients(firm, 1, firm.people.stores.email);
    const plan = await stores!.get(`/api/stock/restock-run?depotId=${firm.depotId}`).expect(200);
    // Van: 2 usable, target 5 -> 3 wanted: 1 from the sooner lot, 2 from the later one.
    const line = plan.body.lines.find((l: { locationId: number }) => l.locationId === firm.van.id);
    expect(line.wanted).toBe(3);
    expect(line.allocations.map((a: { batchId: number; quantity: number }) => [a.batchId, a.quantity])).toEqual([
      [soonId, 1],
      [firm.product.batchId, 2],
    ]);
    // The lines' van and product are named once each beside them, not on every line.
    expect(plan.body.vans).toEqual([expect.objectContaining({ id: firm.van.id, registration: firm.van.registration })]);
    expect(plan.body.products).toEqual([expect.objectContaining({ id: firm.product.id, name: firm.product.name })]);
    expect(line.van).toBeUndefined();
    // Depot after the run: 11 - 3 = 8, under its minimum of 20: order 30 - 8 = 22.
    expect(plan.body.reorder).toEqual([
      expect.objectContaining({ productId: firm.product.id, usableAfterTransfers: 8, orderQuantity: 22 }),
    ]);

    const apply = await stores!.post(`/api/stock/restock-run?depotId=${firm.depotId}`, {
      lines: line.allocations.map((a: { batchId: number; quantity: number }) => ({
        toLocationId: firm.van.id,
        productId: firm.product.id,
        batchId: a.batchId,
        quantity: a.quantity,
      })),
    });
    expect(apply.status).toBe(201);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const mine = await engineer.get('/api/me/van/stock').expect(200);
    expect(mine.body.stock.find((s: { productId: number }) => s.productId === firm.product.id)).toMatchObject({
      usable: 5,
      health: 'ok',
    });

    // All or none: one bad line (more than the depot has) moves nothing.
    const before = await balance(firm, firm.depotId);
    const bad = await stores!.post(`/api/stock/restock-run?depotId=${firm.depotId}`, {
      lines: [
        { toLocationId: firm.van.id, productId: firm.product.id, batchId: firm.product.batchId, quantity: 1 },
        { toLocationId: firm.spareVanId, productId: firm.product.id, batchId: firm.product.batchId, quantity: 999 },
      ],
    });
    expect(bad.status).toBe(409);
    expect(await balance(firm, firm.depotId)).toBe(before);
  });

  it('exports the reorder list and the ledger as CSV that parses back, with formulas defused', async () => {
    const firm = await seedFirm(t.deps.db, 'csv');
    const [stores] = await clients(firm, 1, firm.people.stores.email);
    await stores!.post('/api/stock/usages', {
      locationId: firm.van.id,
      productId: firm.product.id,
      quantity: 1,
      reason: '=HYPERLINK("x"), "quoted", and a\nnew line',
    });
    const csv = await stores!.get(`/api/stock/movements.csv?productId=${firm.product.id}`).expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.headers['content-disposition']).toMatch(/attachment/);
    const rows = parse(csv.text, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(4);
    const used = rows.find((r) => r.kind === 'used')!;
    expect(used.reason).toBe('\'=HYPERLINK("x"), "quoted", and a\nnew line');
    expect(Number(used.quantity)).toBe(-1);
    const reorder = await stores!.get(`/api/stock/reorder-list.csv?depotId=${firm.depotId}`).expect(200);
    const lines = parse(reorder.text, { columns: true }) as Record<string, string>[];
    // The van used 1 (2 -> 1), so the run sends it 4 and leaves the depot 6, under its minimum of 20:
    // order 30 - 6 = 24. 1 pack used in 90 days lasts 90 days a pack: 6 packs, 540 days.
    expect(lines).toEqual([
      expect.objectContaining({
        product: firm.product.name,
        'pack size': '1 L',
        'usable after restock (packs)': '6',
        'order (packs)': '24',
        'days of cover': '540',
        'cost per pack (GBP)': '',
      }),
      // The last row totals the order; without a cost price the line adds nothing and the row says so.
      expect.objectContaining({
        product: 'Total (lines with a cost price)',
        'order (packs)': '24',
        'line cost (GBP)': '0.00',
      }),
    ]);
  });

  it('writes a ledger longer than one read (2,000 movements) whole, newest first, each movement once', async () => {
    const firm = await seedFirm(t.deps.db, 'csvlong');
    const [stores] = await clients(firm, 1, firm.people.stores.email);
    // 4,500 counted movements written straight into the ledger: the export reads them 2,000 at a time.
    const rows = Array.from({ length: 4_500 }, (_, i) => ({
      firm_id: firm.firmId,
      group_id: `long-${i}`,
      kind: 'counted',
      location_id: firm.depotId,
      product_id: firm.product.id,
      batch_id: firm.product.batchId,
      quantity_delta: 1,
      reason: `Row ${i}`,
      by_user_id: firm.people.stores.userId,
    }));
    await t.deps.db.batchInsert('stock_movements', rows, 1_000);
    const ids = (
      (await t.deps.db('stock_movements').where('firm_id', firm.firmId).orderBy('id', 'desc').select('id')) as {
        id: number;
      }[]
    ).map((r) => String(r.id));
    expect(ids.length).toBeGreaterThan(4_500);
    const csv = await stores!.get('/api/stock/movements.csv').expect(200);
    const parsed = parse(csv.text, { columns: true }) as Record<string, string>[];
    expect(parsed.map((r) => r.id)).toEqual(ids);
    expect(parsed.filter((r) => r.reason === 'Row 0')).toHaveLength(1);
    expect(Object.keys(parsed[0]!)[1]).toBe('when (Europe/London)');
  });

  it('pages the ledger by keyset without gaps or repeats', async () => {
    const firm = await seedFirm(t.deps.db, 'keyset');
    const [stores] = await clients(firm, 1, firm.people.stores.email);
    for (let i = 0; i < 7; i += 1)
      await stores!.post('/api/stock/usages', {
        locationId: firm.depotId,
        productId: firm.product.id,
        quantity: 1,
        reason: `Use ${i}`,
      });
    const seen: number[] = [];
    let cursor: number | null = null;
    do {
      const page: { body: { movements: { id: number }[]; nextCursor: number | null } } = await stores!
        .get(`/api/stock/movements?limit=3${cursor ? `&before=${cursor}` : ''}`)
        .expect(200);
      seen.push(...page.body.movements.map((m: { id: number }) => m.id));
      cursor = page.body.nextCursor;
    } while (cursor);
    expect(seen).toHaveLength(10);
    expect([...seen].sort((a, b) => b - a)).toEqual(seen);
    expect(new Set(seen).size).toBe(10);
  });
});

describe('products', () => {
  it('keeps pack sizes in millilitres, refuses a pack over 25 litres, and takes the firm\u2019s own kind', async () => {
    const firm = await seedFirm(t.deps.db, 'product');
    const [stores] = await clients(firm, 1, firm.people.stores.email);
    const ok = await stores!.post('/api/products', {
      name: 'Demo inhibitor',
      kind: 'inhibitor',
      packSize: 0.5,
      packUnit: 'l',
      doseLitresPer100L: 1,
      radiatorsPerPack: 10,
    });
    expect(ok.status).toBe(201);
    expect(ok.body.product.packSizeMl).toBe(500);
    const big = await stores!.post('/api/products', { name: 'Too big', kind: 'cleaner', packSize: 30, packUnit: 'l' });
    expect(big.status).toBe(422);
    expect(big.body.message).toMatch(/25 litres/);
    const own = await stores!.post('/api/products', {
      name: 'Demo pipe lubricant',
      kind: 'other',
      ownKind: 'Pipe lubricant',
      packSize: 250,
      packUnit: 'ml',
    });
    expect(own.status).toBe(201);
    expect(own.body.product).toMatchObject({ kind: 'other', ownKind: 'Pipe lubricant' });
    const unnamed = await stores!.post('/api/products', {
      name: 'Demo unnamed',
      kind: 'other',
      packSize: 1,
      packUnit: 'l',
    });
    expect(unnamed.status).toBe(422);
    expect(unnamed.body.details[0].path).toBe('ownKind');
  });

  it('takes a safety data sheet as a PDF only, and serves it as an attachment to its firm', async () => {
    const firm = await seedFirm(t.deps.db, 'sds');
    const other = await seedFirm(t.deps.db, 'sds-other');
    const [stores] = await clients(firm, 1, firm.people.stores.email);
    const notPdf = await stores!.upload(
      `/api/products/${firm.product.id}/safety-data-sheet`,
      {},
      { field: 'file', content: tinyPng, filename: 'sheet.pdf', contentType: 'application/pdf' },
    );
    expect(notPdf.status).toBe(422);
    const ok = await stores!.upload(
      `/api/products/${firm.product.id}/safety-data-sheet`,
      {},
      { field: 'file', content: tinyPdf, filename: 'sheet.pdf', contentType: 'application/pdf' },
    );
    expect(ok.status).toBe(200);
    const file = await stores!.get(ok.body.product.safetyDataSheet.url).expect(200);
    expect(file.headers['content-disposition']).toMatch(/^attachment;/);
    expect(file.headers['content-type']).toBe('application/pdf');
    const outsider = await signIn(t.app, other.people.owner.email);
    await outsider.get(ok.body.product.safetyDataSheet.url).expect(404);
  });
});
