import type { Knex } from 'knex';
import type { JobStep, ReadingPhase } from '@heatfleet/domain';

// The job sheet's writes: each runs in the caller's transaction, under the job row's lock.

export async function tickStep(
  trx: Knex.Transaction,
  firmId: number,
  jobId: number,
  step: JobStep,
  userId: number,
  now: Date,
  tappedAt: Date | null = null,
): Promise<void> {
  // The first tick's time stands: a second tick (a retry, a double tap) changes nothing.
  await trx('job_steps')
    .insert({ firm_id: firmId, job_id: jobId, step, done_at: now, done_by_user_id: userId, tapped_at: tappedAt })
    .onConflict(['firm_id', 'job_id', 'step'])
    .ignore();
}

/** A radiator flushed until clear; the first tick's time stands, as for the steps. */
export async function tickFlush(
  trx: Knex.Transaction,
  firmId: number,
  jobId: number,
  radiatorIndex: number,
  userId: number,
  now: Date,
  tappedAt: Date | null = null,
): Promise<void> {
  await trx('job_radiator_flushes')
    .insert({
      firm_id: firmId,
      job_id: jobId,
      radiator_index: radiatorIndex,
      flushed_at: now,
      flushed_by_user_id: userId,
      tapped_at: tappedAt,
    })
    .onConflict(['firm_id', 'job_id', 'radiator_index'])
    .ignore();
}

export async function untickFlush(
  trx: Knex.Transaction,
  firmId: number,
  jobId: number,
  radiatorIndex: number,
): Promise<void> {
  await trx('job_radiator_flushes').where({ firm_id: firmId, job_id: jobId, radiator_index: radiatorIndex }).delete();
}

export async function untickStep(trx: Knex.Transaction, firmId: number, jobId: number, step: JobStep): Promise<void> {
  await trx('job_steps').where({ firm_id: firmId, job_id: jobId, step }).delete();
}

export async function upsertReading(
  trx: Knex.Transaction,
  row: {
    firm_id: number;
    job_id: number;
    radiator_index: number;
    phase: ReadingPhase;
    top_c: number;
    bottom_c: number;
    flow_c: number | null;
    return_c: number | null;
    room_c: number | null;
    recorded_by_user_id: number;
    recorded_at: Date;
    tapped_at: Date | null;
  },
): Promise<void> {
  await trx('job_radiator_readings')
    .insert(row)
    .onConflict(['firm_id', 'job_id', 'radiator_index', 'phase'])
    .merge(['top_c', 'bottom_c', 'flow_c', 'return_c', 'room_c', 'recorded_by_user_id', 'recorded_at', 'tapped_at']);
}

export async function upsertAgitation(
  trx: Knex.Transaction,
  row: {
    firm_id: number;
    job_id: number;
    radiator_index: number;
    minutes: number;
    kit_item_id: number | null;
    magnitude_ms2: number | null;
    engineer_member_id: number | null;
    recorded_on: string;
    recorded_by_user_id: number;
    recorded_at: Date;
    tapped_at: Date | null;
  },
): Promise<void> {
  await trx('job_agitations')
    .insert(row)
    .onConflict(['firm_id', 'job_id', 'radiator_index'])
    .merge([
      'minutes',
      'kit_item_id',
      'magnitude_ms2',
      'engineer_member_id',
      'recorded_on',
      'recorded_by_user_id',
      'recorded_at',
      'tapped_at',
    ]);
}

export async function upsertWaterTests(
  trx: Knex.Transaction,
  row: {
    firm_id: number;
    job_id: number;
    mains_tds_ppm: number | null;
    system_tds_ppm: number | null;
    water_clear: boolean | null;
    inhibitor_reading: number | null;
    inhibitor_product_id: number | null;
    ph: number | null;
    recorded_by_user_id: number;
    recorded_at: Date;
    tapped_at: Date | null;
  },
): Promise<void> {
  await trx('job_water_tests')
    .insert(row)
    .onConflict(['firm_id', 'job_id'])
    .merge([
      'mains_tds_ppm',
      'system_tds_ppm',
      'water_clear',
      'inhibitor_reading',
      'inhibitor_product_id',
      'ph',
      'recorded_by_user_id',
      'recorded_at',
      'tapped_at',
    ]);
}

/** Which of these items the firm has, with where each is now and whether the job already lists it. */
export async function kitItemsForJob(trx: Knex.Transaction, firmId: number, jobId: number, ids: number[]) {
  if (ids.length === 0) return [];
  return (await trx('kit_items as i')
    .leftJoin('job_kit_items as jk', (j) =>
      j.on('jk.kit_item_id', '=', 'i.id').andOn('jk.firm_id', '=', 'i.firm_id').andOnVal('jk.job_id', '=', jobId),
    )
    .where('i.firm_id', firmId)
    .whereIn('i.id', ids)
    .select('i.id', 'i.asset_tag', 'i.location_id', 'i.vibration_ms2', 'jk.id as listed_id')) as {
    id: number;
    asset_tag: string;
    location_id: number | null;
    vibration_ms2: string | null;
    listed_id: number | null;
  }[];
}

export async function replaceJobKit(
  trx: Knex.Transaction,
  firmId: number,
  jobId: number,
  ids: number[],
): Promise<void> {
  const q = trx('job_kit_items').where({ firm_id: firmId, job_id: jobId });
  if (ids.length) q.whereNotIn('kit_item_id', ids);
  await q.delete();
  if (ids.length) {
    await trx('job_kit_items')
      .insert(ids.map((id) => ({ firm_id: firmId, job_id: jobId, kit_item_id: id })))
      .onConflict(['firm_id', 'job_id', 'kit_item_id'])
      .ignore();
  }
}
