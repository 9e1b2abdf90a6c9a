import type { Response } from 'express';
import { stringify } from 'csv-stringify/sync';
import type { Movement, ReorderRow } from '@heatfleet/domain';

// escape_formulas: a cell starting with = + - @ is prefixed, so a spreadsheet never runs it.

const movementColumns = ['id', 'when', 'kind', 'place', 'product', 'lot', 'expires', 'quantity', 'reason', 'reference', 'by'];

export function movementsCsv(rows: Movement[]): string {
  return stringify(
    rows.map((m) => [m.id, m.createdAt, m.kind, m.location.name, m.product.name, m.batch.lotNumber, m.batch.expiresOn, m.quantityDelta, m.reason ?? '', m.reference ?? '', m.byName]),
    { header: true, columns: movementColumns, escape_formulas: true },
  );
}

const reorderColumns = ['product', 'usable after restock', 'minimum', 'target', 'order packs', 'used in 90 days', 'days of cover'];

export function reorderCsv(rows: ReorderRow[]): string {
  return stringify(
    rows.map((r) => [r.product.name, r.usableAfterTransfers, r.par.minimum, r.par.target, r.orderQuantity, r.used90Days, r.daysOfCover ?? '']),
    { header: true, columns: reorderColumns, escape_formulas: true },
  );
}

export function sendCsv(res: Response, filename: string, csv: string): void {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
  res.send(csv);
}
