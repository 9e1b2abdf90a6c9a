import { healthResponseSchema } from '@heatfleet/domain';
import { redisAnswers } from '../../lib/redis-connection.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { pingDatabase } from './health-dal.ts';

export const healthRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/health',
    tag: 'Meta',
    access: 'public',
    tenantData: false,
    summary: 'Whether this replica reaches the database (else 503) and Redis',
    request: {},
    responses: {
      200: { description: 'Up: the database answers; Redis reachable or not', schema: healthResponseSchema },
      503: { description: 'Database unreachable' },
    },
    handle: async ({ res, deps }) => {
      const [redis] = await Promise.all([redisAnswers(deps.redis), pingDatabase(deps.db)]);
      res.json({ status: 'ok', database: 'reachable', redis: redis ? 'reachable' : 'unreachable' });
    },
  }),
];
