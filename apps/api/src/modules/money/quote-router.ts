import {
  idParamSchema,
  jobIdQuerySchema,
  publicQuoteSchema,
  quoteAcceptInputSchema,
  quoteDeclineInputSchema,
  quoteInputSchema,
  quoteLinesInputSchema,
  quoteListSchema,
  quotePhoneAcceptInputSchema,
  quoteSchema,
  tokenParamSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { acceptQuoteByLink, declineQuoteByLink, quotePdfByLink, viewQuoteByLink } from './quote-public-service.ts';
import {
  acceptQuoteOnPhone,
  changeQuote,
  createQuote,
  getQuote,
  listQuotesFor,
  quotePdfFor,
  sendQuote,
} from './quote-service.ts';

const member = { tag: 'Money', access: 'member' as const, tenantData: true };
const pub = { tag: 'Money', access: 'public' as const, tenantData: true };

export const quoteRoutes: RouteDefinition[] = [
  defineRoute({
    ...member,
    method: 'get',
    path: '/quotes',
    summary: 'Quotes, newest first (filter by job)',
    request: { query: jobIdQuerySchema },
    responses: { 200: { description: 'Quotes', schema: quoteListSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json({ quotes: await listQuotesFor(deps, actor, query.jobId) });
    },
  }),
  defineRoute({
    ...member,
    method: 'post',
    path: '/quotes',
    summary: 'A quote for a job (lines from the price list, editable), its own number and a validity date',
    request: { body: quoteInputSchema },
    responses: { 201: { description: 'Made', schema: quoteSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json(await createQuote(deps, actor, body));
    },
  }),
  defineRoute({
    ...member,
    method: 'get',
    path: '/quotes/:id',
    summary: 'A quote with its lines, totals and answer',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Quote', schema: quoteSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getQuote(deps, actor, params.id));
    },
  }),
  defineRoute({
    ...member,
    method: 'put',
    path: '/quotes/:id',
    summary: 'Change a quote not yet answered (409 once accepted or declined)',
    request: { params: idParamSchema, body: quoteLinesInputSchema },
    responses: { 200: { description: 'Changed', schema: quoteSchema } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json(await changeQuote(deps, actor, params.id, body));
    },
  }),
  defineRoute({
    ...member,
    method: 'post',
    path: '/quotes/:id/send',
    summary: 'E-mail the quote (PDF with the cancellation information and form) and a link to accept or decline it',
    request: { params: idParamSchema },
    responses: {
      200: { description: 'Sent', schema: quoteSchema },
      409: { description: 'Answered, expired or no e-mail' },
    },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await sendQuote(deps, actor, params.id));
    },
  }),
  defineRoute({
    ...member,
    method: 'post',
    path: '/quotes/:id/accept',
    summary:
      "The customer's acceptance taken on the phone: name, tick, express request for work within the cancellation period, drawn signature",
    request: { params: idParamSchema, body: quotePhoneAcceptInputSchema },
    responses: { 200: { description: 'Accepted', schema: quoteSchema }, 409: { description: 'Answered or expired' } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json(await acceptQuoteOnPhone(deps, actor, params.id, body));
    },
  }),
  defineRoute({
    ...member,
    method: 'get',
    path: '/quotes/:id/quote.pdf',
    summary: 'The quote as a PDF with the cancellation information and the model cancellation form',
    request: { params: idParamSchema },
    responses: { 200: { description: 'PDF' } },
    handle: async ({ params, res, deps, actor }) => {
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader('Content-Disposition', `attachment; filename="quote-${params.id}.pdf"`);
      res.send(await quotePdfFor(deps, actor, params.id));
    },
  }),
  defineRoute({
    ...pub,
    method: 'get',
    path: '/public/quotes/:token',
    summary: "The customer's view of a quote by its link (no sign-in; 404 once the link has expired)",
    request: { params: tokenParamSchema },
    responses: {
      200: { description: 'Quote', schema: publicQuoteSchema },
      404: { description: 'Unknown or expired link' },
    },
    handle: async ({ params, res, deps }) => {
      res.setHeader('Cache-Control', 'no-store');
      res.json(await viewQuoteByLink(deps, params.token));
    },
  }),
  defineRoute({
    ...pub,
    method: 'get',
    path: '/public/quotes/:token/quote.pdf',
    summary: 'The quote as a PDF by its link',
    request: { params: tokenParamSchema },
    responses: { 200: { description: 'PDF' }, 404: { description: 'Unknown or expired link' } },
    handle: async ({ params, res, deps }) => {
      const { pdf, name } = await quotePdfByLink(deps, params.token);
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
      res.send(pdf);
    },
  }),
  defineRoute({
    ...pub,
    method: 'post',
    path: '/public/quotes/:token/accept',
    summary:
      'The customer accepts by the link: their name, a tick, and whether they ask for the work within the cancellation period',
    request: { params: tokenParamSchema, body: quoteAcceptInputSchema },
    responses: {
      200: { description: 'Accepted', schema: publicQuoteSchema },
      409: { description: 'Answered or expired' },
    },
    handle: async ({ params, body, res, deps }) => {
      res.json(await acceptQuoteByLink(deps, params.token, body));
    },
  }),
  defineRoute({
    ...pub,
    method: 'post',
    path: '/public/quotes/:token/decline',
    summary: 'The customer declines by the link (a reason is optional)',
    request: { params: tokenParamSchema, body: quoteDeclineInputSchema },
    responses: {
      200: { description: 'Declined', schema: publicQuoteSchema },
      409: { description: 'Answered or expired' },
    },
    handle: async ({ params, body, res, deps }) => {
      res.json(await declineQuoteByLink(deps, params.token, body.reason ?? null));
    },
  }),
];
