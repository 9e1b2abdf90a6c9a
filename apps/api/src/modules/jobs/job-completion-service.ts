import { addMonths, type JobDetail } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { conflict } from '../../lib/http-error.ts';
import { applyMovements } from '../stock/stock-ledger.ts';
import { setSiteNextCheck } from '../sites/site-dal.ts';
import { requireJob, throwUnlessMayUpdateJob } from './job-access.ts';
import { markJobCompleted } from './job-dal.ts';
import { planJob } from './job-plan.ts';
import { queueJobReportEmail } from './job-report-email.ts';
import { loadJobDetail } from './job-service.ts';

/** The annual inhibitor check falls due 12 calendar months after the clean (DEVELOPERS.md, "Decisions worth knowing"). */
const NEXT_CHECK_MONTHS = 12;

/**
 * Completes a job, at most once per Idempotency-Key: one transaction (retried whole on a deadlock)
 * takes the chemicals off the van, completes the job and writes the report e-mail; the e-mail is
 * queued after commit. The answer is the job as completed (a retry with the key replays it).
 */
export async function completeJob(
  deps: AppDeps,
  actor: Actor,
  id: number,
  idempotencyKey: IdempotencyKey | undefined,
): Promise<{ status: number; body: JobDetail }> {
  let emailId: number | null = null;
  const out = await withTransactionRetry(() =>
    runIdempotent(deps, actor, idempotencyKey, `complete job ${id}`, async (trx) => {
      emailId = null;
      await takeChemicalsAndComplete(trx, deps, actor, id);
      const detail = await loadJobDetail(trx, deps, actor, id);
      // The report e-mail is written with the completion, so it exists exactly when the job is done.
      emailId = await queueJobReportEmail(trx, deps, actor, detail);
      return { status: 200, body: detail };
    }),
  );
  if (emailId !== null) await deps.mailQueue.notify([emailId]);
  return { status: out.status, body: out.body };
}

/**
 * The planned chemicals come off the engineer's van by batch, first expiry first, in the same
 * transaction as the completion. The job row is locked first, so a retried or doubled completion
 * finds it completed and changes nothing.
 */
async function takeChemicalsAndComplete(trx: Knex.Transaction, deps: AppDeps, actor: Actor, id: number): Promise<void> {
  const row = await requireJob(trx, actor.firmId, id, { forUpdate: true });
  throwUnlessMayUpdateJob(actor, row);
  if (row.status === 'completed')
    throw conflict('This job is already completed; its chemicals were taken off the van then.');
  const plan = await planJob(trx, deps, actor.firmId, row);
  const short = plan.doses.filter((d) => d.shortfall > 0);
  if (short.length || (plan.doses.length && !row.van_location_id)) {
    throw conflict(
      row.van_location_id
        ? `The van is short of ${short.map((d) => `${d.shortfall} pack(s) of ${d.product.name}`).join(', ')}. Restock it, or change the plan, then complete.`
        : 'This job has no van to take its chemicals from: assign an engineer with a van.',
    );
  }
  await applyMovements(
    trx,
    actor.firmId,
    actor.userId,
    plan.doses.flatMap((d) =>
      d.takeFromVan.map((a) => ({
        kind: 'used' as const,
        locationId: row.van_location_id!,
        productId: d.product.id,
        batchId: a.batchId,
        quantityDelta: -a.quantity,
        jobId: id,
        reason: `Job ${id}`,
      })),
    ),
    deps.clock.now(),
  );
  const nextCheckOn = addMonths(plan.today, NEXT_CHECK_MONTHS);
  await markJobCompleted(trx, actor.firmId, id, { at: deps.clock.now(), byUserId: actor.userId, nextCheckOn });
  await setSiteNextCheck(trx, actor.firmId, row.site_id, nextCheckOn);
}
