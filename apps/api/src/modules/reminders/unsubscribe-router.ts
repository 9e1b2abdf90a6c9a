import {
  marketingSuppressionInputSchema,
  marketingSuppressionListResponseSchema,
  marketingSuppressionResponseSchema,
  unsubscribePreviewResponseSchema,
  unsubscribeTokenParamSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import {
  addMarketingSuppression,
  listMarketingSuppressions,
  previewUnsubscribe,
  unsubscribe,
} from './unsubscribe-service.ts';

export const unsubscribeRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/unsubscribe/:token',
    tag: 'Reminders',
    access: 'public',
    tenantData: false,
    summary: 'What an unsubscribe link stops: the firm, the address (partly hidden), and whether it is done',
    request: { params: unsubscribeTokenParamSchema },
    responses: {
      200: { description: 'The link', schema: unsubscribePreviewResponseSchema },
      404: { description: 'Invalid link' },
    },
    before: (deps) => [deps.limiters.linkByAddress, deps.limiters.linkByToken],
    handle: async ({ params, res, deps }) => {
      res.json({ unsubscribe: await previewUnsubscribe(deps, params.token) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/unsubscribe/:token',
    tag: 'Reminders',
    access: 'public',
    tenantData: false,
    summary: 'Stop the firm\u2019s marketing e-mails to this address (no sign-in; PECR 2003 regulation 22)',
    request: { params: unsubscribeTokenParamSchema },
    responses: {
      200: { description: 'Unsubscribed', schema: unsubscribePreviewResponseSchema },
      404: { description: 'Invalid link' },
    },
    before: (deps) => [deps.limiters.linkByAddress, deps.limiters.linkByToken],
    handle: async ({ params, res, deps }) => {
      res.json({ unsubscribe: await unsubscribe(deps, params.token) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/marketing-suppressions',
    tag: 'Reminders',
    access: 'member',
    tenantData: true,
    summary: 'The firm\u2019s suppression list: addresses never sent marketing again (Owner, Admin)',
    request: {},
    responses: { 200: { description: 'Suppression list', schema: marketingSuppressionListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ suppressions: await listMarketingSuppressions(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/marketing-suppressions',
    tag: 'Reminders',
    access: 'member',
    tenantData: true,
    summary: 'Add an address to the suppression list, for a customer who asked by phone or letter (Owner, Admin)',
    request: { body: marketingSuppressionInputSchema },
    responses: {
      200: { description: 'On the list (added now or already there)', schema: marketingSuppressionResponseSchema },
    },
    handle: async ({ body, res, deps, actor }) => {
      res.json({ suppression: await addMarketingSuppression(deps, actor, body) });
    },
  }),
];
