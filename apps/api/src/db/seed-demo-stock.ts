import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { addDays, calendarDateIn, DEFAULT_TIME_ZONE } from '@heatfleet/domain';

// Invented products for the demo: no real brand, and the dose and target figures are made up
// for the screens to have something to show. A firm enters its own from the product labels.
const demoProducts = [
  {
    name: 'HFL System Cleaner',
    kind: 'cleaner',
    ml: 1000,
    dose: 1,
    rads: 10,
    shelf: 36,
    circulate: 60,
    hazard: 'Irritant to eyes and skin. Wear gloves and eye protection. Never mix with other cleaners.',
  },
  {
    name: 'HFL Rapid Cleaner',
    kind: 'cleaner',
    ml: 500,
    dose: 0.5,
    rads: 8,
    shelf: 24,
    circulate: 30,
    hazard: 'Irritant to eyes and skin. Wear gloves and eye protection.',
  },
  {
    name: 'HFL Inhibitor',
    kind: 'inhibitor',
    ml: 1000,
    dose: 1,
    rads: 10,
    shelf: 48,
    min: 1,
    max: 1.5,
    unit: '% v/v',
    test: 'Refractometer reading against the chart on the pack',
    hazard: 'Avoid contact with eyes.',
  },
  {
    name: 'HFL Descaler',
    kind: 'descaler',
    ml: 1000,
    dose: 2,
    rads: null,
    shelf: 24,
    hazard: 'Acidic. Corrosive to eyes. Wear gloves and eye protection; rinse spills at once.',
  },
  {
    name: 'HFL Leak Sealer',
    kind: 'leak_sealer',
    ml: 500,
    dose: 0.5,
    rads: null,
    shelf: 24,
    hazard: 'Avoid contact with eyes.',
  },
  {
    name: 'HFL Neutraliser',
    kind: 'neutraliser',
    ml: 1000,
    dose: 1,
    rads: null,
    shelf: 36,
    hazard: 'Alkaline. Wear gloves and eye protection.',
  },
] as const;

type Trx = Knex.Transaction;

export async function seedDemoStock(
  trx: Trx,
  firmIds: { brackenford: number; tarnside: number },
  now: Date,
): Promise<void> {
  const today = calendarDateIn(now, DEFAULT_TIME_ZONE);
  const firmId = firmIds.brackenford;
  const depot = (await trx('locations').where({ firm_id: firmId, kind: 'depot' }).first('id')) as { id: number };
  const vans = (await trx('locations').where({ firm_id: firmId, kind: 'van' }).orderBy('id').select('id')) as {
    id: number;
  }[];
  const stores = ((await trx('users').where({ email: 'stores@brackenford.example' }).first('id')) as { id: number }).id;
  const engineer = ((await trx('users').where({ email: 'engineer@brackenford.example' }).first('id')) as { id: number })
    .id;

  let lot = 4100;
  for (const [i, p] of demoProducts.entries()) {
    const [productId] = (await trx('products').insert({
      firm_id: firmId,
      name: p.name,
      kind: p.kind,
      pack_size_ml: p.ml,
      dose_litres_per_100l: p.dose,
      radiators_per_pack: p.rads,
      target_min: 'min' in p ? p.min : null,
      target_max: 'max' in p ? p.max : null,
      target_unit: 'unit' in p ? p.unit : null,
      test_method: 'test' in p ? p.test : null,
      shelf_life_months: p.shelf,
      hazard_notes: p.hazard,
      min_circulation_minutes: 'circulate' in p ? p.circulate : null,
    })) as number[];
    // Two lots at the depot: one expiring within two months (for FEFO and the expiry reminder), one later.
    const lots = [
      { lot: `L${(lot += 7)}`, expires: addDays(today, 45 + i * 3), depotQty: 4 },
      { lot: `L${(lot += 7)}`, expires: addDays(today, 500 + i * 10), depotQty: i < 2 || i === 2 ? 14 : 6 },
    ];
    const balances = new Map<string, number>();
    const move = async (
      kind: string,
      locationId: number,
      batchId: number,
      delta: number,
      by: number,
      ago: number,
      reason: string | null,
    ) => {
      await trx('stock_movements').insert({
        firm_id: firmId,
        group_id: randomUUID(),
        kind,
        location_id: locationId,
        product_id: productId,
        batch_id: batchId,
        quantity_delta: delta,
        reason,
        by_user_id: by,
        created_at: new Date(now.getTime() - ago * 86_400_000),
      });
      const key = `${locationId}:${batchId}`;
      balances.set(key, (balances.get(key) ?? 0) + delta);
    };
    for (const [n, l] of lots.entries()) {
      const [batchId] = (await trx('product_batches').insert({
        firm_id: firmId,
        product_id: productId,
        lot_number: l.lot,
        expires_on: l.expires,
      })) as number[];
      const travels = i <= 2 && n === 0;
      await move('received', depot.id, batchId!, l.depotQty + (travels ? vans.length * 2 : 4), stores, 80, null);
      if (travels) {
        // Cleaners and inhibitor travel on every van; vans 1 and 3 have used theirs, so sit below minimum.
        for (const [v, van] of vans.entries()) {
          await move('transfer_out', depot.id, batchId!, -2, stores, 60, null);
          await move('transfer_in', van.id, batchId!, 2, stores, 60, null);
          if (v === 0 || v === 2) await move('used', van.id, batchId!, -2, engineer, 20 - v, 'Cleaning job');
        }
      } else {
        await move('used', depot.id, batchId!, -4, stores, 30, 'Workshop flush tests');
      }
    }
    for (const [key, quantity] of balances) {
      const [locationId, batchId] = key.split(':').map(Number);
      await trx('stock_balances').insert({
        firm_id: firmId,
        location_id: locationId,
        batch_id: batchId,
        product_id: productId,
        quantity,
      });
    }
    if (i <= 2) {
      for (const van of vans)
        await trx('par_levels').insert({
          firm_id: firmId,
          location_id: van.id,
          product_id: productId,
          minimum: 1,
          target: 3,
        });
      await trx('par_levels').insert({
        firm_id: firmId,
        location_id: depot.id,
        product_id: productId,
        minimum: 12,
        target: 24,
      });
    }
  }
}
