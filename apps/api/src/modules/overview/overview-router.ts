import { overviewResponseSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { getOverview } from './overview-service.ts';

export const overviewRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/overview',
    heavy: true,
    tag: 'Overview',
    access: 'member',
    tenantData: true,
    summary:
      'The firm at a glance: stock health and MOT or service per van, kit due, batches expiring, jobs this month, chemical used per month, latest reminders, vibration points today',
    request: {},
    responses: { 200: { description: 'Overview', schema: overviewResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ overview: await getOverview(deps, actor) });
    },
  }),
];
