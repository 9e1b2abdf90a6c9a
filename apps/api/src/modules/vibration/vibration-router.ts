import { havRegisterQuerySchema, havRegisterResponseSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { getHavRegister } from './vibration-service.ts';

export const vibrationRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/vibration/register',
    tag: 'Overview',
    access: 'member',
    tenantData: true,
    summary:
      'The hand-arm vibration register (Owner, Admin): each engineer\u2019s points per day over whole weeks (HSE points system: 100 is the exposure action value, 400 the limit value), days over each, and who needs health surveillance (Control of Vibration at Work Regulations 2005, regulation 7)',
    request: { query: havRegisterQuerySchema },
    responses: { 200: { description: 'Register', schema: havRegisterResponseSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json(await getHavRegister(deps, actor, query));
    },
  }),
];
