import { z } from 'zod';
import {
  batchStockResponseSchema,
  myVanStockSchema,
  parLevelInputSchema,
  parLevelListResponseSchema,
  parLevelResponseSchema,
  stockGridQuerySchema,
  stockGridSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { listParLevels, setParLevel } from './par-level-service.ts';
import { batchesAt, myVanStock, stockGrid } from './stock-query-service.ts';

// Products are in product-router.ts, the ledger and its movements in stock-movement-router.ts, the restock run in restock-router.ts.
export const stockRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/stock',
    heavy: true,
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'Usable packs of every product at a page of places (depots first, then by name), against par',
    request: { query: stockGridQuerySchema },
    responses: { 200: { description: 'A page of the grid, with totals over every place', schema: stockGridSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json(await stockGrid(deps, actor, query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/stock/batches',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'Stock by batch (lot and expiry), for a place and/or product',
    request: {
      query: z.strictObject({
        locationId: z.coerce.number().int().positive().optional(),
        productId: z.coerce.number().int().positive().optional(),
      }),
    },
    responses: { 200: { description: 'Batches', schema: batchStockResponseSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json({ batches: await batchesAt(deps, actor, query) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/par-levels',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'Minimum and target per place and product',
    request: {},
    responses: { 200: { description: 'Par levels', schema: parLevelListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ parLevels: await listParLevels(deps, actor) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/par-levels',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'Set the minimum and target of a product at a place (Owner, Admin, Stores)',
    request: { body: parLevelInputSchema },
    responses: { 200: { description: 'Set', schema: parLevelResponseSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.json({ parLevel: await setParLevel(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/me/van/stock',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'The signed-in engineer\u2019s van stock, with what is low',
    request: {},
    responses: { 200: { description: 'Van stock', schema: myVanStockSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json(await myVanStock(deps, actor));
    },
  }),
];
