import { z } from 'zod';
import {
  idParamSchema,
  ledgerPageSchema,
  ledgerQuerySchema,
  receiptInputSchema,
  reversalInputSchema,
  stocktakeInputSchema,
  stockMovedSchema,
  transferInputSchema,
  usageInputSchema,
  writeOffInputSchema,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { readTappedAt, tappedAtOf } from '../../middleware/tapped-at.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { sendCsvPieces } from './stock-csv.ts';
import { recordMovement } from './stock-movement-service.ts';
import { exportLedgerCsv, ledgerPage } from './stock-query-service.ts';
import { receiveDelivery } from './receiving-service.ts';
import { reverseMovement, transferStock, useStock, writeOff } from './stock-service.ts';
import { recordStocktake } from './stocktake-service.ts';

type MovementWork<I> = (
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  input: I,
  params: { id?: number; tappedAt?: Date | null },
) => Promise<string>;

/** A stock-changing route: idempotent by header, retried on deadlock, answering with the movements written. */
function movementRoute<B extends z.ZodType>(
  path: string,
  body: B,
  summary: string,
  work: MovementWork<z.infer<B>>,
  params?: z.ZodType,
  options: { tapTime?: boolean } = {},
) {
  return defineRoute({
    method: 'post',
    path,
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: `${summary} Send an Idempotency-Key header: a retry with the same key moves nothing twice.`,
    request: { body, ...(params && { params }) },
    responses: {
      201: { description: 'Moved', schema: stockMovedSchema },
      409: { description: 'Not enough usable stock, or an expired batch' },
      422: { description: 'Refused: an expired or short-life lot at receiving, a whole place counted to nothing' },
    },
    ...(options.tapTime && { before: (deps: AppDeps) => [readTappedAt(deps)] }),
    handle: async ({ body: input, params: p, req, res, deps, actor }) => {
      const given = { ...((p ?? {}) as { id?: number }), tappedAt: tappedAtOf(res) };
      const { status, moved } = await recordMovement(
        deps,
        actor,
        idempotencyKeyOf(req),
        `${path} ${JSON.stringify(p ?? {})}`,
        (trx) => work(trx, deps, actor, input as z.infer<B>, given),
      );
      res.status(status).json(moved);
    },
  });
}

const ledgerExportQuery = ledgerQuerySchema.omit({ before: true, limit: true });

export const stockMovementRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/stock/movements',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'The ledger, newest first, a page at a time (keyset: pass nextCursor as before)',
    request: { query: ledgerQuerySchema },
    responses: { 200: { description: 'Page', schema: ledgerPageSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json(await ledgerPage(deps, actor, query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/stock/movements.csv',
    heavy: true,
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'The ledger (same filters) as CSV, up to 100000 rows',
    request: { query: ledgerExportQuery },
    responses: { 200: { description: 'CSV' } },
    handle: async ({ query, res, deps, actor }) => {
      await sendCsvPieces(res, 'stock-ledger.csv', await exportLedgerCsv(deps, actor, query));
    },
  }),
  movementRoute(
    '/stock/receipts',
    receiptInputSchema,
    'Receive a delivery at a depot (lines with lot and expiry). An expired lot is refused (write it off instead); a lot with less than its product\u2019s minimum remaining life needs confirmShortLife.',
    receiveDelivery,
  ),
  movementRoute(
    '/stock/transfers',
    transferInputSchema,
    'Move stock between places (depot to van, van to van, van to depot).',
    transferStock,
  ),
  movementRoute(
    '/stock/usages',
    usageInputSchema,
    'Record stock used by hand, with a reason; X-Tapped-At (ISO 8601) records when it was used.',
    useStock,
    undefined,
    { tapTime: true },
  ),
  movementRoute(
    '/stock/stocktakes',
    stocktakeInputSchema,
    'Record a stocktake: each difference becomes an adjustment; found lots (product, lot, expiry) are counted in. Counting a whole place to nothing needs confirmZeroing.',
    recordStocktake,
  ),
  movementRoute('/stock/write-offs', writeOffInputSchema, 'Write off expired, damaged or spilled stock.', writeOff),
  movementRoute(
    '/stock/movements/:id/reverse',
    reversalInputSchema,
    'Reverse a movement (a transfer as a whole) by one pointing at it.',
    (trx, deps, actor, input, params) => reverseMovement(trx, deps, actor, params.id!, input.reason),
    idParamSchema,
  ),
];
