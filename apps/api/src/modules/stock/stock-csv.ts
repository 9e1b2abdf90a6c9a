import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Response } from 'express';
import { formatCsvDateTime, formatPackSize, penceToPounds, type Movement, type ReorderRow } from '@heatfleet/domain';
import { toCsv } from '../../lib/csv.ts';

// Through lib/csv.ts: text cells quoted, and any formula trigger after a separator neutralised.

/** Times in the firm's zone, named in the header (issue 14): "when (Europe/London)". */
const movementColumns = (timeZone: string) => [
  'id',
  `when (${timeZone})`,
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
  `tapped (${timeZone})`,
];

/** The ledger's rows as CSV; `header: false` for a piece after the first (stock-query-service, exportLedgerCsv). */
export function movementsCsv(rows: Movement[], timeZone: string, options: { header?: boolean } = {}): string {
  return toCsv(
    movementColumns(timeZone),
    rows.map((m) => [
      m.id,
      formatCsvDateTime(m.createdAt, timeZone),
      m.kind,
      m.location.name,
      m.product.name,
      m.batch.lotNumber,
      m.batch.expiresOn,
      m.quantityDelta,
      m.reason ?? '',
      m.reference ?? '',
      m.byName,
      m.tappedAt ? formatCsvDateTime(m.tappedAt, timeZone) : '',
    ]),
    options,
  );
}

const reorderColumns = [
  'product',
  'supplier code',
  'pack size',
  'usable after restock (packs)',
  'minimum (packs)',
  'target (packs)',
  'order (packs)',
  'cost per pack (GBP)',
  'line cost (GBP)',
  'used in 90 days (packs)',
  'days of cover',
];

/** The reorder list with pack sizes, supplier codes and cost prices, and a last row with the total. */
export function reorderCsv(rows: ReorderRow[], totalPence: number): string {
  const money = (pence: number | null) => (pence === null ? '' : penceToPounds(pence));
  return toCsv(reorderColumns, [
    ...rows.map((r) => [
      r.product.name,
      r.product.supplierCode ?? '',
      formatPackSize(r.product.packSizeMl),
      r.usableAfterTransfers,
      r.par.minimum,
      r.par.target,
      r.orderQuantity,
      money(r.product.costPricePence),
      money(r.lineCostPence),
      r.used90Days,
      r.daysOfCover ?? '',
    ]),
    [
      rows.some((r) => r.lineCostPence === null) ? 'Total (lines with a cost price)' : 'Total',
      '',
      '',
      '',
      '',
      '',
      rows.reduce((n, r) => n + r.orderQuantity, 0),
      '',
      money(totalPence),
      '',
      '',
    ],
  ]);
}

export function sendCsv(res: Response, filename: string, csv: string): void {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
  res.send(csv);
}

/** A CSV written piece by piece as it is read, so a long export never sits whole in memory. */
export async function sendCsvPieces(res: Response, filename: string, pieces: AsyncIterable<string>): Promise<void> {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
  await pipeline(Readable.from(pieces), res);
}
