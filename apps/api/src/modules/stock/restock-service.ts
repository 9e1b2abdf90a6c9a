import { ForbiddenError } from '@casl/ability';
import {
  allocateFefo,
  calendarDateIn,
  DEFAULT_TIME_ZONE,
  planReorder,
  planRestock,
  type BatchStock,
  type RestockApplied,
  type RestockApplyInput,
  type RestockRun,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { conflict, notFound } from '../../lib/http-error.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { firstDepot, findLocation } from '../locations/location-dal.ts';
import { findFirm } from '../firms/firm-dal.ts';
import { firmToday } from '../firms/firm-today.ts';
import { firmBookedJobs } from './booked-need-service.ts';
import { findBatch, listProductOrderRefs } from './product-dal.ts';
import { reorderCsv } from './stock-csv.ts';
import { balancesAt } from './stock-ledger-dal.ts';
import { applyMovements } from './stock-ledger.ts';
import { listActiveVanRefs } from './stock-level-dal.ts';
import { stockLevels } from './stock-query-service.ts';
import { packsUsedLast90Days } from './usage-service.ts';

type Db = Knex | Knex.Transaction;

async function depotOf(db: Db, actor: Actor, depotId?: number) {
  const depot = depotId ? await findLocation(db, actor.firmId, depotId) : await firstDepot(db, actor.firmId);
  if (!depot || depot.kind !== 'depot') throw notFound('That depot');
  return depot;
}

async function depotBatches(db: Db, firmId: number, depotId: number): Promise<Map<number, BatchStock[]>> {
  const map = new Map<number, BatchStock[]>();
  for (const b of await balancesAt(db, firmId, depotId)) {
    map.set(b.product_id, [
      ...(map.get(b.product_id) ?? []),
      { batchId: b.batch_id, lotNumber: b.lot_number, expiresOn: b.expires_on, quantity: b.quantity },
    ]);
  }
  return map;
}

/**
 * The restock run and the reorder list it leaves, computed from balances (not summed from the ledger).
 * Each van is filled to its need: its par target, or what its booked jobs of the firm's restock window
 * need plus its minimum, whichever is larger.
 */
export async function computeRestock(db: Db, deps: AppDeps, actor: Actor, depotId?: number): Promise<RestockRun> {
  const depot = await depotOf(db, actor, depotId);
  const timeZone = (await findFirm(db, actor.firmId))?.time_zone ?? DEFAULT_TIME_ZONE;
  const today = calendarDateIn(deps.clock.now(), timeZone);
  const bookedJobs = firmBookedJobs(db, actor.firmId, today);
  // The levels' reads run beside the booked jobs' and wait for them only to count their packs.
  const [booked, vans, products, batches, usedBy, levels] = await Promise.all([
    bookedJobs,
    listActiveVanRefs(db, actor.firmId),
    listProductOrderRefs(db, actor.firmId),
    depotBatches(db, actor.firmId, depot.id),
    packsUsedLast90Days(db, actor.firmId, timeZone, today),
    stockLevels(
      db,
      actor.firmId,
      today,
      {},
      bookedJobs.then((b) => b.packs),
    ),
  ]);
  const vanIds = new Set(vans.map((v) => v.id));
  const needs = levels
    .filter((c) => vanIds.has(c.locationId) && (c.par || c.booked > 0))
    .map((c) => ({ locationId: c.locationId, productId: c.productId, usable: c.usable, par: c.par, booked: c.booked }));
  const lines = planRestock(needs, batches, today);
  const depotPar = new Map(levels.filter((c) => c.locationId === depot.id && c.par).map((c) => [c.productId, c.par!]));
  const reorder = planReorder(
    products.map((p) => ({
      productId: p.id,
      depotBatches: batches.get(p.id) ?? [],
      par: depotPar.get(p.id) ?? null,
      used90Days: usedBy.get(p.id) ?? 0,
    })),
    lines,
    today,
  );
  const vanById = new Map(vans.map((v) => [v.id, v]));
  const productById = new Map(products.map((p) => [p.id, p]));
  const ref = (id: number) => {
    const p = productById.get(id)!;
    return { id: p.id, name: p.name, packSizeMl: p.packSizeMl };
  };
  const reorderRows = reorder.map((r) => {
    const p = productById.get(r.productId)!;
    return {
      ...r,
      product: { ...ref(r.productId), supplierCode: p.supplierCode, costPricePence: p.costPricePence },
      lineCostPence: p.costPricePence === null ? null : p.costPricePence * r.orderQuantity,
    };
  });
  return {
    today,
    restockDays: booked.days,
    depot: { id: depot.id, name: depot.name },
    lines,
    vans: [...new Set(lines.map((l) => l.locationId))].map((id) => vanById.get(id)!),
    products: [...new Set(lines.map((l) => l.productId))].map(ref),
    reorder: reorderRows,
    reorderTotalPence: reorderRows.reduce((n, r) => n + (r.lineCostPence ?? 0), 0),
  };
}

export async function getRestockRun(deps: AppDeps, actor: Actor, depotId?: number): Promise<RestockRun> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  return computeRestock(deps.db, deps, actor, depotId);
}

