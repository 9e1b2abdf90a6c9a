import { z } from 'zod';
import {
  createKitItemInputSchema,
  custodyEventSchema,
  idParamSchema,
  inspectionSchema,
  kitItemListQuerySchema,
  kitItemSchema,
  kitLabelSchema,
  labelsQuerySchema,
  photoSchema,
  recordInspectionInputSchema,
  updateKitItemInputSchema,
} from '@heatfleet/domain';
import { idempotencyKeyOf, runIdempotent } from '../../lib/idempotency.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { custodyRoute } from './custody-route.ts';
import { recordInspection } from './inspection-service.ts';
import { createItem, getItem, getItemDetail, listItems, updateItem } from './kit-service.ts';
import { listCustodyEvents, listInspections } from './kit-dal.ts';
import { buildLabels } from './label-service.ts';

const itemAndEvents = z.object({ item: kitItemSchema, events: z.array(custodyEventSchema) });

export const kitItemRoutes: RouteDefinition[] = [
  // Before /kit-items/:id, so "labels" is not read as an id.
  defineRoute({
    method: 'get', path: '/kit-items/labels', tag: 'Kits', access: 'member', tenantData: true,
    summary: 'Label data with QR codes for an A4 sheet (ids=1,2,3 or kitId=N)',
    request: { query: labelsQuerySchema },
    responses: { 200: { description: 'Labels', schema: z.object({ labels: z.array(kitLabelSchema) }) } },
    handle: async ({ query, res, deps, actor }) => {
      res.json({ labels: await buildLabels(deps, actor, query) });
    },
  }),
  defineRoute({
    method: 'get', path: '/kit-items', tag: 'Kits', access: 'member', tenantData: true,
    summary: 'Kit items, filtered by kind, location, kit and inspection state, a page at a time',
    request: { query: kitItemListQuerySchema },
    responses: { 200: { description: 'Items', schema: z.object({ items: z.array(kitItemSchema), total: z.number(), page: z.number(), pageSize: z.number() }) } },
    handle: async ({ query, res, deps, actor }) => {
      res.json(await listItems(deps, actor, query));
    },
  }),
  defineRoute({
    method: 'post', path: '/kit-items', tag: 'Kits', access: 'member', tenantData: true,
    summary: 'Add an item (Owner, Admin, Stores); it starts at the given place or the first depot',
    request: { body: createKitItemInputSchema },
    responses: { 201: { description: 'Added', schema: z.object({ item: kitItemSchema }) }, 409: { description: 'Asset tag taken' } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ item: await createItem(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get', path: '/kit-items/:id', tag: 'Kits', access: 'member', tenantData: true,
    summary: 'An item: due state, custody timeline, inspections and photos',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Item', schema: z.object({ item: kitItemSchema, events: z.array(custodyEventSchema), inspections: z.array(inspectionSchema), photos: z.array(photoSchema) }) } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getItemDetail(deps, actor, params.id));
    },
  }),
  defineRoute({
    method: 'patch', path: '/kit-items/:id', tag: 'Kits', access: 'member', tenantData: true,
    summary: 'Change an item\u2019s kind, kit, serial number, notes or condition (Owner, Admin, Stores)',
    request: { params: idParamSchema, body: updateKitItemInputSchema },
    responses: { 200: { description: 'Changed', schema: z.object({ item: kitItemSchema }) } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json({ item: await updateItem(deps, actor, params.id, body) });
    },
  }),
  ...([
    ['check_out', '/kit-items/:id/check-out', 'Check one item out to a van.'],
    ['check_in', '/kit-items/:id/check-in', 'Check one item in to a depot with its condition.'],
    ['move', '/kit-items/:id/move', 'Move one item from one van to another.'],
  ] as const).map(([action, path, summary]) =>
    custodyRoute({
      action, path, summary, what: 'item', target: (id) => ({ itemId: id }), response: itemAndEvents,
      answer: async (trx, deps, actor, id) => ({ item: await getItem(deps, actor, id, trx), events: await listCustodyEvents(trx, actor.firmId, { itemId: id }) }),
    }),
  ),
  defineRoute({
    method: 'post', path: '/kit-items/:id/inspections', tag: 'Kits', access: 'member', tenantData: true,
    summary: 'Record an inspection; a failed one sets the item to needs attention',
    request: { params: idParamSchema, body: recordInspectionInputSchema },
    responses: { 201: { description: 'Recorded', schema: z.object({ inspection: inspectionSchema, item: kitItemSchema }) } },
    handle: async ({ params, body, req, res, deps, actor }) => {
      const out = await runIdempotent(deps, actor, idempotencyKeyOf(req), `inspect item ${params.id}`, async (trx) => {
        const id = await recordInspection(trx, deps, actor, params.id, body);
        const detail = await getItem(deps, actor, params.id, trx);
        const inspection = (await listInspections(trx, actor.firmId, [params.id])).find((i) => i.id === id)!;
        return { status: 201, body: { inspection, item: detail } };
      });
      res.status(out.status).json(out.body);
    },
  }),
];
