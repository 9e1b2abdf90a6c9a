import { ForbiddenError } from '@casl/ability';
import {
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
import { firmToday } from '../firms/firm-today.ts';
import { findBatch, listProductNames } from './product-dal.ts';
import { reorderCsv } from './stock-csv.ts';
import { balancesAt, sumUsedByProductSince } from './stock-ledger-dal.ts';
import { applyMovements } from './stock-ledger.ts';
import { listActiveVanRefs } from './stock-level-dal.ts';
import { stockLevels } from './stock-query-service.ts';

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

/** The restock run and the reorder list it leaves, computed from balances (not summed from the ledger). */
export async function computeRestock(db: Db, deps: AppDeps, actor: Actor, depotId?: number): Promise<RestockRun> {
  const depot = await depotOf(db, actor, depotId);
  const today = await firmToday(db, actor.firmId, deps.clock.now());
  const [levels, vans, products, batches, used] = await Promise.all([
    stockLevels(db, actor.firmId, today),
    listActiveVanRefs(db, actor.firmId),
    listProductNames(db, actor.firmId),
    depotBatches(db, actor.firmId, depot.id),
    sumUsedByProductSince(db, actor.firmId, new Date(deps.clock.now().getTime() - 90 * 86_400_000)),
  ]);
  const vanIds = new Set(vans.map((v) => v.id));
  const needs = levels
    .filter((c) => vanIds.has(c.locationId) && c.par)
    .map((c) => ({ locationId: c.locationId, productId: c.productId, usable: c.usable, par: c.par! }));
  const lines = planRestock(needs, batches, today);
  const usedBy = new Map(used.map((u) => [u.product_id, -Number(u.n)]));
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
  return {
    today,
    depot: { id: depot.id, name: depot.name },
    lines: lines.map((l) => ({ ...l, van: vanById.get(l.locationId)!, product: productById.get(l.productId)! })),
    reorder: reorder.map((r) => ({ ...r, product: productById.get(r.productId)! })),
  };
}

export async function getRestockRun(deps: AppDeps, actor: Actor, depotId?: number): Promise<RestockRun> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  return computeRestock(deps.db, deps, actor, depotId);
}

/** Applies a reviewed restock run as transfers from the depot: all of them, or none. */
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
  const lines = [];
  for (const l of input.lines) {
    const van = await findLocation(trx, actor.firmId, l.toLocationId);
    if (!van || van.kind !== 'van') throw notFound('That van');
    const b = await findBatch(trx, actor.firmId, l.batchId, l.productId);
    if (!b) throw notFound('That batch');
    if (b.expires_on < today)
      throw conflict(`Lot ${b.lot_number} has expired since the run was computed; compute it again.`);
    lines.push(
      {
        kind: 'transfer_out' as const,
        locationId: depot.id,
        productId: l.productId,
        batchId: l.batchId,
        quantityDelta: -l.quantity,
        reason: `Restock run to ${van.name}`,
      },
      {
        kind: 'transfer_in' as const,
        locationId: van.id,
        productId: l.productId,
        batchId: l.batchId,
        quantityDelta: l.quantity,
        reason: 'Restock run',
      },
    );
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
  const { reorder } = await getRestockRun(deps, actor, depotId);
  return reorderCsv(reorder);
}
