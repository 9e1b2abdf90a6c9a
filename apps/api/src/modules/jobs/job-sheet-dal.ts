import type { Knex } from 'knex';
import { DEFAULT_TIME_ZONE, type JobStep, type ReadingPhase } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

/** DECIMAL columns arrive as strings. */
const num = (v: string | number | null | undefined): number | null =>
  v === null || v === undefined ? null : Number(v);

export interface SheetRows {
  firm: { timeZone: string; coldBottomThresholdK: number | null };
  steps: { step: JobStep; doneAt: Date; doneByName: string | null }[];
  flushes: { radiatorIndex: number; flushedAt: Date }[];
  readings: {
    radiatorIndex: number;
    phase: ReadingPhase;
    topC: number;
    bottomC: number;
    flowC: number | null;
    returnC: number | null;
    roomC: number | null;
  }[];
  agitations: {
    radiatorIndex: number;
    minutes: number;
    kitItemId: number | null;
    kitItemTag: string | null;
    magnitudeMs2: number | null;
    recordedOn: string;
  }[];
  water: {
    mainsTdsPpm: number | null;
    systemTdsPpm: number | null;
    waterClear: boolean | null;
    inhibitorReading: number | null;
    inhibitorProductId: number | null;
    ph: number | null;
  } | null;
  kitUsed: { id: number; assetTag: string; kindName: string; kitName: string | null }[];
  kitOnVan: { id: number; assetTag: string; kindName: string; kitName: string | null; vibrationMs2: number | null }[];
  photos: {
    id: number;
    tag: string | null;
    caption: string | null;
    contentType: string;
    objectKey: string;
    createdAt: Date;
  }[];
  products: {
    id: number;
    kind: string;
    minCirculationMinutes: number | null;
    targetMin: number | null;
    targetMax: number | null;
    targetUnit: string | null;
  }[];
}

function kitItemsWithKind(db: Db, firmId: number) {
  return db('kit_items as i')
    .join('item_kinds as ik', (j) => j.on('ik.id', '=', 'i.kind_id').andOn('ik.firm_id', '=', 'i.firm_id'))
    .leftJoin('kits as k', (j) => j.on('k.id', '=', 'i.kit_id').andOn('k.firm_id', '=', 'i.firm_id'))
    .where('i.firm_id', firmId)
    .orderBy('i.asset_tag');
}

