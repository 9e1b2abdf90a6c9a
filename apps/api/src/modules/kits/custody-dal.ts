import type { Knex } from 'knex';
import type { CustodyEvent, ItemCondition } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export async function insertCustodyEvents(
  trx: Knex.Transaction,
  rows: {
    firm_id: number;
    item_id: number;
    kit_id: number | null;
    action: 'check_out' | 'check_in' | 'move';
    from_location_id: number | null;
    to_location_id: number | null;
    by_user_id: number;
    condition: ItemCondition | null;
    missing_parts: string | null;
    note: string | null;
    overdue_reason: string | null;
    cleaned: boolean;
    photo_id: number | null;
    created_at: Date;
    /** When the engineer tapped (X-Tapped-At), if the request said. */
    tapped_at: Date | null;
  }[],
): Promise<void> {
  if (rows.length) await trx('custody_events').insert(rows);
}

export async function listCustodyEvents(
  db: Db,
  firmId: number,
  where: { kitId?: number; itemId?: number },
  limit = 100,
): Promise<CustodyEvent[]> {
  const q = db('custody_events as e')
    .join('kit_items as i', function joinItem() {
      this.on('i.id', '=', 'e.item_id').andOn('i.firm_id', '=', 'e.firm_id');
    })
    .join('users as u', 'u.id', 'e.by_user_id')
    .leftJoin('locations as lf', function joinFrom() {
      this.on('lf.id', '=', 'e.from_location_id').andOn('lf.firm_id', '=', 'e.firm_id');
    })
    .leftJoin('locations as lt', function joinTo() {
      this.on('lt.id', '=', 'e.to_location_id').andOn('lt.firm_id', '=', 'e.firm_id');
    })
    .where('e.firm_id', firmId)
    .orderBy('e.id', 'desc')
    .limit(limit)
    .select(
      'e.*',
      'i.asset_tag',
      'u.name as by_name',
      'lf.kind as f_kind',
      'lf.name as f_name',
      'lf.registration as f_reg',
      'lt.kind as t_kind',
      'lt.name as t_name',
      'lt.registration as t_reg',
    );
  if (where.kitId !== undefined) q.where('e.kit_id', where.kitId);
  if (where.itemId !== undefined) q.where('e.item_id', where.itemId);
  const rows = (await q) as Record<string, never>[];
  const ref = (id: number | null, kind: 'depot' | 'van' | null, name: string | null, registration: string | null) =>
    id && kind && name ? { id, kind, name, registration, engineerName: null } : null;
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    action: r.action as CustodyEvent['action'],
    item: { id: r.item_id as number, assetTag: r.asset_tag as string },
    kitId: (r.kit_id as number | null) ?? null,
    from: ref(
      r.from_location_id as number | null,
      r.f_kind as 'van' | null,
      r.f_name as string | null,
      r.f_reg as string | null,
    ),
    to: ref(
      r.to_location_id as number | null,
      r.t_kind as 'van' | null,
      r.t_name as string | null,
      r.t_reg as string | null,
    ),
    byName: r.by_name as string,
    condition: (r.condition as ItemCondition | null) ?? null,
    missingParts: (r.missing_parts as string | null) ?? null,
    note: (r.note as string | null) ?? null,
    overdueReason: (r.overdue_reason as string | null) ?? null,
    cleaned: Boolean(r.cleaned),
    photoId: (r.photo_id as number | null) ?? null,
    createdAt: (r.created_at as Date).toISOString(),
    tappedAt: r.tapped_at ? (r.tapped_at as Date).toISOString() : null,
  }));
}
