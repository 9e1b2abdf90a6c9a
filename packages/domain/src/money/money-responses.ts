import { z } from 'zod';
import { invoiceStates } from './invoice-state.ts';
import { priceItemKinds, priceVisitKinds, visitPricings } from './price-list.ts';

export const moneySettingsSchema = z.object({
  vatRegistered: z.boolean(),
  vatNumber: z.string().nullable(),
  vatRateBp: z.number(),
  paymentTermsDays: z.number(),
  quoteValidityDays: z.number(),
  firstReminderDays: z.number(),
  secondReminderDays: z.number(),
  invoiceOnCompletion: z.boolean(),
  /** False until the firm first saves its money settings: nothing is invoiced before. */
  saved: z.boolean(),
  roundingRule: z.string(),
});
export type MoneySettings = z.infer<typeof moneySettingsSchema>;

export const priceItemSchema = z.object({
  id: z.number(),
  kind: z.enum(priceItemKinds),
  name: z.string(),
  visitKind: z.enum(priceVisitKinds).nullable(),
  pricing: z.enum(visitPricings).nullable(),
  basePence: z.number(),
  perRadiatorPence: z.number(),
  bands: z.array(z.object({ upToRadiators: z.number(), pricePence: z.number() })),
  productId: z.number().nullable(),
  productName: z.string().nullable(),
  unitPence: z.number(),
  active: z.boolean(),
});
export type PriceItem = z.infer<typeof priceItemSchema>;

export const priceListResponseSchema = z.object({ settings: moneySettingsSchema, items: z.array(priceItemSchema) });
export type PriceListResponse = z.infer<typeof priceListResponseSchema>;

export const moneyLineSchema = z.object({
  id: z.number(),
  kind: z.enum(['visit', 'chemical', 'extra', 'other']),
  priceItemId: z.number().nullable(),
  productId: z.number().nullable(),
  description: z.string(),
  quantity: z.number(),
  unitPence: z.number(),
  vatRateBp: z.number(),
  netPence: z.number(),
  vatPence: z.number(),
});
export type MoneyLine = z.infer<typeof moneyLineSchema>;

const totals = { netPence: z.number(), vatPence: z.number(), totalPence: z.number() };

export const quoteStatuses = ['draft', 'sent', 'accepted', 'declined'] as const;
export type QuoteStatus = (typeof quoteStatuses)[number];

export const quoteSchema = z.object({
  id: z.number(),
  number: z.string(),
  jobId: z.number(),
  customerName: z.string(),
  siteAddress: z.string(),
  status: z.enum(quoteStatuses),
  expired: z.boolean(),
  validUntil: z.string(),
  vatRegistered: z.boolean(),
  notes: z.string().nullable(),
  lines: z.array(moneyLineSchema),
  ...totals,
  sentAt: z.string().nullable(),
  acceptance: z
    .object({
      name: z.string(),
      at: z.string(),
      via: z.enum(['link', 'phone']),
      expressRequest: z.boolean(),
      hasSignature: z.boolean(),
    })
    .nullable(),
  declinedAt: z.string().nullable(),
  declineReason: z.string().nullable(),
  createdAt: z.string(),
});
export type Quote = z.infer<typeof quoteSchema>;
export const quoteListSchema = z.object({ quotes: z.array(quoteSchema) });

/** The customer's view on the public link: what the quote is and who from, never the firm's ids. */
export const publicQuoteSchema = z.object({
  number: z.string(),
  firmName: z.string(),
  firmAddress: z.string().nullable(),
  firmPhone: z.string().nullable(),
  firmEmail: z.string().nullable(),
  vatNumber: z.string().nullable(),
  customerName: z.string(),
  siteAddress: z.string(),
  status: z.enum(quoteStatuses),
  expired: z.boolean(),
  validUntil: z.string(),
  vatRegistered: z.boolean(),
  notes: z.string().nullable(),
  lines: z.array(moneyLineSchema.omit({ id: true, priceItemId: true, productId: true })),
  ...totals,
  cancellation: z.object({ information: z.array(z.string()), modelForm: z.array(z.string()) }),
  acceptance: z.object({ name: z.string(), at: z.string(), expressRequest: z.boolean() }).nullable(),
});
export type PublicQuote = z.infer<typeof publicQuoteSchema>;

export const creditNoteSchema = z.object({
  id: z.number(),
  number: z.string(),
  invoiceId: z.number(),
  invoiceNumber: z.string(),
  reason: z.string(),
  issuedAt: z.string(),
  lines: z.array(moneyLineSchema),
  ...totals,
});
export type CreditNote = z.infer<typeof creditNoteSchema>;

export const invoiceSchema = z.object({
  id: z.number(),
  number: z.string().nullable(),
  status: z.enum(invoiceStates),
  jobId: z.number().nullable(),
  quoteId: z.number().nullable(),
  customerId: z.number(),
  customerName: z.string(),
  customerAddress: z.string(),
  customerEmail: z.string().nullable(),
  firmName: z.string(),
  firmAddress: z.string().nullable(),
  vatNumber: z.string().nullable(),
  vatRegistered: z.boolean(),
  suppliedAt: z.string().nullable(),
  issuedAt: z.string().nullable(),
  dueOn: z.string().nullable(),
  lines: z.array(moneyLineSchema),
  ...totals,
  paidPence: z.number(),
  creditedPence: z.number(),
  duePence: z.number(),
  creditNotes: z.array(creditNoteSchema),
  createdAt: z.string(),
});
export type Invoice = z.infer<typeof invoiceSchema>;

export const invoiceSummarySchema = invoiceSchema.omit({ lines: true, creditNotes: true });
export type InvoiceSummary = z.infer<typeof invoiceSummarySchema>;
export const invoiceListSchema = z.object({ invoices: z.array(invoiceSummarySchema) });

export const moneyOverviewSchema = z.object({
  owedPence: z.number(),
  aged: z.object({ days_0_30: z.number(), days_31_60: z.number(), days_over_60: z.number() }),
  overdueCount: z.number(),
  revenueByMonth: z.array(z.object({ month: z.string(), netPence: z.number(), totalPence: z.number() })),
});
export type MoneyOverview = z.infer<typeof moneyOverviewSchema>;
