import { z } from 'zod';
import { firmSettingsInputSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { getFirmSettings, saveFirmSettings } from './firm-service.ts';

const firmBody = z.object({
  firm: z.object({ id: z.number(), name: z.string(), address: z.string().nullable(), timeZone: z.string(), volumeUnit: z.enum(['litres', 'imperial_gallons']), coldBottomThresholdK: z.number() }),
});

export const firmRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get', path: '/firm', tag: 'Firm', access: 'member', tenantData: true,
    summary: 'The active firm\u2019s settings: name, address, time zone, volume unit, cold-bottom threshold',
    request: {},
    responses: { 200: { description: 'Settings', schema: firmBody } },
    handle: async ({ res, deps, actor }) => {
      res.json({ firm: await getFirmSettings(deps, actor) });
    },
  }),
  defineRoute({
    method: 'put', path: '/firm', tag: 'Firm', access: 'member', tenantData: true,
    summary: 'Change the firm\u2019s settings (Owner, Admin)',
    request: { body: firmSettingsInputSchema },
    responses: { 200: { description: 'Saved', schema: firmBody } },
    handle: async ({ body, res, deps, actor }) => {
      res.json({ firm: await saveFirmSettings(deps, actor, body) });
    },
  }),
];
