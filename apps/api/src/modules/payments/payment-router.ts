import { z } from 'zod';
import {
  checkoutRedirectSchema,
  invoicePaymentParamsSchema,
  invoicePaymentsResponseSchema,
  onboardingLinkSchema,
  payLinkResponseSchema,
  payLinkTokenParamsSchema,
  paymentAccountSchema,
  paymentIdParamsSchema,
  paymentSchema,
  publicPayLinkSchema,
  refundInputSchema,
  webhookAnswerSchema,
} from '@heatfleet/domain';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { getInvoicePayments } from './invoice-payments-service.ts';
import { doorstepPayLink, readPayLink, startCheckout } from './pay-link-service.ts';
import { getPaymentAccount, startOnboarding } from './payment-account-service.ts';
import { refundPayment } from './refund-service.ts';
import { receiveWebhook } from './webhook-service.ts';

/** app.ts reads this route's body raw (the signature covers the exact bytes) and skips the CSRF check for it. */
export const PAYMENT_WEBHOOK_PATH = '/payments/webhook';

const tag = 'Payments';

export const paymentRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'post',
    path: PAYMENT_WEBHOOK_PATH,
    tag,
    access: 'public',
    tenantData: false,
    summary:
      'The payment service\u2019s signed events (checkout, payments, refunds, accounts, the firm\u2019s subscription)',
    request: {},
    responses: {
      200: {
        description: 'Received (applied: false for a repeat or an event about nothing here)',
        schema: webhookAnswerSchema,
      },
      400: { description: 'The signature does not match' },
    },
    handle: async ({ req, res, deps }) => {
      res.json(await receiveWebhook(deps, req.body, req.get('stripe-signature')));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/pay/:token',
    tag,
    access: 'public',
    tenantData: false,
    summary: 'What a customer\u2019s pay link is for: the firm, the invoice and what is owed (no sign-in)',
    request: { params: payLinkTokenParamsSchema },
    responses: { 200: { description: 'The invoice to pay', schema: publicPayLinkSchema } },
    handle: async ({ params, res, deps }) => {
      res.json(await readPayLink(deps, params.token));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/pay/:token/checkout',
    tag,
    access: 'public',
    tenantData: false,
    summary: 'Open the payment service\u2019s hosted checkout for what is owed (the page then goes there)',
    request: {
      params: payLinkTokenParamsSchema,
      body: z.strictObject({ from: z.enum(['email_link', 'doorstep']).optional() }),
    },
    responses: {
      201: { description: 'Where to send the customer', schema: checkoutRedirectSchema },
      503: { description: 'The payment service cannot be reached; nothing was written' },
    },
    handle: async ({ params, body, res, deps }) => {
      res.status(201).json(await startCheckout(deps, params.token, body.from ?? 'email_link'));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/payments/account',
    tag,
    access: 'member',
    tenantData: true,
    summary: 'Whether the firm\u2019s own payment account is connected and takes cards (Owner, Admin)',
    request: {},
    responses: { 200: { description: 'The account', schema: paymentAccountSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json(await getPaymentAccount(deps, actor));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/payments/account/onboarding',
    tag,
    access: 'member',
    tenantData: true,
    summary: 'A link to the payment service\u2019s onboarding for the firm\u2019s own account (Owner, Admin)',
    request: {},
    responses: { 200: { description: 'Where to send the Owner', schema: onboardingLinkSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json(await startOnboarding(deps, actor));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/invoices/:id/payments',
    tag,
    access: 'member',
    tenantData: true,
    summary: 'The card payments made against an invoice, with their refunds',
    request: { params: invoicePaymentParamsSchema },
    responses: { 200: { description: 'Payments', schema: invoicePaymentsResponseSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getInvoicePayments(deps, actor, params.id));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/invoices/:id/pay-link',
    tag,
    access: 'member',
    tenantData: true,
    summary: 'A pay link and its QR code for the customer to pay on their own phone (any role)',
    request: { params: invoicePaymentParamsSchema },
    responses: { 201: { description: 'The link and QR code', schema: payLinkResponseSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.status(201).json(await doorstepPayLink(deps, actor, params.id));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/payments/:id/refunds',
    tag,
    access: 'member',
    tenantData: true,
    summary: 'Refund a card payment in full or in part (Owner, Admin); send an Idempotency-Key',
    request: { params: paymentIdParamsSchema, body: refundInputSchema },
    responses: { 201: { description: 'The payment with its refunds', schema: paymentSchema } },
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.status(201).json(await refundPayment(deps, actor, params.id, body, idempotencyKeyOf(req)?.key));
    },
  }),
];
