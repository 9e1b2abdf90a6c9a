import {
  createKitInputSchema,
  idParamSchema,
  kitDetailResponseSchema,
  kitListResponseSchema,
  kitResponseSchema,
  updateKitInputSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { custodyRoute } from './custody-route.ts';
import { moveKit } from './custody-service.ts';
import { createKit, getKitDetail, listKits, updateKit } from './kit-service.ts';

export const kitRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/kits',
    heavy: true,
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Kits with where they are and their worst inspection state',
    request: {},
    responses: { 200: { description: 'Kits', schema: kitListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ kits: await listKits(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/kits',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Add a kit (Owner, Admin, Stores)',
    request: { body: createKitInputSchema },
    responses: { 201: { description: 'Added', schema: kitResponseSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ kit: await createKit(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/kits/:id',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'A kit: items, custody timeline (newest first), inspections',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Kit', schema: kitDetailResponseSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getKitDetail(deps, actor, params.id));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/kits/:id',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Rename a kit or change its notes (Owner, Admin, Stores)',
    request: { params: idParamSchema, body: updateKitInputSchema },
    responses: { 200: { description: 'Changed', schema: kitResponseSchema } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json({ kit: await updateKit(deps, actor, params.id, body) });
    },
  }),
  ...(
    [
      ['check_out', '/kits/:id/check-out', 'Check a kit out to a van: all its items go.'],
      ['check_in', '/kits/:id/check-in', 'Check a kit in to a depot with its condition.'],
      ['move', '/kits/:id/move', 'Move a kit from one van to another.'],
    ] as const
  ).map(([action, path, summary]) =>
    custodyRoute({ action, path, summary, what: 'kit', response: kitDetailResponseSchema, run: moveKit }),
  ),
];
