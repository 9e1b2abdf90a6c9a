import { z } from 'zod';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';

export const healthRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get', path: '/health', tag: 'Meta', access: 'public', tenantData: false,
    summary: 'Liveness and database reachability',
    request: {},
    responses: { 200: { description: 'Up', schema: z.object({ status: z.literal('ok') }) }, 503: { description: 'Database unreachable' } },
    handle: async ({ res, deps }) => {
      await deps.db.raw('select 1');
      res.json({ status: 'ok' });
    },
  }),
];
