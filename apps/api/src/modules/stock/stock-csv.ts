import type { Response } from 'express';
import type { Movement, ReorderRow } from '@heatfleet/domain';
import { toCsv } from '../../lib/csv.ts';

// Through lib/csv.ts: text cells quoted, and any formula trigger after a separator neutralised.

const movementColumns = [
  'id',
  'when',
  'kind',
  'place',
  'product',
  'lot',
  'expires',
  'quantity',
  'reason',
  'reference',
  'by',
  // Last, so a sheet built on the earlier columns keeps reading them: when the engineer tapped, if the phone said.
  'tapped',
];

export function movementsCsv(rows: Movement[]): string {
  return toCsv(
    movementColumns,
    rows.map((m) => [
      m.id,
      m.createdAt,
      m.kind,
      m.location.name,
      m.product.name,
      m.batch.lotNumber,
      m.batch.expiresOn,
      m.quantityDelta,
      m.reason ?? '',
      m.reference ?? '',
      m.byName,
      m.tappedAt ?? '',
    ]),
  );
}

const reorderColumns = [
  'product',
  'usable after restock',
  'minimum',
  'target',
  'order packs',
  'used in 90 days',
  'days of cover',
];

export function reorderCsv(rows: ReorderRow[]): string {
  return toCsv(
    reorderColumns,
    rows.map((r) => [
      r.product.name,
      r.usableAfterTransfers,
      r.par.minimum,
      r.par.target,
      r.orderQuantity,
      r.used90Days,
      r.daysOfCover ?? '',
    ]),
  );
}

export function sendCsv(res: Response, filename: string, csv: string): void {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
  res.send(csv);
}
