import {
  createKitItemInputSchema,
  idParamSchema,
  inspectionRecordedResponseSchema,
  itemCustodyResponseSchema,
  kitItemDetailResponseSchema,
  kitItemListQuerySchema,
  kitItemPageResponseSchema,
  kitItemResponseSchema,
  kitLabelListResponseSchema,
  labelsQuerySchema,
  recordInspectionInputSchema,
  updateKitItemInputSchema,
} from '@heatfleet/domain';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { custodyRoute } from './custody-route.ts';
import { moveItem } from './custody-service.ts';
import { recordInspection } from './inspection-service.ts';
import { createItem, getItemDetail, listItems, updateItem } from './kit-item-service.ts';
import { buildLabels } from './label-service.ts';

export const kitItemRoutes: RouteDefinition[] = [
  // Before /kit-items/:id, so "labels" is not read as an id.
  defineRoute({
    method: 'get',
    path: '/kit-items/labels',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Label data with QR codes for an A4 sheet (ids=1,2,3 or kitId=N)',
    request: { query: labelsQuerySchema },
    responses: { 200: { description: 'Labels', schema: kitLabelListResponseSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json({ labels: await buildLabels(deps, actor, query) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/kit-items',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Kit items, filtered by kind, location, kit and inspection state, a page at a time',
    request: { query: kitItemListQuerySchema },
    responses: { 200: { description: 'Items', schema: kitItemPageResponseSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json(await listItems(deps, actor, query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/kit-items',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Add an item (Owner, Admin, Stores); it starts at the given place or the first depot',
    request: { body: createKitItemInputSchema },
    responses: {
      201: { description: 'Added', schema: kitItemResponseSchema },
      409: { description: 'Asset tag taken' },
    },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ item: await createItem(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/kit-items/:id',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'An item: due state, custody timeline, inspections and photos',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Item', schema: kitItemDetailResponseSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getItemDetail(deps, actor, params.id));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/kit-items/:id',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Change an item\u2019s kind, kit, serial number, notes or condition (Owner, Admin, Stores)',
    request: { params: idParamSchema, body: updateKitItemInputSchema },
    responses: { 200: { description: 'Changed', schema: kitItemResponseSchema } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json({ item: await updateItem(deps, actor, params.id, body) });
    },
  }),
  ...(
    [
      ['check_out', '/kit-items/:id/check-out', 'Check one item out to a van.'],
      ['check_in', '/kit-items/:id/check-in', 'Check one item in to a depot with its condition.'],
      ['move', '/kit-items/:id/move', 'Move one item from one van to another.'],
    ] as const
  ).map(([action, path, summary]) =>
    custodyRoute({ action, path, summary, what: 'item', response: itemCustodyResponseSchema, run: moveItem }),
  ),
  defineRoute({
    method: 'post',
    path: '/kit-items/:id/inspections',
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: 'Record an inspection; a failed one sets the item to needs attention',
    request: { params: idParamSchema, body: recordInspectionInputSchema },
    responses: { 201: { description: 'Recorded', schema: inspectionRecordedResponseSchema } },
    handle: async ({ params, body, req, res, deps, actor }) => {
      const out = await recordInspection(deps, actor, params.id, body, idempotencyKeyOf(req));
      res.status(out.status).json(out.body);
    },
  }),
];
