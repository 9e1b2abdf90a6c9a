import {
  idParamSchema,
  inhibitorCheckVisitInputSchema,
  siteCheckResponseSchema,
  siteDetailSchema,
  siteListResponseSchema,
} from '@heatfleet/domain';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { recordSiteCheck } from './site-check-service.ts';
import { getSite, listAllSites } from './site-service.ts';

export const siteRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/sites',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'Every site with its customer and next check date, by customer',
    request: {},
    responses: { 200: { description: 'Sites', schema: siteListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ sites: await listAllSites(deps, actor) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/sites/:id',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'A site with its customer, its jobs newest first, its inhibitor checks and the next check date',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Site', schema: siteDetailSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getSite(deps, actor, params.id));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/sites/:id/checks',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary:
      'Record an inhibitor check visit: pass or fail against the product\u2019s target range, with an optional top-up off the van and a re-test that decides the visit; the next check falls 12 months on after a pass, 1 month on after a fail; the customer is e-mailed a short note. Send an Idempotency-Key header: a retry with the same key replays the first answer.',
    request: { params: idParamSchema, body: inhibitorCheckVisitInputSchema },
    responses: {
      201: { description: 'Recorded', schema: siteCheckResponseSchema },
      403: { description: 'A top-up from a van other than the engineer\u2019s own' },
      409: { description: 'Not enough usable inhibitor on the van for the top-up' },
      422: { description: 'Not an inhibitor with a target range, or bad input' },
    },
    handle: async ({ params, body, req, res, deps, actor }) => {
      const out = await recordSiteCheck(deps, actor, params.id, body, idempotencyKeyOf(req));
      res.status(out.status).json(out.body);
    },
  }),
];
