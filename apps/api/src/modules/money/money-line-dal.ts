import type { Knex } from 'knex';
import type { MoneyLine, PricedLine } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

/** The three line tables share one shape (migrations/2026120305*_create-*-lines.ts). */
export type LineTable = 'quote_lines' | 'invoice_lines' | 'credit_note_lines';
const parentColumn: Record<LineTable, string> = {
  quote_lines: 'quote_id',
  invoice_lines: 'invoice_id',
  credit_note_lines: 'credit_note_id',
};

export interface NewLine extends PricedLine {
  kind: MoneyLine['kind'];
  priceItemId?: number | null;
  productId?: number | null;
  invoiceLineId?: number | null;
}

export async function insertLines(
  trx: Knex.Transaction,
  table: LineTable,
  firmId: number,
  parentId: number,
  lines: NewLine[],
): Promise<void> {
  if (!lines.length) return;
  await trx(table).insert(
    lines.map((l, i) => ({
      firm_id: firmId,
      [parentColumn[table]]: parentId,
      position: i + 1,
      kind: l.kind,
      price_item_id: l.priceItemId ?? null,
      product_id: l.productId ?? null,
      ...(table === 'credit_note_lines' ? { invoice_line_id: l.invoiceLineId ?? null } : {}),
      description: l.description,
      quantity: l.quantity,
      unit_pence: l.unitPence,
      vat_rate_bp: l.vatRateBp,
      net_pence: l.netPence,
      vat_pence: l.vatPence,
    })),
  );
}

export async function deleteLines(trx: Knex.Transaction, table: LineTable, firmId: number, parentId: number) {
  await trx(table)
    .where({ firm_id: firmId, [parentColumn[table]]: parentId })
    .delete();
}

/** Lines of several parents at once, keyed by parent id, in their order. */
export async function listLines(
  db: Db,
  table: LineTable,
  firmId: number,
  parentIds: number[],
): Promise<Map<number, MoneyLine[]>> {
  const out = new Map<number, MoneyLine[]>();
  if (!parentIds.length) return out;
  const col = parentColumn[table];
  const rows = (await db(table)
    .where({ firm_id: firmId })
    .whereIn(col, parentIds)
    .orderBy([col, 'position'])
    .select()) as Record<string, unknown>[];
  for (const r of rows) {
    const parent = Number(r[col]);
    const list = out.get(parent) ?? [];
    list.push({
      id: Number(r.id),
      kind: r.kind as MoneyLine['kind'],
      priceItemId: r.price_item_id === null ? null : Number(r.price_item_id),
      productId: r.product_id === null ? null : Number(r.product_id),
      description: String(r.description),
      quantity: Number(r.quantity),
      unitPence: Number(r.unit_pence),
      vatRateBp: Number(r.vat_rate_bp),
      netPence: Number(r.net_pence),
      vatPence: Number(r.vat_pence),
    });
    out.set(parent, list);
  }
  return out;
}
