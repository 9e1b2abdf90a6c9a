import { z } from 'zod';
import { outboxListResponseSchema, outboxMessageResponseSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { getOutboxMessage, listOutbox } from './outbox-service.ts';

// The local mail catcher's inbox: development and tests only, never mounted in production.
// It shows every caught e-mail, as a real mailbox server would, so it is not tenant data.
export const outboxRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/outbox',
    tag: 'Outbox',
    access: 'public',
    tenantData: false,
    devOnly: true,
    summary: 'E-mails caught by the local SMTP server (not in production)',
    request: {},
    responses: { 200: { description: 'Messages', schema: outboxListResponseSchema } },
    handle: async ({ res, deps }) => {
      res.json({ messages: await listOutbox(deps.env.OUTBOX_DIR) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/outbox/:id',
    tag: 'Outbox',
    access: 'public',
    tenantData: false,
    devOnly: true,
    summary: 'One caught e-mail with its text and links (not in production)',
    request: { params: z.strictObject({ id: z.string().trim().max(80) }) },
    responses: { 200: { description: 'Message', schema: outboxMessageResponseSchema } },
    handle: async ({ params, res, deps }) => {
      res.json({ message: await getOutboxMessage(deps.env.OUTBOX_DIR, params.id) });
    },
  }),
];
