import {
  createDepotInputSchema,
  createVanInputSchema,
  depotListResponseSchema,
  depotResponseSchema,
  idParamSchema,
  myVanResponseSchema,
  updateVanInputSchema,
  vanDetailResponseSchema,
  vanListResponseSchema,
  vanResponseSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import {
  createDepot,
  createVan,
  getMyVanDetail,
  getVanDetail,
  listDepots,
  listVans,
  updateVan,
} from './location-service.ts';

export const locationRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/vans',
    tag: 'Vans',
    access: 'member',
    tenantData: true,
    summary: 'The firm\u2019s vans with engineer, kits on board and next MOT or service',
    request: {},
    responses: { 200: { description: 'Vans', schema: vanListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ vans: await listVans(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/vans',
    tag: 'Vans',
    access: 'member',
    tenantData: true,
    summary: 'Add a van (Owner, Admin, Stores)',
    request: { body: createVanInputSchema },
    responses: {
      201: { description: 'Added', schema: vanResponseSchema },
      409: { description: 'Registration or name taken' },
    },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ van: await createVan(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/vans/:id',
    tag: 'Vans',
    access: 'member',
    tenantData: true,
    summary: 'A van with its kits and items and what is due',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Van', schema: vanDetailResponseSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getVanDetail(deps, actor, params.id));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/vans/:id',
    tag: 'Vans',
    access: 'member',
    tenantData: true,
    summary: 'Change a van (Owner, Admin, Stores)',
    request: { params: idParamSchema, body: updateVanInputSchema },
    responses: { 200: { description: 'Changed', schema: vanResponseSchema } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json({ van: await updateVan(deps, actor, params.id, body) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/depots',
    tag: 'Vans',
    access: 'member',
    tenantData: true,
    summary: 'The firm\u2019s depots',
    request: {},
    responses: { 200: { description: 'Depots', schema: depotListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ depots: await listDepots(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/depots',
    tag: 'Vans',
    access: 'member',
    tenantData: true,
    summary: 'Add a depot (Owner, Admin, Stores)',
    request: { body: createDepotInputSchema },
    responses: { 201: { description: 'Added', schema: depotResponseSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ depot: await createDepot(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/me/van',
    tag: 'Vans',
    access: 'member',
    tenantData: true,
    summary: 'The signed-in engineer\u2019s own van, its kits and items (van is null without one)',
    request: {},
    responses: { 200: { description: 'My van', schema: myVanResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json(await getMyVanDetail(deps, actor));
    },
  }),
];