/** Everything the sheet shows for one job: one query per table, never one per radiator. */
export async function loadSheetRows(
  db: Db,
  firmId: number,
  job: { id: number; van_location_id: number | null },
): Promise<SheetRows> {
  const jobOf = { firm_id: firmId, job_id: job.id };
  const [firm, steps, readings, agitations, water, kitUsed, kitOnVan, photos, products, flushes] = await Promise.all([
    db('firms').where({ id: firmId }).first('time_zone', 'cold_bottom_threshold_k') as Promise<
      { time_zone: string; cold_bottom_threshold_k: string | null } | undefined
    >,
    db('job_steps as s')
      .leftJoin('users as u', 'u.id', 's.done_by_user_id')
      .where({ 's.firm_id': firmId, 's.job_id': job.id })
      .select('s.step', db.raw('coalesce(s.tapped_at, s.done_at) as done_at'), 'u.name as done_by_name') as Promise<
      { step: JobStep; done_at: Date; done_by_name: string | null }[]
    >,
    db('job_radiator_readings')
      .where(jobOf)
      .select('radiator_index', 'phase', 'top_c', 'bottom_c', 'flow_c', 'return_c', 'room_c') as Promise<
      Record<string, string | number | null>[]
    >,
    db('job_agitations as a')
      .leftJoin('kit_items as i', (j) => j.on('i.id', '=', 'a.kit_item_id').andOn('i.firm_id', '=', 'a.firm_id'))
      .where({ 'a.firm_id': firmId, 'a.job_id': job.id })
      .select(
        'a.radiator_index',
        'a.minutes',
        'a.kit_item_id',
        'i.asset_tag',
        'a.magnitude_ms2',
        'a.recorded_on',
      ) as Promise<Record<string, string | number | null>[]>,
    db('job_water_tests').where(jobOf).first() as Promise<Record<string, string | number | null> | undefined>,
    kitItemsWithKind(db, firmId)
      .join('job_kit_items as jk', (j) => j.on('jk.kit_item_id', '=', 'i.id').andOn('jk.firm_id', '=', 'i.firm_id'))
      .where('jk.job_id', job.id)
      .select('i.id', 'i.asset_tag', 'ik.name as kind_name', 'k.name as kit_name') as Promise<
      { id: number; asset_tag: string; kind_name: string; kit_name: string | null }[]
    >,
    job.van_location_id === null
      ? Promise.resolve([])
      : (kitItemsWithKind(db, firmId)
          .where('i.location_id', job.van_location_id)
          .select('i.id', 'i.asset_tag', 'ik.name as kind_name', 'k.name as kit_name', 'i.vibration_ms2') as Promise<
          { id: number; asset_tag: string; kind_name: string; kit_name: string | null; vibration_ms2: string | null }[]
        >),
    db('photos')
      .where(jobOf)
      .orderBy('id')
      .select(
        'id',
        'tag',
        'caption',
        'content_type',
        'object_key',
        db.raw('coalesce(tapped_at, created_at) as created_at'),
      ) as Promise<
      {
        id: number;
        tag: string | null;
        caption: string | null;
        content_type: string;
        object_key: string;
        created_at: Date;
      }[]
    >,
    db('job_products as jp')
      .join('products as p', (j) => j.on('p.id', '=', 'jp.product_id').andOn('p.firm_id', '=', 'jp.firm_id'))
      .where({ 'jp.firm_id': firmId, 'jp.job_id': job.id })
      .orderBy('p.id')
      .select(
        'p.id',
        'p.kind',
        'p.min_circulation_minutes',
        'p.target_min',
        'p.target_max',
        'p.target_unit',
      ) as Promise<Record<string, string | number | null>[]>,
    db('job_radiator_flushes')
      .where(jobOf)
      .select('radiator_index', db.raw('coalesce(tapped_at, flushed_at) as flushed_at')) as Promise<
      { radiator_index: number; flushed_at: Date }[]
    >,
  ]);
  return {
    firm: { timeZone: firm?.time_zone ?? DEFAULT_TIME_ZONE, coldBottomThresholdK: num(firm?.cold_bottom_threshold_k) },
    steps: steps.map((s) => ({ step: s.step, doneAt: s.done_at, doneByName: s.done_by_name })),
    flushes: flushes.map((f) => ({ radiatorIndex: Number(f.radiator_index), flushedAt: f.flushed_at })),
    readings: readings.map((r) => ({
      radiatorIndex: Number(r.radiator_index),
      phase: r.phase as ReadingPhase,
      topC: Number(r.top_c),
      bottomC: Number(r.bottom_c),
      flowC: num(r.flow_c),
      returnC: num(r.return_c),
      roomC: num(r.room_c),
    })),
    agitations: agitations.map((a) => ({
      radiatorIndex: Number(a.radiator_index),
      minutes: Number(a.minutes),
      kitItemId: num(a.kit_item_id),
      kitItemTag: (a.asset_tag as string | null) ?? null,
      magnitudeMs2: num(a.magnitude_ms2),
      recordedOn: String(a.recorded_on),
    })),
    water: water
      ? {
          mainsTdsPpm: num(water.mains_tds_ppm),
          systemTdsPpm: num(water.system_tds_ppm),
          waterClear: water.water_clear === null ? null : Boolean(water.water_clear),
          inhibitorReading: num(water.inhibitor_reading),
          inhibitorProductId: num(water.inhibitor_product_id),
          ph: num(water.ph),
        }
      : null,
    kitUsed: kitUsed.map((i) => ({ id: i.id, assetTag: i.asset_tag, kindName: i.kind_name, kitName: i.kit_name })),
    kitOnVan: kitOnVan.map((i) => ({
      id: i.id,
      assetTag: i.asset_tag,
      kindName: i.kind_name,
      kitName: i.kit_name,
      vibrationMs2: num(i.vibration_ms2),
    })),
    photos: photos.map((p) => ({
      id: p.id,
      tag: p.tag,
      caption: p.caption,
      contentType: p.content_type,
      objectKey: p.object_key,
      createdAt: p.created_at,
    })),
    products: products.map((p) => ({
      id: Number(p.id),
      kind: String(p.kind),
      minCirculationMinutes: num(p.min_circulation_minutes),
      targetMin: num(p.target_min),
      targetMax: num(p.target_max),
      targetUnit: (p.target_unit as string | null) ?? null,
    })),
  };
}

/** An inhibitor's target range, for a product named on the water tests that the job did not plan. */
export async function findInhibitor(db: Db, firmId: number, productId: number) {
  const row = (await db('products')
    .where({ firm_id: firmId, id: productId, kind: 'inhibitor' })
    .first('id', 'name', 'target_min', 'target_max', 'target_unit')) as
    | { id: number; name: string; target_min: string | null; target_max: string | null; target_unit: string | null }
    | undefined;
  return (
    row && {
      id: row.id,
      name: row.name,
      targetMin: num(row.target_min),
      targetMax: num(row.target_max),
      targetUnit: row.target_unit,
    }
  );
}

/** The agitations an engineer recorded on a day, across all their jobs (the HSE points day). */
export async function agitationsOfDay(
  db: Db,
  firmId: number,
  engineerMemberId: number,
  day: string,
): Promise<{ magnitudeMs2: number | null; minutes: number }[]> {
  const rows = (await db('job_agitations')
    .where({ firm_id: firmId, engineer_member_id: engineerMemberId, recorded_on: day })
    .select('magnitude_ms2', 'minutes')) as {
    magnitude_ms2: string | null;
    minutes: number;
  }[];
  return rows.map((r) => ({ magnitudeMs2: num(r.magnitude_ms2), minutes: Number(r.minutes) }));
}

export async function memberName(db: Db, firmId: number, memberId: number): Promise<string | null> {
  const row = (await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.firm_id': firmId, 'm.id': memberId })
    .first('u.name')) as { name: string } | undefined;
  return row?.name ?? null;
}

/** A job's photos with where each is stored, for the report. */
export async function listJobPhotoObjects(db: Db, firmId: number, jobId: number) {
  return (await db('photos')
    .where({ firm_id: firmId, job_id: jobId })
    .orderBy('id')
    .select('object_key', 'content_type', 'tag', 'caption')) as {
    object_key: string;
    content_type: string;
    tag: string | null;
    caption: string | null;
  }[];
}
