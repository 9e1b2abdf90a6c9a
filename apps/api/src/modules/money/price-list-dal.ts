import type { Knex } from 'knex';
import type { PriceItem, PriceItemInput, PriceVisitKind } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

function toItem(r: Record<string, unknown>): PriceItem {
  const bands =
    typeof r.bands === 'string' ? (JSON.parse(r.bands) as PriceItem['bands']) : (r.bands as PriceItem['bands']);
  return {
    id: Number(r.id),
    kind: r.kind as PriceItem['kind'],
    name: String(r.name),
    visitKind: (r.visit_kind as PriceItem['visitKind']) ?? null,
    pricing: (r.pricing as PriceItem['pricing']) ?? null,
    basePence: Number(r.base_pence),
    perRadiatorPence: Number(r.per_radiator_pence),
    bands: bands ?? [],
    productId: r.product_id === null ? null : Number(r.product_id),
    productName: (r.product_name as string | null) ?? null,
    unitPence: Number(r.unit_pence),
    active: Boolean(r.active),
  };
}

const columns = ['i.*', 'p.name as product_name'];

function itemsQuery(db: Db, firmId: number) {
  return db('price_items as i')
    .leftJoin('products as p', (j) => j.on('p.id', '=', 'i.product_id').andOn('p.firm_id', '=', 'i.firm_id'))
    .where('i.firm_id', firmId);
}

export async function listPriceItems(
  db: Db,
  firmId: number,
  opts: { activeOnly?: boolean } = {},
): Promise<PriceItem[]> {
  const q = itemsQuery(db, firmId);
  if (opts.activeOnly) q.andWhere('i.active', true);
  const rows = (await q.orderBy([{ column: 'i.kind' }, { column: 'i.name' }]).select(columns)) as Record<
    string,
    unknown
  >[];
  return rows.map(toItem);
}

export async function findPriceItem(db: Db, firmId: number, id: number): Promise<PriceItem | undefined> {
  const r = (await itemsQuery(db, firmId).andWhere('i.id', id).first(columns)) as Record<string, unknown> | undefined;
  return r && toItem(r);
}

export async function productBelongsToFirm(db: Db, firmId: number, productId: number): Promise<boolean> {
  return !!(await db('products').where({ firm_id: firmId, id: productId }).first('id'));
}

function toRow(input: PriceItemInput) {
  const visit = input.kind === 'visit';
  return {
    kind: input.kind,
    name: input.name,
    visit_kind: visit ? (input.visitKind ?? null) : null,
    pricing: visit ? (input.pricing ?? null) : null,
    base_pence: visit ? input.basePence : 0,
    per_radiator_pence: visit ? input.perRadiatorPence : 0,
    bands: visit && input.pricing === 'bands' ? JSON.stringify(input.bands) : null,
    product_id: input.kind === 'chemical' ? (input.productId ?? null) : null,
    unit_pence: visit ? 0 : input.unitPence,
    active: input.active,
  };
}

export async function insertPriceItem(db: Db, firmId: number, input: PriceItemInput): Promise<number> {
  const [id] = await db('price_items').insert({ firm_id: firmId, ...toRow(input) });
  return id as number;
}

export async function updatePriceItem(db: Db, firmId: number, id: number, input: PriceItemInput): Promise<boolean> {
  return (await db('price_items').where({ firm_id: firmId, id }).update(toRow(input))) > 0;
}

/** The active price of a kind of visit (the newest, if the firm keeps two). */
export async function findVisitPrice(db: Db, firmId: number, kind: PriceVisitKind): Promise<PriceItem | undefined> {
  const r = (await itemsQuery(db, firmId)
    .andWhere({ 'i.kind': 'visit', 'i.visit_kind': kind, 'i.active': true })
    .orderBy('i.id', 'desc')
    .first(columns)) as Record<string, unknown> | undefined;
  return r && toItem(r);
}

/** Active chemical prices by product id. */
export async function chemicalPrices(db: Db, firmId: number): Promise<Map<number, PriceItem>> {
  const rows = (await itemsQuery(db, firmId)
    .andWhere({ 'i.kind': 'chemical', 'i.active': true })
    .orderBy('i.id')
    .select(columns)) as Record<string, unknown>[];
  return new Map(rows.map((r) => [Number(r.product_id), toItem(r)]));
}
