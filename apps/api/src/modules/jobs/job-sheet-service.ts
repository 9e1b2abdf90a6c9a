import { ForbiddenError, subject } from '@casl/ability';
import {
  calendarDateIn,
  DEFAULT_COLD_BOTTOM_THRESHOLD_K,
  havDay,
  jobStepLabels,
  jobSteps,
  readingFigures,
  surveySchema,
  vibrationPoints,
  waterTestFigures,
  type AgitationInput,
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
import { savePhoto } from '../photos/photo-service.ts';
import {
  agitationsOfDay,
  findInhibitor,
  kitItemsForJob,
  loadSheetRows,
  memberName,
  replaceJobKit,
  tickStep,
  untickStep,
  updateJobNotes,
  upsertAgitation,
  tickFlush,
  untickFlush,
  upsertReading,
  upsertWaterTests,
} from './job-sheet-dal.ts';
import { jobRow, type JobRow } from './job-service.ts';

type Db = Knex | Knex.Transaction;

export const COMPLETED_MESSAGE = 'This job is completed; its record can no longer change.';

const round1 = (n: number) => Math.round(n * 10) / 10;

function parseSurvey(row: JobRow): Survey {
  return surveySchema.parse(typeof row.survey === 'string' ? JSON.parse(row.survey) : row.survey);
}

function mayUpdate(actor: Actor, row: JobRow): boolean {
  return actor.ability.can('update', subject('Job', { firmId: actor.firmId, engineerMemberId: row.engineer_member_id }));
}

/**
 * The job sheet: what the engineer recorded on site with the figures computed from it by the
 * domain (the same functions the sheet runs live). Read in one query per table.
 */
export async function buildSheet(db: Db, deps: AppDeps, actor: Actor, row: JobRow, survey: Survey = parseSurvey(row)) {
  const now = deps.clock.now();
  const rows = await loadSheetRows(db, actor.firmId, row);
  const thresholdK = rows.firm.coldBottomThresholdK ?? DEFAULT_COLD_BOTTOM_THRESHOLD_K;
  const today = calendarDateIn(now, rows.firm.timeZone);

  const stepOf = new Map(rows.steps.map((s) => [s.step, s]));
  const steps = jobSteps.map((step) => {
    const done = stepOf.get(step);
    return { step, label: jobStepLabels[step], doneAt: done?.doneAt.toISOString() ?? null, doneByName: done?.doneByName ?? null };
  });

  // Several cleaners on one job: the longest minimum governs.
  const minimums = rows.products.filter((p) => p.kind === 'cleaner' && p.minCirculationMinutes !== null).map((p) => p.minCirculationMinutes!);
  const minimumMinutes = minimums.length ? Math.max(...minimums) : null;
  const started = stepOf.get('dose_cleaner')?.doneAt ?? null;
  const ended = stepOf.get('circulate_hot')?.doneAt ?? now;
  const elapsedMinutes = started ? Math.max(0, Math.floor((ended.getTime() - started.getTime()) / 60_000)) : null;
  const circulation = {
    minimumMinutes,
    startedAt: started?.toISOString() ?? null,
    elapsedMinutes,
    met: minimumMinutes === null ? null : elapsedMinutes !== null && elapsedMinutes >= minimumMinutes,
  };

  const readingOf = new Map(rows.readings.map((r) => [`${r.radiatorIndex}:${r.phase}`, r]));
  const agitationOf = new Map(rows.agitations.map((a) => [a.radiatorIndex, a]));
  const flushedAt = new Map(rows.flushes.map((f) => [f.radiatorIndex, f.flushedAt.toISOString()]));
  const radiators = survey.radiators.map((r, index) => {
    const ratedWatts = r.ratedWatts ?? null;
    const reading = (phase: ReadingPhase) => {
      const saved = readingOf.get(`${index}:${phase}`);
      if (!saved) return null;
      const input: RadiatorReadingInput = { topC: saved.topC, bottomC: saved.bottomC, flowC: saved.flowC, returnC: saved.returnC, roomC: saved.roomC };
      return { ...input, ...readingFigures(input, ratedWatts, thresholdK) };
    };
    const a = agitationOf.get(index);
    return {
      index,
      room: r.room,
      panel: r.panel,
      ratedWatts,
      before: reading('before'),
      after: reading('after'),
      flushedAt: flushedAt.get(index) ?? null,
      agitation: a
        ? { minutes: a.minutes, kitItemId: a.kitItemId, kitItemTag: a.kitItemTag, magnitudeMs2: a.magnitudeMs2, points: a.magnitudeMs2 ? round1(vibrationPoints(a.magnitudeMs2, a.minutes / 60)) : 0 }
        : null,
    };
  });

  // The day of this visit's agitation (today while nothing is recorded), across all the engineer's jobs.
  const havDayOn = rows.agitations.reduce<string | null>((d, a) => (d === null || a.recordedOn > d ? a.recordedOn : d), null) ?? today;
  const [dayAgitations, engineerName] = row.engineer_member_id
    ? await Promise.all([agitationsOfDay(db, actor.firmId, row.engineer_member_id, havDayOn), memberName(db, actor.firmId, row.engineer_member_id)])
    : [rows.agitations.filter((a) => a.recordedOn === havDayOn), null];
  const hav = { engineerName, day: havDayOn, ...havDay(dayAgitations) };

  const w = rows.water ?? { mainsTdsPpm: null, systemTdsPpm: null, waterClear: null, inhibitorReading: null, inhibitorProductId: null, ph: null };
  // The reading is judged against the inhibitor named on the tests, else the one the job planned.
  const plannedInhibitor = rows.products.find((p) => p.kind === 'inhibitor') ?? null;
  const inhibitor =
    w.inhibitorProductId === null ? plannedInhibitor : (rows.products.find((p) => p.id === w.inhibitorProductId) ?? (await findInhibitor(db, actor.firmId, w.inhibitorProductId)) ?? null);
  const range = inhibitor && inhibitor.targetMin !== null && inhibitor.targetMax !== null ? { min: inhibitor.targetMin, max: inhibitor.targetMax, unit: inhibitor.targetUnit } : null;
  const water = { ...w, figures: waterTestFigures(w, range) };

  return {
    editable: row.status !== 'completed' && mayUpdate(actor, row),
    steps,
    circulation,
    coldBottomThresholdK: thresholdK,
    radiators,
    hav,
    water,
    kitUsed: rows.kitUsed,
    kitOnVan: rows.kitOnVan,
    photos: rows.photos.map((p) => ({ id: p.id, url: `/api/photos/${p.id}/content`, tag: p.tag, caption: p.caption, contentType: p.contentType, createdAt: p.createdAt.toISOString() })),
    notes: row.notes ?? '',
  };
}

export type JobSheet = Awaited<ReturnType<typeof buildSheet>>;

export async function getSheet(deps: AppDeps, actor: Actor, jobId: number, db: Db = deps.db): Promise<JobSheet> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Job');
  return buildSheet(db, deps, actor, await jobRow(db, actor.firmId, jobId));
}

