import {
  creditNoteInputSchema,
  idParamSchema,
  invoiceFromJobInputSchema,
  invoiceLinesInputSchema,
  invoiceListQuerySchema,
  invoiceListSchema,
  invoiceSchema,
  moneySettingsInputSchema,
  moneySettingsSchema,
  priceItemInputSchema,
  priceItemSchema,
  priceListResponseSchema,
  suggestedLinesSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { createCreditNote, creditNotePdfFor } from './credit-note-service.ts';
import {
  createInvoiceForJob,
  getInvoice,
  invoicePdfFor,
  issueInvoice,
  listInvoicesFor,
  putInvoiceLines,
  suggestLinesForJob,
} from './invoice-service.ts';
import { changePriceItem, createPriceItem, getPriceList, putMoneySettings } from './price-list-service.ts';

const base = { tag: 'Money', access: 'member' as const, tenantData: true };

export const invoiceRoutes: RouteDefinition[] = [
  defineRoute({
    ...base,
    method: 'get',
    path: '/money/prices',
    summary: "The firm's price list and money settings (VAT registration, terms, reminder days, the rounding rule)",
    request: {},
    responses: { 200: { description: 'Price list', schema: priceListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json(await getPriceList(deps, actor));
    },
  }),
  defineRoute({
    ...base,
    method: 'put',
    path: '/money/settings',
    summary:
      "Set the firm's VAT registration (number and rate, or not registered), payment terms, quote validity and overdue reminder days (Owner, Admin)",
    request: { body: moneySettingsInputSchema },
    responses: { 200: { description: 'Saved', schema: moneySettingsSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.json(await putMoneySettings(deps, actor, body));
    },
  }),
  defineRoute({
    ...base,
    method: 'post',
    path: '/money/price-items',
    summary:
      'Add a price: a visit (base + per radiator, or radiator bands), a chemical (a product at a sell price) or an extra (Owner, Admin)',
    request: { body: priceItemInputSchema },
    responses: { 201: { description: 'Added', schema: priceItemSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json(await createPriceItem(deps, actor, body));
    },
  }),
  defineRoute({
    ...base,
    method: 'put',
    path: '/price-items/:id',
    summary: 'Change a price (later quotes and invoices use it; issued ones keep theirs) (Owner, Admin)',
    request: { params: idParamSchema, body: priceItemInputSchema },
    responses: { 200: { description: 'Changed', schema: priceItemSchema } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json(await changePriceItem(deps, actor, params.id, body));
    },
  }),
  defineRoute({
    ...base,
    method: 'get',
    path: '/jobs/:id/price-lines',
    summary:
      "The lines the price list gives a job now: its visit by the survey's radiators, its chemicals (used, or planned) at their sell price",
    request: { params: idParamSchema },
    responses: { 200: { description: 'Lines', schema: suggestedLinesSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json({ lines: await suggestLinesForJob(deps, actor, params.id) });
    },
  }),
  defineRoute({
    ...base,
    method: 'get',
    path: '/invoices',
    summary: 'Invoices, newest number first (filter by state or job)',
    request: { query: invoiceListQuerySchema },
    responses: { 200: { description: 'Invoices', schema: invoiceListSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json({ invoices: await listInvoicesFor(deps, actor, query) });
    },
  }),
  defineRoute({
    ...base,
    method: 'post',
    path: '/invoices',
    summary:
      "Make a draft invoice for a job by hand: the accepted quote's lines, else the price list's (Owner, Admin; one per job)",
    request: { body: invoiceFromJobInputSchema },
    responses: { 201: { description: 'Draft', schema: invoiceSchema }, 409: { description: 'The job has an invoice' } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json(await createInvoiceForJob(deps, actor, body.jobId));
    },
  }),
  defineRoute({
    ...base,
    method: 'get',
    path: '/invoices/:id',
    summary: 'An invoice with its lines, payments so far, what is due and its credit notes',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Invoice', schema: invoiceSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getInvoice(deps, actor, params.id));
    },
  }),
  defineRoute({
    ...base,
    method: 'put',
    path: '/invoices/:id/lines',
    summary: "Replace a draft invoice's lines (an issued invoice never changes: 409; correct it with a credit note)",
    request: { params: idParamSchema, body: invoiceLinesInputSchema },
    responses: { 200: { description: 'Changed', schema: invoiceSchema }, 409: { description: 'Issued' } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json(await putInvoiceLines(deps, actor, params.id, body.lines));
    },
  }),
  defineRoute({
    ...base,
    method: 'post',
    path: '/invoices/:id/issue',
    summary:
      'Issue a draft: the next invoice number, the time of supply, due date; e-mailed to the customer with a pay link',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Issued', schema: invoiceSchema }, 409: { description: 'Already issued' } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await issueInvoice(deps, actor, params.id));
    },
  }),
  defineRoute({
    ...base,
    method: 'post',
    path: '/invoices/:id/credit-notes',
    summary: 'Credit an issued invoice in whole or in part (lines and quantities), with a reason; its own number',
    request: { params: idParamSchema, body: creditNoteInputSchema },
    responses: { 201: { description: 'Credited', schema: invoiceSchema } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.status(201).json(await createCreditNote(deps, actor, params.id, body));
    },
  }),
  defineRoute({
    ...base,
    method: 'get',
    path: '/invoices/:id/invoice.pdf',
    summary: 'The invoice as a PDF (regulation 14 particulars), in the job report\u2019s look',
    request: { params: idParamSchema },
    responses: { 200: { description: 'PDF' } },
    handle: async ({ params, res, deps, actor }) => {
      const { pdf, name } = await invoicePdfFor(deps, actor, params.id);
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
      res.send(pdf);
    },
  }),
  defineRoute({
    ...base,
    method: 'get',
    path: '/credit-notes/:id/credit-note.pdf',
    summary: 'A credit note as a PDF',
    request: { params: idParamSchema },
    responses: { 200: { description: 'PDF' } },
    handle: async ({ params, res, deps, actor }) => {
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader('Content-Disposition', `attachment; filename="credit-note-${params.id}.pdf"`);
      res.send(await creditNotePdfFor(deps, actor, params.id));
    },
  }),
];
