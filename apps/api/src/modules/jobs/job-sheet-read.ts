import { ForbiddenError } from '@casl/ability';
import {
  agitationPoints,
  calendarDateIn,
  circulationClock,
  circulationMinimumMinutes,
  completionChecks,
  DEFAULT_COLD_BOTTOM_THRESHOLD_K,
  flushOrderFor,
  havDay,
  readingFigures,
  visitCautions,
  visitSteps,
  waterTestFigures,
  type JobSheet,
  type ReadingPhase,
  type SavedReading,
  type Survey,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { mayUpdateJob, parseSurvey, requireJob } from './job-access.ts';
import type { JobRow } from './job-dal.ts';
import { findSiteFlushOrder } from '../sites/site-dal.ts';
import { agitationsOfDay, findInhibitor, loadSheetRows, memberName } from './job-sheet-dal.ts';
import { listSignatures } from './visit-dal.ts';

type Db = Knex | Knex.Transaction;

/**
 * The job sheet: what the engineer recorded on site with the figures computed from it by the
 * domain (the same functions the sheet runs live). Read in one query per table.
 */
export async function buildSheet(
  db: Db,
  deps: AppDeps,
  actor: Actor,
  row: JobRow,
  survey: Survey = parseSurvey(row),
): Promise<JobSheet> {
  const now = deps.clock.now();
  const [rows, signatures, keptFlushOrder] = await Promise.all([
    loadSheetRows(db, actor.firmId, row),
    listSignatures(db, actor.firmId, row.id),
    findSiteFlushOrder(db, actor.firmId, row.site_id),
  ]);
  const shape = { systemType: survey.systemType, fuel: survey.fuel, visitKind: row.visit_kind };
  const thresholdK = rows.firm.coldBottomThresholdK ?? DEFAULT_COLD_BOTTOM_THRESHOLD_K;
  const today = calendarDateIn(now, rows.firm.timeZone);

  const stepOf = new Map(rows.steps.map((s) => [s.step, s]));
  const steps = visitSteps(shape).map(({ step, label, cautions }) => {
    const done = stepOf.get(step);
    return {
      step,
      label,
      cautions,
      doneAt: done?.doneAt.toISOString() ?? null,
      doneByName: done?.doneByName ?? null,
    };
  });
  const circulation = circulationClock(
    circulationMinimumMinutes(rows.products),
    stepOf.get('dose_cleaner')?.doneAt ?? null,
    stepOf.get('circulate_hot')?.doneAt ?? null,
    now,
  );

  const readingOf = new Map(rows.readings.map((r) => [`${r.radiatorIndex}:${r.phase}`, r]));
  const agitationOf = new Map(rows.agitations.map((a) => [a.radiatorIndex, a]));
  const flushedAt = new Map(rows.flushes.map((f) => [f.radiatorIndex, f.flushedAt.toISOString()]));
  const radiators = survey.radiators.map((r, index) => {
    const ratedWatts = r.ratedWatts ?? null;
    const reading = (phase: ReadingPhase): SavedReading | null => {
      const saved = readingOf.get(`${index}:${phase}`);
      if (!saved) return null;
      const input = {
        topC: saved.topC,
        bottomC: saved.bottomC,
        flowC: saved.flowC,
        returnC: saved.returnC,
        roomC: saved.roomC,
      };
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
        ? {
            minutes: a.minutes,
            kitItemId: a.kitItemId,
            kitItemTag: a.kitItemTag,
            magnitudeMs2: a.magnitudeMs2,
            points: agitationPoints(a.magnitudeMs2, a.minutes),
          }
        : null,
    };
  });

  // The day of this visit's agitation (today while nothing is recorded), across all the engineer's jobs.
  const havDayOn =
    rows.agitations.reduce<string | null>((d, a) => (d === null || a.recordedOn > d ? a.recordedOn : d), null) ?? today;
  const [dayAgitations, engineerName] = row.engineer_member_id
    ? await Promise.all([
        agitationsOfDay(db, actor.firmId, row.engineer_member_id, havDayOn),
        memberName(db, actor.firmId, row.engineer_member_id),
      ])
    : [rows.agitations.filter((a) => a.recordedOn === havDayOn), null];
  const hav = { engineerName, day: havDayOn, ...havDay(dayAgitations) };

  const w = rows.water ?? {
    mainsTdsPpm: null,
    systemTdsPpm: null,
    waterClear: null,
    inhibitorReading: null,
    inhibitorProductId: null,
    ph: null,
  };
  // The reading is judged against the inhibitor named on the tests, else the one the job planned.
  const plannedInhibitor = rows.products.find((p) => p.kind === 'inhibitor') ?? null;
  const inhibitor =
    w.inhibitorProductId === null
      ? plannedInhibitor
      : (rows.products.find((p) => p.id === w.inhibitorProductId) ??
        (await findInhibitor(db, actor.firmId, w.inhibitorProductId)) ??
        null);
  const range =
    inhibitor && inhibitor.targetMin !== null && inhibitor.targetMax !== null
      ? { min: inhibitor.targetMin, max: inhibitor.targetMax, unit: inhibitor.targetUnit }
      : null;
  const water = { ...w, figures: waterTestFigures(w, range) };

  return {
    editable: row.status === 'planned' && mayUpdateJob(actor, row),
    visitKind: row.visit_kind,
    steps,
    cautions: visitCautions(shape),
    flushOrder: flushOrderFor(
      keptFlushOrder,
      survey.radiators.map((r) => r.room),
    ),
    signatures: signatures.map((s) => ({
      kind: s.kind,
      name: s.signer_name,
      signedAt: s.signed_at.toISOString(),
      url: `/api/jobs/${row.id}/signatures/${s.kind}`,
    })),
    completionIssues: completionChecks({ visitKind: row.visit_kind, circulation, radiators, water }),
    circulation,
    coldBottomThresholdK: thresholdK,
    radiators,
    hav,
    water,
    kitUsed: rows.kitUsed,
    kitOnVan: rows.kitOnVan,
    photos: rows.photos.map((p) => ({
      id: p.id,
      url: `/api/photos/${p.id}/content`,
      tag: p.tag,
      caption: p.caption,
      contentType: p.contentType,
      createdAt: p.createdAt.toISOString(),
    })),
    notes: row.notes ?? '',
    notesVersion: row.notes_version,
  };
}

export async function getSheet(deps: AppDeps, actor: Actor, jobId: number, db: Db = deps.db): Promise<JobSheet> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Job');
  return buildSheet(db, deps, actor, await requireJob(db, actor.firmId, jobId));
}
