import { healthResponseSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { pingDatabase } from './health-dal.ts';

export const healthRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/health',
    tag: 'Meta',
    access: 'public',
    tenantData: false,
    summary: 'Liveness and database reachability',
    request: {},
    responses: {
      200: { description: 'Up', schema: healthResponseSchema },
      503: { description: 'Database unreachable' },
    },
    handle: async ({ res, deps }) => {
      await pingDatabase(deps.db);
      res.json({ status: 'ok' });
    },
  }),
];