/**
 * Locks the job row, then checks who may change it and that it is still open. Completion takes the
 * same lock, so a write racing completion either lands before it or is refused after it.
 */
async function lockOpenJob(trx: Knex.Transaction, actor: Actor, jobId: number): Promise<JobRow> {
  const row = await jobRow(trx, actor.firmId, jobId, true);
  ForbiddenError.from(actor.ability).throwUnlessCan('update', subject('Job', { firmId: actor.firmId, engineerMemberId: row.engineer_member_id }));
  if (row.status === 'completed') throw conflict(COMPLETED_MESSAGE);
  return row;
}

async function writeSheet(deps: AppDeps, actor: Actor, jobId: number, work: (trx: Knex.Transaction, row: JobRow) => Promise<void>): Promise<JobSheet> {
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
  return writeSheet(deps, actor, jobId, async (trx) => {
    if (done) await tickStep(trx, actor.firmId, jobId, step, actor.userId, deps.clock.now());
    else await untickStep(trx, actor.firmId, jobId, step);
  });
}

export function recordReading(deps: AppDeps, actor: Actor, jobId: number, index: number, phase: ReadingPhase, input: RadiatorReadingInput) {
  return writeSheet(deps, actor, jobId, async (trx, row) => {
    checkRadiator(row, index);
    // The columns keep one decimal place, as thermometers and cameras show.
    const c = (v: number | null | undefined) => (v === null || v === undefined ? null : round1(v));
    await upsertReading(trx, {
      firm_id: actor.firmId, job_id: jobId, radiator_index: index, phase,
      top_c: round1(input.topC), bottom_c: round1(input.bottomC), flow_c: c(input.flowC), return_c: c(input.returnC), room_c: c(input.roomC),
      recorded_by_user_id: actor.userId, recorded_at: deps.clock.now(),
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
        throw invalid('kitItemId', item ? `${item.asset_tag} is not on this job\u2019s van: choose a tool the van holds.` : 'That tool was not found: choose one the van holds.');
      }
      // Copied now, so a later change of the kit setting leaves this day's exposure as it was.
      magnitude = item.vibration_ms2 === null ? null : Number(item.vibration_ms2);
    }
    const now = deps.clock.now();
    const firm = (await trx('firms').where({ id: actor.firmId }).first('time_zone')) as { time_zone: string } | undefined;
    await upsertAgitation(trx, {
      firm_id: actor.firmId, job_id: jobId, radiator_index: index, minutes: input.minutes, kit_item_id: kitItemId, magnitude_ms2: magnitude,
      engineer_member_id: row.engineer_member_id, recorded_on: calendarDateIn(now, firm?.time_zone ?? 'Europe/London'), recorded_by_user_id: actor.userId, recorded_at: now,
    });
  });
}

