import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export async function listActiveVans(db: Db, firmId: number) {
  return (await db('locations as l')
    .leftJoin('memberships as m', (j) => j.on('m.id', '=', 'l.engineer_member_id').andOn('m.firm_id', '=', 'l.firm_id'))
    .leftJoin('users as u', 'u.id', 'm.user_id')
    .where({ 'l.firm_id': firmId, 'l.kind': 'van', 'l.active': true })
    .orderBy('l.name')
    .select(
      'l.id',
      'l.name',
      'l.registration',
      'l.engineer_member_id',
      'u.name as engineer_name',
      'l.mot_due_on',
      'l.service_due_on',
    )) as {
    id: number;
    name: string;
    registration: string | null;
    engineer_member_id: number | null;
    engineer_name: string | null;
    mot_due_on: string | null;
    service_due_on: string | null;
  }[];
}

export interface ItemDueInputs {
  id: number;
  asset_tag: string;
  in_service_since: string;
  kind_name: string;
  interval_days: number | null;
  interval_uses: number | null;
  due_soon_days: number;
  location_name: string | null;
  last_inspected_on: string | null;
  uses_since_inspection: number | string | null;
}

/**
 * The due computation's inputs for every item with an inspection rule. Three flat queries for the whole firm,
 * joined here by id (as one statement with derived tables MariaDB re-read them per item). The last inspection day
 * and the uses since it (check-ins and completed-job uses, as the kit screens count them) are the item's own
 * columns, kept by the database with every event (migrations/20261203230810_keep-kit-item-inspection-state.ts).
 */
export async function listItemDueInputs(db: Db, firmId: number): Promise<ItemDueInputs[]> {
  const [items, kinds, places] = await Promise.all([
    db('kit_items')
      .where('firm_id', firmId)
      .whereNot('condition', 'out_of_service')
      .select(
        'id',
        'asset_tag',
        'in_service_since',
        'kind_id',
        'location_id',
        'last_inspected_on',
        'uses_since_inspection',
      ) as Promise<
      {
        id: number;
        asset_tag: string;
        in_service_since: string;
        kind_id: number;
        location_id: number | null;
        last_inspected_on: string | null;
        uses_since_inspection: number;
      }[]
    >,
    db('item_kinds')
      .where('firm_id', firmId)
      .select('id', 'name', 'interval_days', 'interval_uses', 'due_soon_days') as Promise<
      { id: number; name: string; interval_days: number | null; interval_uses: number | null; due_soon_days: number }[]
    >,
    db('locations').where('firm_id', firmId).select('id', 'name') as Promise<{ id: number; name: string }[]>,
  ]);
  const kindById = new Map(
    kinds.filter((k) => k.interval_days !== null || k.interval_uses !== null).map((k) => [k.id, k]),
  );
  const placeById = new Map(places.map((p) => [p.id, p.name]));
  return items.flatMap((i) => {
    const kind = kindById.get(i.kind_id);
    if (!kind) return [];
    return [
      {
        id: i.id,
        asset_tag: i.asset_tag,
        in_service_since: i.in_service_since,
        kind_name: kind.name,
        interval_days: kind.interval_days,
        interval_uses: kind.interval_uses,
        due_soon_days: kind.due_soon_days,
        location_name: i.location_id === null ? null : (placeById.get(i.location_id) ?? null),
        last_inspected_on: i.last_inspected_on,
        uses_since_inspection: i.uses_since_inspection,
      },
    ];
  });
}

export async function countJobsScheduled(db: Db, firmId: number, from: string, toExclusive: string) {
  const rows = (await db('jobs')
    .where('firm_id', firmId)
    .where('scheduled_on', '>=', from)
    .where('scheduled_on', '<', toExclusive)
    .groupBy('status')
    .select('status')
    .count({ n: '*' })) as { status: 'planned' | 'completed'; n: number | string }[];
  const of = (s: string) => Number(rows.find((r) => r.status === s)?.n ?? 0);
  return { planned: of('planned'), completed: of('completed') };
}

/**
 * Packs used per product in each of the given month windows (instants, oldest first; n + 1 bounds for
 * n months), bucketed in SQL so a year of the ledger is read once from the covering index.
 */
export async function packsUsedByMonth(db: Db, firmId: number, bounds: Date[]) {
  if (bounds.length < 2) return [];
  const cases = bounds
    .slice(1)
    .map((_, i) => `WHEN created_at < ? THEN ${i}`)
    .join(' ');
  const rows = (await db('stock_movements')
    .where({ firm_id: firmId, kind: 'used' })
    .where('created_at', '>=', bounds[0]!)
    .where('created_at', '<', bounds[bounds.length - 1]!)
    .groupBy('month_index', 'product_id')
    .select(db.raw(`CASE ${cases} END AS month_index`, bounds.slice(1)), 'product_id')
    .select(db.raw('-SUM(quantity_delta) AS packs'))) as {
    month_index: number | string;
    product_id: number;
    packs: number | string;
  }[];
  return rows.map((r) => ({ monthIndex: Number(r.month_index), productId: r.product_id, packs: Number(r.packs) }));
}

export async function listProductsForUsage(db: Db, firmId: number) {
  return (await db('products').where('firm_id', firmId).select('id', 'name', 'kind', 'pack_size_ml')) as {
    id: number;
    name: string;
    kind: string;
    pack_size_ml: number;
  }[];
}

export async function listLatestReminders(db: Db, firmId: number, limit: number) {
  const rows = (await db('reminders')
    .where('firm_id', firmId)
    .orderBy([
      { column: 'created_at', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .limit(limit)
    .select('id', 'kind', 'subject_type', 'subject_id', 'summary', 'created_at')) as {
    id: number | string;
    kind: string;
    subject_type: string;
    subject_id: number;
    summary: string;
    created_at: Date;
  }[];
  return rows.map((r) => ({
    id: Number(r.id),
    kind: r.kind,
    subjectType: r.subject_type,
    subjectId: r.subject_id,
    summary: r.summary,
    createdAt: new Date(r.created_at).toISOString(),
  }));
}

export async function listEngineers(db: Db, firmId: number) {
  return (await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.firm_id': firmId, 'm.active': true, 'm.role': 'engineer' })
    .orderBy('u.name')
    .select('m.id as member_id', 'u.name')) as { member_id: number; name: string }[];
}

/** Today's agitations per engineer, from the job sheet's table (absent until its migration has run). */
export async function listAgitationsOn(db: Db, firmId: number, day: string, memberId?: number) {
  if (!(await db.schema.hasTable('job_agitations'))) return null;
  const q = db('job_agitations')
    .where({ firm_id: firmId, recorded_on: day })
    .whereNotNull('engineer_member_id')
    .select('engineer_member_id', 'magnitude_ms2', 'minutes');
  if (memberId !== undefined) q.where('engineer_member_id', memberId);
  return ((await q) as { engineer_member_id: number; magnitude_ms2: string | number | null; minutes: number }[]).map(
    (r) => ({
      memberId: r.engineer_member_id,
      magnitudeMs2: r.magnitude_ms2 === null ? null : Number(r.magnitude_ms2),
      minutes: Number(r.minutes),
    }),
  );
}
