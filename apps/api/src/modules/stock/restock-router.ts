import { z } from 'zod';
import { restockAppliedSchema, restockApplyInputSchema, restockRunSchema } from '@heatfleet/domain';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { sendCsv } from './stock-csv.ts';
import { applyRestockRunOnce, exportReorderCsv, getRestockRun } from './restock-service.ts';

const depotQuery = z.strictObject({ depotId: z.coerce.number().int().positive().optional() });

export const restockRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/stock/restock-run',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary:
      'What each van needs to reach target, allocated from the depot first expiry first, and the reorder list it leaves',
    request: { query: depotQuery },
    responses: { 200: { description: 'Plan', schema: restockRunSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json(await getRestockRun(deps, actor, query.depotId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/stock/restock-run',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'Apply a reviewed restock run: all its transfers, or none',
    request: { query: depotQuery, body: restockApplyInputSchema },
    responses: {
      201: { description: 'Applied', schema: restockAppliedSchema },
      409: { description: 'Stock changed since; nothing was moved' },
    },
    handle: async ({ query, body, req, res, deps, actor }) => {
      const { status, applied } = await applyRestockRunOnce(deps, actor, idempotencyKeyOf(req), body, query.depotId);
      res.status(status).json(applied);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/stock/reorder-list.csv',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'The reorder list as CSV',
    request: { query: depotQuery },
    responses: { 200: { description: 'CSV' } },
    handle: async ({ query, res, deps, actor }) => {
      sendCsv(res, 'reorder-list.csv', await exportReorderCsv(deps, actor, query.depotId));
    },
  }),
];
