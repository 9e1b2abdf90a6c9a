import type { CancelJobInput, JobDetail, UpdateJobInput } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { conflict, HttpError, notFound, ruleBroken } from '../../lib/http-error.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { checkTapAfter } from '../../middleware/tapped-at.ts';
import { findVanOfMember } from '../locations/location-dal.ts';
import {
  COMPLETED_MESSAGE,
  lockOpenJob,
  parseSurvey,
  parseSystemDetails,
  requireJob,
  throwUnlessMayUpdateJob,
} from './job-access.ts';
import { findFirmProductIds } from './job-dal.ts';
import { bookedEngineer, checkSystemDetails, loadJobDetail } from './job-service.ts';
import { highestRecordedRadiator, markJobCancelled, replaceJobProducts, updateJobFields } from './visit-dal.ts';

// A booked job changed before or during the visit: edited (survey, products, visit kind, system
// details), rescheduled (its date), given to another engineer, or cancelled with a reason.

export const STALE_SURVEY_MESSAGE =
  'Someone else changed this job\u2019s survey while you were editing it, so your changes were not saved over theirs. Your edit is kept on this phone: open the job to see theirs, then make your changes again.';

/**
 * Changes what was sent and leaves the rest; the job row is locked, so completion waits or refuses it. At most
 * once per Idempotency-Key; a survey sent with the surveyVersion it was edited from is refused (409) when
 * another change landed since.
 */
export async function updateJob(
  deps: AppDeps,
  actor: Actor,
  id: number,
  input: UpdateJobInput,
  meta: { idempotencyKey?: IdempotencyKey | undefined; tappedAt?: Date | null } = {},
): Promise<JobDetail> {
  await withTransactionRetry(() =>
    runIdempotent(deps, actor, meta.idempotencyKey, `edit job ${id}`, async (trx) => {
      const row = await lockOpenJob(trx, actor, id);
      checkTapAfter(meta.tappedAt ?? null, row.created_at);
      if (input.surveyVersion !== undefined && input.surveyVersion !== row.survey_version) {
        throw new HttpError(409, STALE_SURVEY_MESSAGE, 'StaleVersion');
      }
      const survey = input.survey ?? parseSurvey(row);
      const fields: Parameters<typeof updateJobFields>[3] = {};
      if (input.scheduledOn !== undefined) fields.scheduled_on = input.scheduledOn;
      if (input.scheduledTime !== undefined) fields.scheduled_time = input.scheduledTime;
      if (input.engineerMemberId !== undefined) {
        const engineerMemberId = await bookedEngineer(trx, actor, input.engineerMemberId);
        const van = engineerMemberId ? await findVanOfMember(trx, actor.firmId, engineerMemberId) : undefined;
        fields.engineer_member_id = engineerMemberId;
        fields.van_location_id = van?.id ?? null;
      }
      if (input.survey !== undefined) {
        // Readings, agitation and flush ticks are kept by the radiator's place in the survey.
        const highest = await highestRecordedRadiator(trx, actor.firmId, id);
        if (highest >= input.survey.radiators.length) {
          const message = `Radiator ${highest + 1} already has records on the sheet: keep at least ${highest + 1} radiators in the survey.`;
          throw ruleBroken(message, [{ path: 'survey.radiators', message }]);
        }
        fields.survey = JSON.stringify(input.survey);
        fields.survey_version = row.survey_version + 1;
      }
      if (input.visitKind !== undefined) fields.visit_kind = input.visitKind;
      const details = input.systemDetails && { ...parseSystemDetails(row), ...input.systemDetails };
      checkSystemDetails(survey, details ?? parseSystemDetails(row));
      if (details) fields.system_details = JSON.stringify(details);
      if (input.productIds !== undefined) {
        const productIds = [...new Set(input.productIds)];
        const found = await findFirmProductIds(trx, actor.firmId, productIds);
        if (productIds.some((p) => !found.includes(p))) throw notFound('That product');
        await replaceJobProducts(trx, actor.firmId, id, productIds);
      }
      await updateJobFields(trx, actor.firmId, id, fields);
      return { status: 200, body: { applied: true } };
    }),
  );
  return loadJobDetail(deps.db, deps, actor, id);
}

/** Cancels a booked job with its reason. Sent again, it answers the job as cancelled and changes nothing. */
export async function cancelJob(deps: AppDeps, actor: Actor, id: number, input: CancelJobInput): Promise<JobDetail> {
  await deps.db.transaction(async (trx) => {
    const row = await requireJob(trx, actor.firmId, id, { forUpdate: true });
    throwUnlessMayUpdateJob(actor, row);
    if (row.status === 'cancelled') return;
    if (row.status === 'completed') throw conflict(`${COMPLETED_MESSAGE} A completed job cannot be cancelled.`);
    await markJobCancelled(trx, actor.firmId, id, {
      at: deps.clock.now(),
      byUserId: actor.userId,
      reason: input.reason,
    });
  });
  return loadJobDetail(deps.db, deps, actor, id);
}
