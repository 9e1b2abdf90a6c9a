import {
  idParamSchema,
  itemKindInputSchema,
  itemKindListResponseSchema,
  itemKindResponseSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { createItemKind, listItemKinds, updateItemKind } from './item-kind-service.ts';

export const itemKindRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/item-kinds',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Kinds of kit item and their inspection rules',
    request: {},
    responses: { 200: { description: 'Kinds', schema: itemKindListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ itemKinds: await listItemKinds(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/item-kinds',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Add a kind of item with its inspection rule (Owner, Admin, Stores)',
    request: { body: itemKindInputSchema },
    responses: { 201: { description: 'Added', schema: itemKindResponseSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ itemKind: await createItemKind(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/item-kinds/:id',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Change a kind\u2019s name or inspection rule (Owner, Admin, Stores)',
    request: { params: idParamSchema, body: itemKindInputSchema.partial() },
    responses: { 200: { description: 'Changed', schema: itemKindResponseSchema } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json({ itemKind: await updateItemKind(deps, actor, params.id, body) });
    },
  }),
];
