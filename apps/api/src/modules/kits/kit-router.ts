import { z } from 'zod';
import {
  checkInInputSchema,
  checkOutInputSchema,
  createKitInputSchema,
  custodyEventSchema,
  idParamSchema,
  inspectionSchema,
  kitItemSchema,
  kitSchema,
  moveInputSchema,
  updateKitInputSchema,
} from '@heatfleet/domain';
import { idempotencyKeyOf, runIdempotent } from '../../lib/idempotency.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { recordCustody } from './custody-service.ts';
import { createKit, getKitDetail, listKits, updateKit } from './kit-service.ts';

const kitDetail = z.object({ kit: kitSchema, items: z.array(kitItemSchema), events: z.array(custodyEventSchema), inspections: z.array(inspectionSchema) });
const custodyResponses = {
  200: { description: 'Done; the kit as it now stands', schema: kitDetail },
  409: { description: 'Already out (names who has it), overdue for inspection, or out of service' },
};

const custodyRoute = (action: 'check_out' | 'check_in' | 'move', path: string, body: typeof checkOutInputSchema | typeof checkInInputSchema | typeof moveInputSchema, summary: string) =>
  defineRoute({
    method: 'post', path, tag: 'Kits', access: 'member', tenantData: true,
    summary: `${summary} Send an Idempotency-Key header: a retry with the same key replays the first answer.`,
    request: { params: idParamSchema, body },
    responses: custodyResponses,
    handle: async ({ params, body: input, req, res, deps, actor }) => {
      const out = await runIdempotent(deps, actor, idempotencyKeyOf(req), `${action} kit ${params.id}`, async (trx) => {
        await recordCustody(trx, deps, actor, { kitId: params.id }, action, input);
        return { status: 200, body: await getKitDetail(deps, actor, params.id, trx) };
      });
      res.status(out.status).json(out.body);
    },
  });

export const kitRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get', path: '/kits', tag: 'Kits', access: 'member', tenantData: true,
    summary: 'Kits with where they are and their worst inspection state',
    request: {},
    responses: { 200: { description: 'Kits', schema: z.object({ kits: z.array(kitSchema) }) } },
    handle: async ({ res, deps, actor }) => {
      res.json({ kits: await listKits(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post', path: '/kits', tag: 'Kits', access: 'member', tenantData: true,
    summary: 'Add a kit (Owner, Admin, Stores)',
    request: { body: createKitInputSchema },
    responses: { 201: { description: 'Added', schema: z.object({ kit: kitSchema }) } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ kit: await createKit(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get', path: '/kits/:id', tag: 'Kits', access: 'member', tenantData: true,
    summary: 'A kit: items, custody timeline (newest first), inspections',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Kit', schema: kitDetail } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getKitDetail(deps, actor, params.id));
    },
  }),
  defineRoute({
    method: 'patch', path: '/kits/:id', tag: 'Kits', access: 'member', tenantData: true,
    summary: 'Rename a kit or change its notes (Owner, Admin, Stores)',
    request: { params: idParamSchema, body: updateKitInputSchema },
    responses: { 200: { description: 'Changed', schema: z.object({ kit: kitSchema }) } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json({ kit: await updateKit(deps, actor, params.id, body) });
    },
  }),
  custodyRoute('check_out', '/kits/:id/check-out', checkOutInputSchema, 'Check a kit out to a van: all its items go.'),
  custodyRoute('check_in', '/kits/:id/check-in', checkInInputSchema, 'Check a kit in to a depot with its condition.'),
  custodyRoute('move', '/kits/:id/move', moveInputSchema, 'Move a kit from one van to another.'),
];
