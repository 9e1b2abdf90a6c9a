import type { Knex } from 'knex';
import type { Inspection } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export async function insertInspection(
  trx: Knex.Transaction,
  row: {
    firm_id: number;
    item_id: number;
    result: Inspection['result'];
    notes: string | null;
    photo_id: number | null;
    by_user_id: number;
    inspected_on: string;
    created_at: Date;
  },
): Promise<number> {
  const [id] = await trx('inspections').insert(row);
  return id as number;
}

export async function listInspections(db: Db, firmId: number, itemIds: number[]): Promise<Inspection[]> {
  if (itemIds.length === 0) return [];
  const rows = (await db('inspections as ins')
    .join('users as u', 'u.id', 'ins.by_user_id')
    .where('ins.firm_id', firmId)
    .whereIn('ins.item_id', itemIds)
    .orderBy('ins.id', 'desc')
    .limit(200)
    .select('ins.*', 'u.name as by_name')) as Record<string, unknown>[];
  return rows.map((r) => ({
    id: r.id as number,
    itemId: r.item_id as number,
    result: r.result as Inspection['result'],
    notes: (r.notes as string | null) ?? null,
    photoId: (r.photo_id as number | null) ?? null,
    byName: r.by_name as string,
    inspectedOn: r.inspected_on as string,
    createdAt: (r.created_at as Date).toISOString(),
  }));
}
