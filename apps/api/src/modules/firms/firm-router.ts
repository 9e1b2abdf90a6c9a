import { firmSettingsInputSchema, firmSettingsResponseSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { getFirmSettings, saveFirmSettings } from './firm-service.ts';

export const firmRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/firm',
    tag: 'Firm',
    access: 'member',
    tenantData: true,
    summary: 'The active firm\u2019s settings: name, address, time zone, volume unit, cold-bottom threshold',
    request: {},
    responses: { 200: { description: 'Settings', schema: firmSettingsResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ firm: await getFirmSettings(deps, actor) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/firm',
    tag: 'Firm',
    access: 'member',
    tenantData: true,
    summary: 'Change the firm\u2019s settings (Owner, Admin)',
    request: { body: firmSettingsInputSchema },
    responses: { 200: { description: 'Saved', schema: firmSettingsResponseSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.json({ firm: await saveFirmSettings(deps, actor, body) });
    },
  }),
];
