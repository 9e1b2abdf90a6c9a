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
import { firmToday } from '../firms/firm-today.ts';
import { savePhoto } from '../photos/photo-service.ts';
import { COMPLETED_MESSAGE, lockOpenJob, parseSurvey, requireJob, throwUnlessMayUpdateJob } from './job-access.ts';
import { updateJobNotes, type JobRow } from './job-dal.ts';
import { findInhibitor } from './job-sheet-dal.ts';
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
// answers with the whole sheet read afresh.

const round1 = (n: number) => Math.round(n * 10) / 10;

export async function writeSheet(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  work: (trx: Knex.Transaction, row: JobRow) => Promise<void>,
): Promise<JobSheet> {
  await withTransactionRetry(() =>
    deps.db.transaction(async (trx) => {
      await work(trx, await lockOpenJob(trx, actor, jobId));
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

export function setStep(deps: AppDeps, actor: Actor, jobId: number, step: JobStep, done: boolean) {
  return writeSheet(deps, actor, jobId, async (trx, row) => {
    const survey = parseSurvey(row);
    const steps = visitSteps({ systemType: survey.systemType, fuel: survey.fuel, visitKind: row.visit_kind });
    if (!steps.some((s) => s.step === step)) {
      throw invalid(
        'step',
        `That step is not part of this visit: its steps are ${steps.map((s) => s.step).join(', ')}.`,
      );
    }
    if (done) await tickStep(trx, actor.firmId, jobId, step, actor.userId, deps.clock.now());
    else await untickStep(trx, actor.firmId, jobId, step);
  });
}

export function recordReading(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  index: number,
  phase: ReadingPhase,
  input: RadiatorReadingInput,
) {
  return writeSheet(deps, actor, jobId, async (trx, row) => {
    checkRadiator(row, index);
    // The columns keep one decimal place, as thermometers and cameras show.
    const c = (v: number | null | undefined) => (v === null || v === undefined ? null : round1(v));
    await upsertReading(trx, {
      firm_id: actor.firmId,
      job_id: jobId,
      radiator_index: index,
      phase,
      top_c: round1(input.topC),
      bottom_c: round1(input.bottomC),
      flow_c: c(input.flowC),
      return_c: c(input.returnC),
      room_c: c(input.roomC),
      recorded_by_user_id: actor.userId,
      recorded_at: deps.clock.now(),
    });
  });
}

export function setFlushed(deps: AppDeps, actor: Actor, jobId: number, index: number, done: boolean) {
  return writeSheet(deps, actor, jobId, async (trx, row) => {
    checkRadiator(row, index);
    if (done) await tickFlush(trx, actor.firmId, jobId, index, actor.userId, deps.clock.now());
    else await untickFlush(trx, actor.firmId, jobId, index);
  });
}

export function recordAgitation(deps: AppDeps, actor: Actor, jobId: number, index: number, input: AgitationInput) {
  return writeSheet(deps, actor, jobId, async (trx, row) => {
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
    const now = deps.clock.now();
    await upsertAgitation(trx, {
      firm_id: actor.firmId,
      job_id: jobId,
      radiator_index: index,
      minutes: input.minutes,
      kit_item_id: kitItemId,
      magnitude_ms2: magnitude,
      engineer_member_id: row.engineer_member_id,
      recorded_on: await firmToday(trx, actor.firmId, now),
      recorded_by_user_id: actor.userId,
      recorded_at: now,
    });
  });
}

export function recordWaterTests(deps: AppDeps, actor: Actor, jobId: number, input: WaterTestsInput) {
  return writeSheet(deps, actor, jobId, async (trx) => {
    const productId = input.inhibitorProductId ?? null;
    if (productId !== null && !(await findInhibitor(trx, actor.firmId, productId))) {
      throw invalid(
        'inhibitorProductId',
        `Product ${productId} is not one of the firm\u2019s inhibitors: choose the inhibitor that was dosed.`,
      );
    }
    // A PUT of the whole set of tests: a field left out is cleared.
    await upsertWaterTests(trx, {
      firm_id: actor.firmId,
      job_id: jobId,
      mains_tds_ppm: input.mainsTdsPpm ?? null,
      system_tds_ppm: input.systemTdsPpm ?? null,
      water_clear: input.waterClear ?? null,
      inhibitor_reading: input.inhibitorReading ?? null,
      inhibitor_product_id: productId,
      ph: input.ph ?? null,
      recorded_by_user_id: actor.userId,
      recorded_at: deps.clock.now(),
    });
  });
}

export function recordKit(deps: AppDeps, actor: Actor, jobId: number, kitItemIds: number[]) {
  return writeSheet(deps, actor, jobId, async (trx, row) => {
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
    await replaceJobKit(trx, actor.firmId, jobId, ids);
  });
}

export function recordNotes(deps: AppDeps, actor: Actor, jobId: number, notes: string) {
  return writeSheet(deps, actor, jobId, (trx) => updateJobNotes(trx, actor.firmId, jobId, notes));
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
): Promise<JobPhoto> {
  const row = await requireJob(deps.db, actor.firmId, jobId);
  throwUnlessMayUpdateJob(actor, row);
  if (row.status === 'completed') throw conflict(COMPLETED_MESSAGE);
  const photo = await savePhoto(deps, actor, file, {
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
