import type { StockMoved } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { listMovementIdsOfGroup } from './stock-ledger-dal.ts';
import { listMovementsByIds } from './stock-movement-dal.ts';

/**
 * Runs one stock-changing request: at most once per Idempotency-Key (a retry replays the stored
 * answer: the group and its movement ids), the whole transaction retried on deadlock. The movements
 * are read back after commit, so a replay answers with the same rows as the first time.
 */
export async function recordMovement(
  deps: AppDeps,
  actor: Actor,
  idempotencyKey: IdempotencyKey | undefined,
  request: string,
  work: (trx: Knex.Transaction) => Promise<string>,
): Promise<{ status: number; moved: StockMoved }> {
  const out = await withTransactionRetry(() =>
    runIdempotent(deps, actor, idempotencyKey, request, async (trx) => {
      const groupId = await work(trx);
      return { status: 201, body: { groupId, movementIds: await listMovementIdsOfGroup(trx, actor.firmId, groupId) } };
    }),
  );
  return {
    status: out.status,
    moved: {
      groupId: out.body.groupId,
      movements: await listMovementsByIds(deps.db, actor.firmId, out.body.movementIds),
    },
  };
}
