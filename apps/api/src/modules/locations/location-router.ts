import { z } from 'zod';
import { createDepotInputSchema, createVanInputSchema, depotSchema, idParamSchema, kitItemSchema, kitSchema, updateVanInputSchema, vanSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { listKits, loadItems } from '../kits/kit-service.ts';
import { createDepot, createVan, getMyVan, getVan, listDepots, listVans, updateVan } from './location-service.ts';
import type { Actor, AppDeps } from '../../app-deps.ts';

const vanDetail = z.object({ van: vanSchema.nullable(), kits: z.array(kitSchema), items: z.array(kitItemSchema) });

async function contentsOf(deps: AppDeps, actor: Actor, vanId: number) {
  const [kits, items] = await Promise.all([listKits(deps, actor), loadItems(deps.db, actor.firmId, deps.clock.now(), { locationId: vanId })]);
  return { kits: kits.filter((k) => k.location?.id === vanId), items };
}

export const locationRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get', path: '/vans', tag: 'Vans', access: 'member', tenantData: true,
    summary: 'The firm\u2019s vans with engineer, kits on board and next MOT or service',
    request: {},
    responses: { 200: { description: 'Vans', schema: z.object({ vans: z.array(vanSchema) }) } },
    handle: async ({ res, deps, actor }) => {
      res.json({ vans: await listVans(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post', path: '/vans', tag: 'Vans', access: 'member', tenantData: true,
    summary: 'Add a van (Owner, Admin, Stores)',
    request: { body: createVanInputSchema },
    responses: { 201: { description: 'Added', schema: z.object({ van: vanSchema }) }, 409: { description: 'Registration or name taken' } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ van: await createVan(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get', path: '/vans/:id', tag: 'Vans', access: 'member', tenantData: true,
    summary: 'A van with its kits and items and what is due',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Van', schema: vanDetail } },
    handle: async ({ params, res, deps, actor }) => {
      const van = await getVan(deps, actor, params.id);
      res.json({ van, ...(await contentsOf(deps, actor, van.id)) });
    },
  }),
  defineRoute({
    method: 'patch', path: '/vans/:id', tag: 'Vans', access: 'member', tenantData: true,
    summary: 'Change a van (Owner, Admin, Stores)',
    request: { params: idParamSchema, body: updateVanInputSchema },
    responses: { 200: { description: 'Changed', schema: z.object({ van: vanSchema }) } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json({ van: await updateVan(deps, actor, params.id, body) });
    },
  }),
  defineRoute({
    method: 'get', path: '/depots', tag: 'Vans', access: 'member', tenantData: true,
    summary: 'The firm\u2019s depots',
    request: {},
    responses: { 200: { description: 'Depots', schema: z.object({ depots: z.array(depotSchema) }) } },
    handle: async ({ res, deps, actor }) => {
      res.json({ depots: await listDepots(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post', path: '/depots', tag: 'Vans', access: 'member', tenantData: true,
    summary: 'Add a depot (Owner, Admin, Stores)',
    request: { body: createDepotInputSchema },
    responses: { 201: { description: 'Added', schema: z.object({ depot: depotSchema }) } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ depot: await createDepot(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get', path: '/me/van', tag: 'Vans', access: 'member', tenantData: true,
    summary: 'The signed-in engineer\u2019s own van, its kits and items (van is null without one)',
    request: {},
    responses: { 200: { description: 'My van', schema: vanDetail } },
    handle: async ({ res, deps, actor }) => {
      const van = await getMyVan(deps, actor);
      res.json(van ? { van, ...(await contentsOf(deps, actor, van.id)) } : { van: null, kits: [], items: [] });
    },
  }),
];
