import type { Knex } from 'knex';
import type { ItemKind, ItemKindInput } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

interface ItemKindRow {
  id: number;
  name: string;
  interval_days: number | null;
  interval_uses: number | null;
  due_soon_days: number;
  overdue_policy: ItemKind['overduePolicy'];
  electrical: number;
}

const toItemKind = (r: ItemKindRow): ItemKind => ({
  id: r.id,
  name: r.name,
  intervalDays: r.interval_days,
  intervalUses: r.interval_uses,
  dueSoonDays: r.due_soon_days,
  overduePolicy: r.overdue_policy,
  electrical: Boolean(r.electrical),
});

const toRow = (k: Partial<ItemKindInput>) => ({
  ...(k.name !== undefined && { name: k.name }),
  ...(k.intervalDays !== undefined && { interval_days: k.intervalDays }),
  ...(k.intervalUses !== undefined && { interval_uses: k.intervalUses }),
  ...(k.dueSoonDays !== undefined && { due_soon_days: k.dueSoonDays }),
  ...(k.overduePolicy !== undefined && { overdue_policy: k.overduePolicy }),
  ...(k.electrical !== undefined && { electrical: k.electrical }),
});

export async function listItemKinds(db: Db, firmId: number): Promise<ItemKind[]> {
  return ((await db('item_kinds').where({ firm_id: firmId }).orderBy('name')) as ItemKindRow[]).map(toItemKind);
}

export async function findItemKind(db: Db, firmId: number, id: number): Promise<ItemKind | undefined> {
  const row = (await db('item_kinds').where({ firm_id: firmId, id }).first()) as ItemKindRow | undefined;
  return row ? toItemKind(row) : undefined;
}

export async function findItemKindByName(db: Db, firmId: number, name: string): Promise<ItemKind | undefined> {
  const row = (await db('item_kinds').where({ firm_id: firmId, name }).first()) as ItemKindRow | undefined;
  return row ? toItemKind(row) : undefined;
}

export async function insertItemKind(trx: Knex.Transaction, firmId: number, kind: ItemKindInput): Promise<number> {
  const [id] = await trx('item_kinds').insert({ firm_id: firmId, ...toRow(kind) });
  return id as number;
}

export async function updateItemKind(
  trx: Knex.Transaction,
  firmId: number,
  id: number,
  patch: Partial<ItemKindInput>,
): Promise<void> {
  const row = toRow(patch);
  if (Object.keys(row).length) await trx('item_kinds').where({ firm_id: firmId, id }).update(row);
}
