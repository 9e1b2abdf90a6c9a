import {
  visitSteps,
  type AgitationInput,
  type JobPhoto,
  type JobSheet,
  type JobStep,
  type RadiatorReadingInput,
  type ReadingPhase,
  type Survey,
  type WaterTestsInput,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { conflict, HttpError } from '../../lib/http-error.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { checkTapAfter } from '../../middleware/tapped-at.ts';
import { firmToday } from '../firms/firm-today.ts';
import { savePhoto } from '../photos/photo-service.ts';
import { COMPLETED_MESSAGE, lockOpenJob, parseSurvey, requireJob, throwUnlessMayUpdateJob } from './job-access.ts';
import { updateJobNotes, type JobRow } from './job-dal.ts';
import { findInhibitor } from './job-sheet-dal.ts';
import { logSheetEvent } from './job-sheet-event-dal.ts';
import { getSheet } from './job-sheet-read.ts';
import {
  kitItemsForJob,
  replaceJobKit,
  tickFlush,
  tickStep,
  untickFlush,
  untickStep,
  upsertAgitation,
  upsertReading,
  upsertWaterTests,
} from './job-sheet-write-dal.ts';

// The job sheet's writes: each locks the open job, changes one part in a short transaction, and
// answers with the whole sheet read afresh. Each applies at most once per Idempotency-Key, and keeps the
// engineer's tap time (X-Tapped-At) beside the time it arrived.

const round1 = (n: number) => Math.round(n * 10) / 10;

/** How a write reached the server: its Idempotency-Key and when the engineer tapped (null: not said). */
export interface SheetWriteMeta {
  idempotencyKey?: IdempotencyKey | undefined;
  tappedAt?: Date | null;
}

export interface SheetWork {
  trx: Knex.Transaction;
  row: JobRow;
  now: Date;
  tappedAt: Date | null;
  /** Logs the write as an event of `target` and says whether it is the latest (then apply it). */
  latest: (target: string, value: unknown) => Promise<boolean>;
}

export async function writeSheet(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  work: (trx: Knex.Transaction, row: JobRow, w: SheetWork) => Promise<void>,
  meta: SheetWriteMeta = {},
): Promise<JobSheet> {
  const tappedAt = meta.tappedAt ?? null;
  // The replayed answer is not the stored sheet (it may be old by now): the sheet is read afresh either way.
  await withTransactionRetry(() =>
    runIdempotent(deps, actor, meta.idempotencyKey, `job sheet ${jobId}`, async (trx) => {
      const row = await lockOpenJob(trx, actor, jobId);
      checkTapAfter(tappedAt, row.created_at);
      const now = deps.clock.now();
      const latest = (target: string, value: unknown) =>
        logSheetEvent(trx, { firmId: actor.firmId, jobId, target, value, tappedAt, now, userId: actor.userId });
      await work(trx, row, { trx, row, now, tappedAt, latest });
      return { status: 200, body: { applied: true } };
    }),
  );
  return getSheet(deps, actor, jobId);
}

const notOnSurvey = () => new HttpError(404, 'That radiator is not on this job\u2019s survey.');

function checkRadiator(row: JobRow, index: number): Survey {
  const survey = parseSurvey(row);
  if (index >= survey.radiators.length) throw notOnSurvey();
  return survey;
}

const invalid = (path: string, message: string) => new HttpError(422, message, 'ValidationFailed', [{ path, message }]);

export function setStep(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  step: JobStep,
  done: boolean,
  meta?: SheetWriteMeta,
) {
  const work = async (trx: Knex.Transaction, row: JobRow, w: SheetWork) => {
    const survey = parseSurvey(row);
    const steps = visitSteps({ systemType: survey.systemType, fuel: survey.fuel, visitKind: row.visit_kind });
    if (!steps.some((s) => s.step === step)) {
      throw invalid(
        'step',
        `That step is not part of this visit: its steps are ${steps.map((s) => s.step).join(', ')}.`,
      );
    }
    if (!(await w.latest(`step:${step}`, { done }))) return;
    if (done) await tickStep(trx, actor.firmId, jobId, step, actor.userId, w.now, w.tappedAt);
    else await untickStep(trx, actor.firmId, jobId, step);
  };
  return writeSheet(deps, actor, jobId, work, meta);
}

export function recordReading(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  index: number,
  phase: ReadingPhase,
  input: RadiatorReadingInput,
  meta?: SheetWriteMeta,
) {
  const work = async (trx: Knex.Transaction, row: JobRow, w: SheetWork) => {
    checkRadiator(row, index);
    // The columns keep one decimal place, as thermometers and cameras show.
    const c = (v: number | null | undefined) => (v === null || v === undefined ? null : round1(v));
    const values = {
      top_c: round1(input.topC),
      bottom_c: round1(input.bottomC),
      flow_c: c(input.flowC),
      return_c: c(input.returnC),
      room_c: c(input.roomC),
    };
    // An event: every reading is kept in the log; the sheet shows the one done last.
    if (!(await w.latest(`reading:${index}:${phase}`, values))) return;
    await upsertReading(trx, {
      firm_id: actor.firmId,
      job_id: jobId,
      radiator_index: index,
      phase,
      ...values,
      recorded_by_user_id: actor.userId,
      recorded_at: w.now,
      tapped_at: w.tappedAt,
    });
  };
  return writeSheet(deps, actor, jobId, work, meta);
}

export function setFlushed(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  index: number,
  done: boolean,
  meta?: SheetWriteMeta,
) {
  const work = async (trx: Knex.Transaction, row: JobRow, w: SheetWork) => {
    checkRadiator(row, index);
    if (!(await w.latest(`flush:${index}`, { done }))) return;
    if (done) await tickFlush(trx, actor.firmId, jobId, index, actor.userId, w.now, w.tappedAt);
    else await untickFlush(trx, actor.firmId, jobId, index);
  };
  return writeSheet(deps, actor, jobId, work, meta);
}

export function recordAgitation(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  index: number,
  input: AgitationInput,
  meta?: SheetWriteMeta,
) {
  const work = async (trx: Knex.Transaction, row: JobRow, w: SheetWork) => {
    checkRadiator(row, index);
    let magnitude: number | null = null;
    const kitItemId = input.kitItemId ?? null;
    if (kitItemId !== null) {
      const [item] = await kitItemsForJob(trx, actor.firmId, jobId, [kitItemId]);
      if (!item || row.van_location_id === null || item.location_id !== row.van_location_id) {
        throw invalid(
          'kitItemId',
          item
            ? `${item.asset_tag} is not on this job\u2019s van: choose a tool the van holds.`
            : 'That tool was not found: choose one the van holds.',
        );
      }
      // Copied now, so a later change of the kit setting leaves this day's exposure as it was.
      magnitude = item.vibration_ms2 === null ? null : Number(item.vibration_ms2);
    }
    if (!(await w.latest(`agitation:${index}`, { minutes: input.minutes, kitItemId }))) return;
    await upsertAgitation(trx, {
      firm_id: actor.firmId,
      job_id: jobId,
      radiator_index: index,
      minutes: input.minutes,
      kit_item_id: kitItemId,
      magnitude_ms2: magnitude,
      engineer_member_id: row.engineer_member_id,
      // The day the engineer did it (the tap), which for a write kept on the phone may be before today.
      recorded_on: await firmToday(trx, actor.firmId, w.tappedAt ?? w.now),
      recorded_by_user_id: actor.userId,
      recorded_at: w.now,
      tapped_at: w.tappedAt,
    });
  };
  return writeSheet(deps, actor, jobId, work, meta);
}

export function recordWaterTests(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  input: WaterTestsInput,
  meta?: SheetWriteMeta,
) {
  const work = async (trx: Knex.Transaction, _row: JobRow, w: SheetWork) => {
    const productId = input.inhibitorProductId ?? null;
    if (productId !== null && !(await findInhibitor(trx, actor.firmId, productId))) {
      throw invalid(
        'inhibitorProductId',
        `Product ${productId} is not one of the firm\u2019s inhibitors: choose the inhibitor that was dosed.`,
      );
    }
    // A PUT of the whole set of tests: a field left out is cleared.
    const values = {
      mains_tds_ppm: input.mainsTdsPpm ?? null,
      system_tds_ppm: input.systemTdsPpm ?? null,
      water_clear: input.waterClear ?? null,
      inhibitor_reading: input.inhibitorReading ?? null,
      inhibitor_product_id: productId,
      ph: input.ph ?? null,
    };
    if (!(await w.latest('water-tests', values))) return;
    await upsertWaterTests(trx, {
      firm_id: actor.firmId,
      job_id: jobId,
      ...values,
      recorded_by_user_id: actor.userId,
      recorded_at: w.now,
      tapped_at: w.tappedAt,
    });
  };
  return writeSheet(deps, actor, jobId, work, meta);
}

export function recordKit(deps: AppDeps, actor: Actor, jobId: number, kitItemIds: number[], meta?: SheetWriteMeta) {
  const work = async (trx: Knex.Transaction, row: JobRow, w: SheetWork) => {
    const ids = [...new Set(kitItemIds)];
    const found = await kitItemsForJob(trx, actor.firmId, jobId, ids);
    const missing = ids.filter((id) => !found.some((f) => f.id === id));
    if (missing.length)
      throw invalid(
        'kitItemIds',
        `Kit item${missing.length > 1 ? 's' : ''} ${missing.join(', ')} ${missing.length > 1 ? 'were' : 'was'} not found.`,
      );
    // An item already listed on the job may stay after it has left the van; a new one must be on it now.
    const away = found.filter(
      (f) => f.listed_id === null && (row.van_location_id === null || f.location_id !== row.van_location_id),
    );
    if (away.length) {
      throw invalid(
        'kitItemIds',
        `${away.map((f) => f.asset_tag).join(', ')} ${away.length > 1 ? 'are' : 'is'} not on this job\u2019s van: choose kit the van holds.`,
      );
    }
    if (!(await w.latest('kit', ids))) return;
    await replaceJobKit(trx, actor.firmId, jobId, ids);
  };
  return writeSheet(deps, actor, jobId, work, meta);
}

export const STALE_NOTES_MESSAGE =
  'Someone else saved the notes while you were writing yours, so yours were not saved over theirs. Your notes are kept on this phone: look at both, then save the ones to keep.';

/**
 * The notes, which two people could edit at once: a write that names the version it was edited from is refused
 * (409) when another save landed since, so neither overwrites the other unseen.
 */
export function recordNotes(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  input: { notes: string; notesVersion?: number | undefined },
  meta?: SheetWriteMeta,
) {
  const work = async (trx: Knex.Transaction, row: JobRow) => {
    if (input.notesVersion !== undefined && input.notesVersion !== row.notes_version) {
      throw new HttpError(409, STALE_NOTES_MESSAGE, 'StaleVersion');
    }
    await updateJobNotes(trx, actor.firmId, jobId, input.notes);
  };
  return writeSheet(deps, actor, jobId, work, meta);
}

/**
 * A photo on the job. Checked before the upload (so a refused one is never stored) and again under
 * the job's lock in the photo row's transaction (so it cannot land after completion).
 */
export async function addJobPhoto(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  file: Buffer,
  fields: { tag: string; caption?: string | undefined },
  meta: SheetWriteMeta = {},
): Promise<JobPhoto> {
  const row = await requireJob(deps.db, actor.firmId, jobId);
  throwUnlessMayUpdateJob(actor, row);
  if (row.status === 'completed') throw conflict(COMPLETED_MESSAGE);
  checkTapAfter(meta.tappedAt ?? null, row.created_at);
  const photo = await savePhoto(deps, actor, file, {
    idempotencyKey: meta.idempotencyKey,
    tappedAt: meta.tappedAt ?? null,
    jobId,
    tag: fields.tag,
    ...(fields.caption ? { caption: fields.caption } : {}),
    guard: async (trx) => {
      await lockOpenJob(trx, actor, jobId);
    },
  });
  return {
    id: photo.id,
    url: photo.url,
    tag: fields.tag,
    caption: photo.caption,
    contentType: photo.contentType,
    createdAt: photo.createdAt,
  };
}