export function recordWaterTests(deps: AppDeps, actor: Actor, jobId: number, input: WaterTestsInput) {
  return writeSheet(deps, actor, jobId, async (trx) => {
    const productId = input.inhibitorProductId ?? null;
    if (productId !== null && !(await findInhibitor(trx, actor.firmId, productId))) {
      throw invalid('inhibitorProductId', `Product ${productId} is not one of the firm\u2019s inhibitors: choose the inhibitor that was dosed.`);
    }
    // A PUT of the whole set of tests: a field left out is cleared.
    await upsertWaterTests(trx, {
      firm_id: actor.firmId, job_id: jobId,
      mains_tds_ppm: input.mainsTdsPpm ?? null, system_tds_ppm: input.systemTdsPpm ?? null, water_clear: input.waterClear ?? null,
      inhibitor_reading: input.inhibitorReading ?? null, inhibitor_product_id: productId, ph: input.ph ?? null,
      recorded_by_user_id: actor.userId, recorded_at: deps.clock.now(),
    });
  });
}

export function recordKit(deps: AppDeps, actor: Actor, jobId: number, kitItemIds: number[]) {
  return writeSheet(deps, actor, jobId, async (trx, row) => {
    const ids = [...new Set(kitItemIds)];
    const found = await kitItemsForJob(trx, actor.firmId, jobId, ids);
    const missing = ids.filter((id) => !found.some((f) => f.id === id));
    if (missing.length) throw invalid('kitItemIds', `Kit item${missing.length > 1 ? 's' : ''} ${missing.join(', ')} ${missing.length > 1 ? 'were' : 'was'} not found.`);
    // An item already listed on the job may stay after it has left the van; a new one must be on it now.
    const away = found.filter((f) => f.listed_id === null && (row.van_location_id === null || f.location_id !== row.van_location_id));
    if (away.length) {
      throw invalid('kitItemIds', `${away.map((f) => f.asset_tag).join(', ')} ${away.length > 1 ? 'are' : 'is'} not on this job\u2019s van: choose kit the van holds.`);
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
export async function addJobPhoto(deps: AppDeps, actor: Actor, jobId: number, file: Buffer, fields: { tag: string; caption?: string | undefined }) {
  const row = await jobRow(deps.db, actor.firmId, jobId);
  ForbiddenError.from(actor.ability).throwUnlessCan('update', subject('Job', { firmId: actor.firmId, engineerMemberId: row.engineer_member_id }));
  if (row.status === 'completed') throw conflict(COMPLETED_MESSAGE);
  const photo = await savePhoto(deps, actor, file, {
    jobId,
    tag: fields.tag,
    ...(fields.caption ? { caption: fields.caption } : {}),
    guard: async (trx) => {
      await lockOpenJob(trx, actor, jobId);
    },
  });
  return { id: photo.id, url: photo.url, tag: fields.tag, caption: photo.caption, contentType: photo.contentType, createdAt: photo.createdAt };
}
