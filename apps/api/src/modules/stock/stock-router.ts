import type { RequestHandler, Response } from 'express';
import multer from 'multer';
import { stringify } from 'csv-stringify/sync';
import { z } from 'zod';
import {
  idParamSchema,
  ledgerQuerySchema,
  movementSchema,
  parLevelInputSchema,
  productInputSchema,
  productSchema,
  receiptInputSchema,
  restockApplyInputSchema,
  reversalInputSchema,
  stocktakeInputSchema,
  transferInputSchema,
  usageInputSchema,
  writeOffInputSchema,
  type Movement,
} from '@heatfleet/domain';
import { ForbiddenError } from '@casl/ability';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { HttpError, notFound } from '../../lib/http-error.ts';
import { idempotencyKeyOf, runIdempotent } from '../../lib/idempotency.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { findVanOfMember } from '../locations/location-dal.ts';
import { createProduct, getProduct, listProducts, openSafetyDataSheet, saveSafetyDataSheet, SDS_MAX_BYTES, updateProduct } from './product-service.ts';
import { applyRestockRun, getRestockRun } from './restock-service.ts';
import { batchesAt, ledgerForExport, ledgerPage, movementsByIds, stockGrid, stockLevels } from './stock-query-service.ts';
import { receiveDelivery, recordStocktake, reverseMovement, transferStock, useStock, writeOff } from './stock-service.ts';
import { firmToday } from '../firms/firm-today.ts';

const movedSchema = z.object({ groupId: z.string(), movements: z.array(movementSchema) });

/** A stock-changing route: idempotent by header, retried on deadlock, answering with the movements written. */
function movementRoute<B extends z.ZodType>(path: string, body: B, summary: string, work: (trx: Knex.Transaction, deps: AppDeps, actor: Actor, input: z.infer<B>, params: { id?: number }) => Promise<string>, params?: z.ZodType) {
  return defineRoute({
    method: 'post', path, tag: 'Stock', access: 'member', tenantData: true,
    summary: `${summary} Send an Idempotency-Key header: a retry with the same key moves nothing twice.`,
    request: { body, ...(params && { params }) },
    responses: { 201: { description: 'Moved', schema: movedSchema }, 409: { description: 'Not enough usable stock, or an expired batch' } },
    handle: async ({ body: input, params: p, req, res, deps, actor }) => {
      const key = idempotencyKeyOf(req);
      const out = await withTransactionRetry(() =>
        runIdempotent(deps, actor, key, `${path} ${JSON.stringify(p ?? {})}`, async (trx) => {
          const groupId = await work(trx, deps, actor, input as z.infer<B>, (p ?? {}) as { id?: number });
          const movements = (await trx('stock_movements').where({ firm_id: actor.firmId, group_id: groupId }).select('id')) as { id: number }[];
          return { status: 201, body: { groupId, movementIds: movements.map((m) => Number(m.id)) } };
        }),
      );
      const ids = (out.body as { movementIds: number[] }).movementIds;
      const page = await movementsByIds(deps.db, actor.firmId, ids);
      res.status(out.status).json({ groupId: (out.body as { groupId: string }).groupId, movements: page });
    },
  });
}

const sdsUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: SDS_MAX_BYTES, files: 1, fields: 2 } }).single('file');
const receiveSds: RequestHandler = (req, res, next) =>
  sdsUpload(req, res, (err: unknown) => {
    if (!err) return next();
    if ((err as { code?: string }).code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, 'That safety data sheet is over 10 MB.', 'TooLarge'));
    next(new HttpError(422, 'Send the PDF as multipart form data in a field called "file".', 'ValidationFailed'));
  });

const csvHeaders = ['id', 'when', 'kind', 'place', 'product', 'lot', 'expires', 'quantity', 'reason', 'reference', 'by'];
function movementsCsv(rows: Movement[]): string {
  // escape_formulas: a cell starting with = + - @ is prefixed, so a spreadsheet never runs it.
  return stringify(
    rows.map((m) => [m.id, m.createdAt, m.kind, m.location.name, m.product.name, m.batch.lotNumber, m.batch.expiresOn, m.quantityDelta, m.reason ?? '', m.reference ?? '', m.byName]),
    { header: true, columns: csvHeaders, escape_formulas: true },
  );
}

function sendCsv(res: Response, filename: string, csv: string) {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
  res.send(csv);
}

const depotQuery = z.strictObject({ depotId: z.coerce.number().int().positive().optional() });
const ledgerExportQuery = ledgerQuerySchema.omit({ before: true, limit: true });

