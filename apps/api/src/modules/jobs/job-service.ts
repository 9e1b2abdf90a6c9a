import { ForbiddenError } from '@casl/ability';
import {
  completionCodeLabels,
  formatReportNumber,
  roleLabels,
  type CreateJobInput,
  type JobDetail,
  type JobListQuery,
  type JobListRow,
  type Survey,
  type SystemDetails,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notAllowed, notFound, ruleBroken } from '../../lib/http-error.ts';
import { findVanOfMember } from '../locations/location-dal.ts';
import { findMember } from '../members/member-dal.ts';
import { findJobSite, siteExists } from '../sites/site-dal.ts';
import { parseSystemDetails, requireJob } from './job-access.ts';
import { findFirmProductIds, insertJob, insertJobProducts, listChemicalsUsed, listJobRows } from './job-dal.ts';
import { planJob } from './job-plan.ts';
import { memberName } from './job-sheet-dal.ts';
import { buildSheet } from './job-sheet-read.ts';
import { listCompletionReasons, userName } from './visit-dal.ts';

type Db = Knex | Knex.Transaction;

export async function listJobs(deps: AppDeps, actor: Actor, filter: JobListQuery = {}): Promise<JobListRow[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Job');
  return listJobRows(deps.db, actor.firmId, filter);
}

/** A sealed system has no feed-and-expansion cistern, so it has no cistern condition to report. */
export function checkSystemDetails(survey: Survey, details: SystemDetails | undefined): void {
  if (details?.cisternCondition != null && survey.systemType === 'sealed') {
    const message = 'A sealed system has no feed-and-expansion cistern: leave its condition empty.';
    throw ruleBroken(message, [{ path: 'systemDetails.cisternCondition', message }]);
  }
}

/**
 * Who a job is booked for (issue 10: an engineer could book for anyone, even an owner, and take
 * their van). An engineer books for themself only; the office names any active engineer of the
 * firm, or nobody yet. Another firm's member is simply not found.
 */
export async function bookedEngineer(db: Db, actor: Actor, named: number | null | undefined): Promise<number | null> {
  if (actor.role === 'engineer' && named != null && named !== actor.memberId) {
    throw notAllowed(
      'An engineer books jobs for themself only: leave yourself as the engineer, or ask the office to book it for someone else.',
    );
  }
  const memberId = named ?? (actor.role === 'engineer' ? actor.memberId : null);
  if (memberId === null) return null;
  const member = await findMember(db, actor.firmId, memberId);
  if (!member) throw notFound('That engineer');
  const refuse = (message: string) => ruleBroken(message, [{ path: 'engineerMemberId', message }]);
  if (!member.active) throw refuse(`${member.name} is no longer active in this firm: choose an active engineer.`);
  if (member.role !== 'engineer')
    throw refuse(
      `${member.name} is not an engineer (their role is ${roleLabels[member.role]}): book the job for an engineer.`,
    );
  return member.id;
}

/** Books a job with its survey; the job takes its engineer's van. One transaction. */
export async function createJob(deps: AppDeps, actor: Actor, input: CreateJobInput): Promise<JobDetail> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Job');
  checkSystemDetails(input.survey, input.systemDetails);
  const id = await deps.db.transaction(async (trx) => {
    if (!(await siteExists(trx, actor.firmId, input.siteId))) throw notFound('That site');
    const engineerMemberId = await bookedEngineer(trx, actor, input.engineerMemberId);
    const van = engineerMemberId ? await findVanOfMember(trx, actor.firmId, engineerMemberId) : undefined;
    const productIds = [...new Set(input.productIds)];
    const found = await findFirmProductIds(trx, actor.firmId, productIds);
    if (productIds.some((p) => !found.includes(p))) throw notFound('That product');
    const jobId = await insertJob(trx, {
      firmId: actor.firmId,
      siteId: input.siteId,
      engineerMemberId,
      vanLocationId: van?.id ?? null,
      scheduledOn: input.scheduledOn,
      scheduledTime: input.scheduledTime ?? null,
      survey: input.survey,
      visitKind: input.visitKind ?? 'full_clean',
      systemDetails: input.systemDetails ?? null,
    });
    await insertJobProducts(trx, actor.firmId, jobId, productIds);
    return jobId;
  });
  return getJob(deps, actor, id);
}

export async function getJob(deps: AppDeps, actor: Actor, id: number): Promise<JobDetail> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Job');
  return loadJobDetail(deps.db, deps, actor, id);
}

/** A job with its plan, the chemicals used and the sheet, read through `db` (the caller's transaction, if any). */
export async function loadJobDetail(db: Db, deps: AppDeps, actor: Actor, id: number): Promise<JobDetail> {
  const row = await requireJob(db, actor.firmId, id);
  const site = await findJobSite(db, actor.firmId, row.site_id);
  if (!site) throw notFound('That site');
  const [chemicalsUsed, plan, reasons, engineerName, cancelledBy] = await Promise.all([
    listChemicalsUsed(db, actor.firmId, id),
    planJob(db, deps, actor.firmId, row),
    listCompletionReasons(db, actor.firmId, id),
    row.engineer_member_id === null ? null : memberName(db, actor.firmId, row.engineer_member_id),
    userName(db, row.cancelled_by_user_id),
  ]);
  const sheet = await buildSheet(db, deps, actor, row, plan.survey);
  return {
    job: {
      id: row.id,
      status: row.status,
      scheduledOn: row.scheduled_on,
      scheduledTime: row.scheduled_time,
      engineerMemberId: row.engineer_member_id,
      vanLocationId: row.van_location_id,
      // The engineer's time (the tap) where the phone said it, else when the server completed it.
      completedAt: (row.completed_tapped_at ?? row.completed_at)?.toISOString() ?? null,
      nextCheckOn: row.next_check_on,
      site,
      visitKind: row.visit_kind,
      engineerName,
      systemDetails: parseSystemDetails(row),
      reportNumber: row.report_number === null ? null : formatReportNumber(row.report_number),
      cancellation: row.cancelled_at
        ? { at: row.cancelled_at.toISOString(), byName: cancelledBy, reason: row.cancellation_reason ?? '' }
        : null,
      completionReasons: reasons.map((r) => ({ ...r, label: completionCodeLabels[r.code] })),
      recommendation: row.recommendation ?? null,
      surveyVersion: row.survey_version,
    },
    ...plan,
    chemicalsUsed,
    sheet,
  };
}
