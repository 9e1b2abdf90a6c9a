import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export interface KitRow {
  id: number;
  name: string;
  notes: string | null;
}

export async function listKitRows(db: Db, firmId: number): Promise<KitRow[]> {
  return (await db('kits').where({ firm_id: firmId }).orderBy('name').select('id', 'name', 'notes')) as KitRow[];
}

export async function findKit(
  db: Db,
  firmId: number,
  id: number,
  opts: { forUpdate?: boolean } = {},
): Promise<KitRow | undefined> {
  const q = db('kits').where({ firm_id: firmId, id }).first('id', 'name', 'notes');
  if (opts.forUpdate) q.forUpdate();
  return (await q) as KitRow | undefined;
}

export async function kitNameTaken(db: Db, firmId: number, name: string): Promise<boolean> {
  return Boolean(await db('kits').where({ firm_id: firmId, name }).first('id'));
}

export async function insertKit(
  trx: Knex.Transaction,
  firmId: number,
  kit: { name: string; notes: string | null },
): Promise<number> {
  const [id] = await trx('kits').insert({ firm_id: firmId, name: kit.name, notes: kit.notes });
  return id as number;
}

export async function updateKitRow(
  trx: Knex.Transaction,
  firmId: number,
  id: number,
  patch: Partial<{ name: string; notes: string | null }>,
): Promise<void> {
  if (Object.keys(patch).length) await trx('kits').where({ firm_id: firmId, id }).update(patch);
}
