import {
  addMonths,
  completionChecks,
  completionCodeLabels,
  type CompleteJobInput,
  type JobDetail,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { conflict, HttpError } from '../../lib/http-error.ts';
import { checkTapAfter } from '../../middleware/tapped-at.ts';
import { recordKitUses } from '../kits/kit-use-dal.ts';
import { issueInvoiceAtCompletion } from '../money/invoice-issue.ts';
import { applyMovements } from '../stock/stock-ledger.ts';
import { setSiteNextCheck } from '../sites/site-dal.ts';
import { CANCELLED_MESSAGE, requireJob, throwUnlessMayUpdateJob } from './job-access.ts';
import { markJobCompleted, type JobRow } from './job-dal.ts';
import { planJob } from './job-plan.ts';
import { queueJobReportEmail } from './job-report-email.ts';
import { buildSheet } from './job-sheet-read.ts';
import { loadJobDetail } from './job-service.ts';
import {
  insertCompletionReasons,
  setJobReportNumber,
  takeReportNumber,
  type CompletionReasonRow,
} from './visit-dal.ts';

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
  input: CompleteJobInput,
  idempotencyKey: IdempotencyKey | undefined,
  tappedAt: Date | null = null,
): Promise<{ status: number; body: JobDetail }> {
  let emailId: number | null = null;
  let invoiceEmailId: number | null = null;
  const out = await withTransactionRetry(() =>
    runIdempotent(deps, actor, idempotencyKey, `complete job ${id}`, async (trx) => {
      emailId = null;
      await takeChemicalsAndComplete(trx, deps, actor, id, input, tappedAt);
      const detail = await loadJobDetail(trx, deps, actor, id);
      // The report e-mail is written with the completion, so it exists exactly when the job is done.
      emailId = await queueJobReportEmail(trx, deps, actor, detail);
      // The job's invoice, numbered in this transaction when the firm invoices on completion (modules/money).
      invoiceEmailId = await issueInvoiceAtCompletion(trx, deps, actor.firmId, actor.userId, id);
      return { status: 200, body: detail };
    }),
  );
  if (emailId !== null) await deps.mailQueue.notify([emailId]);
  if (invoiceEmailId !== null) await deps.mailQueue.notify([invoiceEmailId]);
  return { status: out.status, body: out.body };
}

/**
 * The planned chemicals come off the engineer's van by batch, first expiry first, in the same
 * transaction as the completion. The job row is locked first, so a retried or doubled completion
 * finds it completed and changes nothing.
 */
async function takeChemicalsAndComplete(
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  id: number,
  input: CompleteJobInput,
  tappedAt: Date | null,
): Promise<void> {
  const row = await requireJob(trx, actor.firmId, id, { forUpdate: true });
  throwUnlessMayUpdateJob(actor, row);
  if (row.status === 'completed')
    throw conflict('This job is already completed; its chemicals were taken off the van then.');
  if (row.status === 'cancelled') throw conflict(CANCELLED_MESSAGE);
  checkTapAfter(tappedAt, row.created_at);
  const reasons = await guardCompletion(trx, deps, actor, row, input);
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
  const now = deps.clock.now();
  await markJobCompleted(trx, actor.firmId, id, {
    at: now,
    tappedAt,
    byUserId: actor.userId,
    nextCheckOn,
    recommendation: input.recommendation,
  });
  await setSiteNextCheck(trx, actor.firmId, row.site_id, nextCheckOn);
  await insertCompletionReasons(trx, actor.firmId, id, reasons);
  await setJobReportNumber(trx, actor.firmId, id, await takeReportNumber(trx, actor.firmId));
  // Kit marked as used on the job counts as one use of each item for its inspection rule.
  await recordKitUses(trx, actor.firmId, id, now);
}

/**
 * The guarded completion (DEVELOPERS.md, Product rules): what the sheet shows as not done needs a
 * reason. A missing one is a 422 naming each (path confirmations.<code>), and nothing changes; the
 * reasons given are kept with what was found.
 */
async function guardCompletion(
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  row: JobRow,
  input: CompleteJobInput,
): Promise<CompletionReasonRow[]> {
  const sheet = await buildSheet(trx, deps, actor, row);
  const issues = completionChecks({
    visitKind: row.visit_kind,
    circulation: sheet.circulation,
    radiators: sheet.radiators,
    water: sheet.water,
    unsavedInput: input.unsavedInput,
  });
  const given = new Map((input.confirmations ?? []).map((c) => [c.code, c.reason]));
  const missing = issues.filter((i) => !given.has(i.code));
  if (missing.length) {
    throw new HttpError(
      422,
      `Give a reason to complete without: ${missing.map((i) => completionCodeLabels[i.code].toLowerCase()).join('; ')}.`,
      'ValidationFailed',
      missing.map((i) => ({ path: `confirmations.${i.code}`, message: i.found })),
    );
  }
  return issues.map((i) => ({ code: i.code, found: i.found, reason: given.get(i.code)! }));
}