export const stockRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get', path: '/products', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'Chemical products', request: {},
    responses: { 200: { description: 'Products', schema: z.object({ products: z.array(productSchema) }) } },
    handle: async ({ res, deps, actor }) => {
      res.json({ products: await listProducts(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post', path: '/products', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'Add a product (Owner, Admin, Stores)', request: { body: productInputSchema },
    responses: { 201: { description: 'Added', schema: z.object({ product: productSchema }) } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ product: await createProduct(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get', path: '/products/:id', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'A product', request: { params: idParamSchema },
    responses: { 200: { description: 'Product', schema: z.object({ product: productSchema }) } },
    handle: async ({ params, res, deps, actor }) => {
      res.json({ product: await getProduct(deps, actor, params.id) });
    },
  }),
  defineRoute({
    method: 'put', path: '/products/:id', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'Change a product (Owner, Admin, Stores)', request: { params: idParamSchema, body: productInputSchema },
    responses: { 200: { description: 'Changed', schema: z.object({ product: productSchema }) } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json({ product: await updateProduct(deps, actor, params.id, body) });
    },
  }),
  defineRoute({
    method: 'post', path: '/products/:id/safety-data-sheet', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'Upload the product\u2019s safety data sheet (multipart field "file", a PDF up to 10 MB)',
    request: { params: idParamSchema },
    multipart: { fileField: 'file', fields: z.strictObject({}) },
    before: () => [receiveSds],
    responses: { 200: { description: 'Stored', schema: z.object({ product: productSchema }) } },
    handle: async ({ params, req, res, deps, actor }) => {
      if (!req.file) throw new HttpError(422, 'Attach the PDF in the field "file".', 'ValidationFailed', [{ path: 'file', message: 'Required' }]);
      res.json({ product: await saveSafetyDataSheet(deps, actor, params.id, req.file.buffer) });
    },
  }),
  defineRoute({
    method: 'get', path: '/products/:id/safety-data-sheet', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'The safety data sheet, as a download', request: { params: idParamSchema },
    responses: { 200: { description: 'PDF' } },
    handle: async ({ params, res, deps, actor }) => {
      const { name, body } = await openSafetyDataSheet(deps, actor, params.id);
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader('Content-Disposition', `attachment; filename="${name.replace(/[^A-Za-z0-9 ._-]/g, '')} safety data sheet.pdf"`);
      res.setHeader('X-Content-Type-Options', 'nosniff');
      body.pipe(res);
    },
  }),
  defineRoute({
    method: 'get', path: '/stock', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'Usable packs of every product at every place, against par', request: {},
    responses: { 200: { description: 'Grid' } },
    handle: async ({ res, deps, actor }) => {
      res.json(await stockGrid(deps, actor));
    },
  }),
  defineRoute({
    method: 'get', path: '/stock/batches', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'Stock by batch (lot and expiry), for a place and/or product',
    request: { query: z.strictObject({ locationId: z.coerce.number().int().positive().optional(), productId: z.coerce.number().int().positive().optional() }) },
    responses: { 200: { description: 'Batches' } },
    handle: async ({ query, res, deps, actor }) => {
      res.json({ batches: await batchesAt(deps, actor, query) });
    },
  }),
  defineRoute({
    method: 'get', path: '/stock/movements', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'The ledger, newest first, a page at a time (keyset: pass nextCursor as before)', request: { query: ledgerQuerySchema },
    responses: { 200: { description: 'Page', schema: z.object({ movements: z.array(movementSchema), nextCursor: z.number().nullable() }) } },
    handle: async ({ query, res, deps, actor }) => {
      res.json(await ledgerPage(deps, actor, query));
    },
  }),
  defineRoute({
    method: 'get', path: '/stock/movements.csv', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'The ledger (same filters) as CSV, up to 100000 rows', request: { query: ledgerExportQuery },
    responses: { 200: { description: 'CSV' } },
    handle: async ({ query, res, deps, actor }) => {
      sendCsv(res, 'stock-ledger.csv', movementsCsv(await ledgerForExport(deps, actor, query)));
    },
  }),
  movementRoute('/stock/receipts', receiptInputSchema, 'Receive a delivery at a depot (lines with lot and expiry).', receiveDelivery),
  movementRoute('/stock/transfers', transferInputSchema, 'Move stock between places (depot to van, van to van, van to depot).', transferStock),
  movementRoute('/stock/usages', usageInputSchema, 'Record stock used by hand, with a reason.', useStock),
  movementRoute('/stock/stocktakes', stocktakeInputSchema, 'Record a stocktake: each difference becomes an adjustment.', recordStocktake),
  movementRoute('/stock/write-offs', writeOffInputSchema, 'Write off expired, damaged or spilled stock.', writeOff),
  movementRoute('/stock/movements/:id/reverse', reversalInputSchema, 'Reverse a movement (a transfer as a whole) by one pointing at it.', (trx, deps, actor, input, params) => reverseMovement(trx, deps, actor, params.id!, input.reason), idParamSchema),
  defineRoute({
    method: 'get', path: '/par-levels', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'Minimum and target per place and product', request: {},
    responses: { 200: { description: 'Par levels' } },
    handle: async ({ res, deps, actor }) => {
      ForbiddenError.from(actor.ability).throwUnlessCan('read', 'ParLevel');
      const rows = (await deps.db('par_levels').where({ firm_id: actor.firmId }).select('location_id', 'product_id', 'minimum', 'target')) as { location_id: number; product_id: number; minimum: number; target: number }[];
      res.json({ parLevels: rows.map((r) => ({ locationId: r.location_id, productId: r.product_id, minimum: r.minimum, target: r.target })) });
    },
  }),
  defineRoute({
    method: 'put', path: '/par-levels', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'Set the minimum and target of a product at a place (Owner, Admin, Stores)', request: { body: parLevelInputSchema },
    responses: { 200: { description: 'Set' } },
    handle: async ({ body, res, deps, actor }) => {
      ForbiddenError.from(actor.ability).throwUnlessCan('update', 'ParLevel');
      const [loc, product] = await Promise.all([
        deps.db('locations').where({ firm_id: actor.firmId, id: body.locationId }).first('id'),
        deps.db('products').where({ firm_id: actor.firmId, id: body.productId }).first('id'),
      ]);
      if (!loc) throw notFound('That place');
      if (!product) throw notFound('That product');
      await deps.db.raw('INSERT INTO par_levels (firm_id, location_id, product_id, minimum, target) VALUES (?, ?, ?, ?, ?) ON DUPLICATE KEY UPDATE minimum = VALUES(minimum), target = VALUES(target)', [
        actor.firmId, body.locationId, body.productId, body.minimum, body.target,
      ]);
      res.json({ parLevel: body });
    },
  }),
  defineRoute({
    method: 'get', path: '/stock/restock-run', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'What each van needs to reach target, allocated from the depot first expiry first, and the reorder list it leaves',
    request: { query: depotQuery },
    responses: { 200: { description: 'Plan' } },
    handle: async ({ query, res, deps, actor }) => {
      res.json(await getRestockRun(deps, actor, query.depotId));
    },
  }),
  defineRoute({
    method: 'post', path: '/stock/restock-run', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'Apply a reviewed restock run: all its transfers, or none',
    request: { query: depotQuery, body: restockApplyInputSchema },
    responses: { 201: { description: 'Applied' }, 409: { description: 'Stock changed since; nothing was moved' } },
    handle: async ({ query, body, req, res, deps, actor }) => {
      const key = idempotencyKeyOf(req);
      const out = await withTransactionRetry(() =>
        runIdempotent(deps, actor, key, 'restock-run', async (trx) => ({ status: 201, body: { groupId: await applyRestockRun(trx, deps, actor, body, query.depotId) } })),
      );
      res.status(out.status).json(out.body);
    },
  }),
  defineRoute({
    method: 'get', path: '/stock/reorder-list.csv', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'The reorder list as CSV', request: { query: depotQuery },
    responses: { 200: { description: 'CSV' } },
    handle: async ({ query, res, deps, actor }) => {
      const { reorder } = await getRestockRun(deps, actor, query.depotId);
      const csv = stringify(
        reorder.map((r) => [r.product.name, r.usableAfterTransfers, r.par.minimum, r.par.target, r.orderQuantity, r.used90Days, r.daysOfCover ?? '']),
        { header: true, columns: ['product', 'usable after restock', 'minimum', 'target', 'order packs', 'used in 90 days', 'days of cover'], escape_formulas: true },
      );
      sendCsv(res, 'reorder-list.csv', csv);
    },
  }),
  defineRoute({
    method: 'get', path: '/me/van/stock', tag: 'Stock', access: 'member', tenantData: true,
    summary: 'The signed-in engineer\u2019s van stock, with what is low', request: {},
    responses: { 200: { description: 'Van stock' } },
    handle: async ({ res, deps, actor }) => {
      const van = await findVanOfMember(deps.db, actor.firmId, actor.memberId);
      if (!van) {
        res.json({ van: null, stock: [], batches: [] });
        return;
      }
      const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
      const [levels, batches, products] = await Promise.all([
        stockLevels(deps.db, actor.firmId, today, { locationId: van.id }),
        batchesAt(deps, actor, { locationId: van.id }),
        deps.db('products').where({ firm_id: actor.firmId }).select('id', 'name') as Promise<{ id: number; name: string }[]>,
      ]);
      const names = new Map(products.map((p) => [p.id, p.name]));
      res.json({ van: { id: van.id, name: van.name, registration: van.registration }, stock: levels.map((l) => ({ ...l, productName: names.get(l.productId) ?? '' })), batches });
    },
  }),
];
