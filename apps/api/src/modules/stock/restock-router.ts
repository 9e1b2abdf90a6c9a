import { z } from 'zod';
import {
  bookedJobsShortQuerySchema,
  bookedJobsShortSchema,
  restockAppliedSchema,
  restockApplyInputSchema,
  restockRunSchema,
} from '@heatfleet/domain';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { bookedJobsShort } from './booked-jobs-short-service.ts';
import { sendCsv } from './stock-csv.ts';
import { applyRestockRunOnce, exportReorderCsv, getRestockRun } from './restock-service.ts';

const depotQuery = z.strictObject({ depotId: z.coerce.number().int().positive().optional() });

export const restockRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/stock/restock-run',
    heavy: true,
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary:
      'What each van needs to reach its need (par target, or its booked jobs of the next days plus its minimum), allocated from the depot first expiry first, and the reorder list it leaves',
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
    summary:
      'Apply a reviewed restock run: all its transfers, or none. A line without a batch is taken first expiry first. Send an Idempotency-Key: a retry moves nothing twice.',
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
    heavy: true,
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
  defineRoute({
    method: 'get',
    path: '/stock/booked-jobs-short',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary:
      'Booked jobs of the restock window whose van does not hold their packs (jobs take from the van in date order)',
    request: { query: bookedJobsShortQuerySchema },
    responses: { 200: { description: 'Jobs', schema: bookedJobsShortSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json(await bookedJobsShort(deps, actor, query));
    },
  }),
];
