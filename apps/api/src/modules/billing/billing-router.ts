import { billingResponseSchema, billingStatusSchema, onboardingLinkSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { getBilling, getBillingStatus, payOpenInvoice, startCardSetup } from './billing-service.ts';

const tag = 'Billing';

export const billingRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/billing',
    tag,
    access: 'member',
    tenantData: true,
    summary: 'The firm\u2019s Heatfleet subscription: plan (active vans), card and invoices (Owner, Admin)',
    request: {},
    responses: { 200: { description: 'Billing', schema: billingResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json(await getBilling(deps, actor));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/billing/status',
    tag,
    access: 'member',
    tenantData: true,
    summary: 'Whether the firm is read-only for an unpaid subscription, and from when (every member)',
    request: {},
    responses: { 200: { description: 'Status', schema: billingStatusSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json(await getBillingStatus(deps, actor));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/billing/card',
    tag,
    access: 'member',
    tenantData: true,
    summary: 'A link to the payment service\u2019s page to save the subscription\u2019s card (Owner, Admin)',
    request: {},
    responses: { 200: { description: 'Where to send the Owner', schema: onboardingLinkSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json(await startCardSetup(deps, actor));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/billing/pay',
    tag,
    access: 'member',
    tenantData: true,
    summary: 'Pay the unpaid subscription invoice with the saved card (Owner, Admin); lifts read-only at once',
    request: {},
    responses: { 200: { description: 'Billing after paying', schema: billingResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json(await payOpenInvoice(deps, actor));
    },
  }),
];