/**
 * Applies a reviewed restock run as transfers from the depot: all of them, or none. A line that
 * names its lot moves that lot; a line without one (a quantity changed in review) is taken from the
 * depot first expiry first, after what the lines before it took. Every decrease is checked against
 * the depot's balance in the same transaction, so stock that moved since the review refuses the run.
 */
export async function applyRestockRun(
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  input: RestockApplyInput,
  depotId?: number,
): Promise<string> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Stock');
  const depot = await depotOf(trx, actor, depotId);
  const today = await firmToday(trx, actor.firmId, deps.clock.now());
  const stock = await depotBatches(trx, actor.firmId, depot.id);
  const lines = [];
  for (const l of input.lines) {
    const van = await findLocation(trx, actor.firmId, l.toLocationId);
    if (!van || van.kind !== 'van' || !van.active) throw notFound('That van');
    let picks: { batchId: number; quantity: number }[];
    if (l.batchId) {
      const b = await findBatch(trx, actor.firmId, l.batchId, l.productId);
      if (!b) throw notFound('That batch');
      if (b.expires_on < today)
        throw conflict(`Lot ${b.lot_number} has expired since the run was computed; compute it again.`);
      picks = [{ batchId: b.id, quantity: l.quantity }];
    } else {
      const held = stock.get(l.productId) ?? [];
      const plan = allocateFefo(held, l.quantity, today);
      if (plan.shortfall > 0) {
        const name = (await listProductOrderRefs(trx, actor.firmId)).find((p) => p.id === l.productId)?.name;
        if (!name) throw notFound('That product');
        throw conflict(
          `${depot.name} holds ${l.quantity - plan.shortfall} usable pack${l.quantity - plan.shortfall === 1 ? '' : 's'} of ${name} for this run; ${l.quantity} asked for ${van.name}. Nothing was moved.`,
        );
      }
      picks = plan.allocations;
    }
    for (const pick of picks) {
      const held = stock.get(l.productId)?.find((b) => b.batchId === pick.batchId);
      if (held) held.quantity -= pick.quantity;
      lines.push(
        {
          kind: 'transfer_out' as const,
          locationId: depot.id,
          productId: l.productId,
          batchId: pick.batchId,
          quantityDelta: -pick.quantity,
          reason: `Restock run to ${van.name}`,
        },
        {
          kind: 'transfer_in' as const,
          locationId: van.id,
          productId: l.productId,
          batchId: pick.batchId,
          quantityDelta: pick.quantity,
          reason: 'Restock run',
        },
      );
    }
  }
  return applyMovements(trx, actor.firmId, actor.userId, lines, deps.clock.now());
}

/** A reviewed restock run, applied at most once per Idempotency-Key and retried whole on deadlock. */
export async function applyRestockRunOnce(
  deps: AppDeps,
  actor: Actor,
  idempotencyKey: IdempotencyKey | undefined,
  input: RestockApplyInput,
  depotId?: number,
): Promise<{ status: number; applied: RestockApplied }> {
  const out = await withTransactionRetry(() =>
    runIdempotent(deps, actor, idempotencyKey, 'restock-run', async (trx) => ({
      status: 201,
      body: { groupId: await applyRestockRun(trx, deps, actor, input, depotId) },
    })),
  );
  return { status: out.status, applied: out.body };
}

/** The reorder list the restock run leaves, as CSV. */
export async function exportReorderCsv(deps: AppDeps, actor: Actor, depotId?: number): Promise<string> {
  const { reorder, reorderTotalPence } = await getRestockRun(deps, actor, depotId);
  return reorderCsv(reorder, reorderTotalPence);
}
