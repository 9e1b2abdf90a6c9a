import { ForbiddenError, subject } from '@casl/ability';
import {
  surveySchema,
  systemDetailsSchema,
  type Survey,
  type SystemDetails,
  type SystemDetailsAnswer,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor } from '../../app-deps.ts';
import { conflict, notFound } from '../../lib/http-error.ts';
import { findJobRow, type JobRow } from './job-dal.ts';

// The job row as the services see it: found in the firm or 404, who may change it, its survey.

export const COMPLETED_MESSAGE = 'This job is completed; its record can no longer change.';
export const CANCELLED_MESSAGE = 'This job was cancelled; its record can no longer change.';

export async function requireJob(
  db: Knex | Knex.Transaction,
  firmId: number,
  id: number,
  opts: { forUpdate?: boolean } = {},
): Promise<JobRow> {
  const row = await findJobRow(db, firmId, id, opts);
  if (!row) throw notFound('That job');
  return row;
}

export function parseSurvey(row: JobRow): Survey {
  return surveySchema.parse(typeof row.survey === 'string' ? JSON.parse(row.survey) : row.survey);
}

/** The system details as the answer shows them: every field present, null where nobody has said. */
export function parseSystemDetails(row: JobRow): SystemDetailsAnswer {
  const raw: unknown = typeof row.system_details === 'string' ? JSON.parse(row.system_details) : row.system_details;
  const d: SystemDetails = raw === null ? {} : systemDetailsSchema.parse(raw);
  return {
    boilerMake: d.boilerMake ?? null,
    boilerModel: d.boilerModel ?? null,
    boilerLocation: d.boilerLocation ?? null,
    magneticFilterFitted: d.magneticFilterFitted ?? null,
    cisternCondition: d.cisternCondition ?? null,
  };
}

function jobSubject(actor: Actor, row: JobRow) {
  return subject('Job', { firmId: actor.firmId, engineerMemberId: row.engineer_member_id });
}

export function mayUpdateJob(actor: Actor, row: JobRow): boolean {
  return actor.ability.can('update', jobSubject(actor, row));
}

export function throwUnlessMayUpdateJob(actor: Actor, row: JobRow): void {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', jobSubject(actor, row));
}

/**
 * Locks the job row, then checks who may change it and that it is still open. Completion takes the
 * same lock, so a write racing completion either lands before it or is refused after it.
 */
export async function lockOpenJob(trx: Knex.Transaction, actor: Actor, jobId: number): Promise<JobRow> {
  const row = await requireJob(trx, actor.firmId, jobId, { forUpdate: true });
  throwUnlessMayUpdateJob(actor, row);
  if (row.status === 'completed') throw conflict(COMPLETED_MESSAGE);
  if (row.status === 'cancelled') throw conflict(CANCELLED_MESSAGE);
  return row;
}
