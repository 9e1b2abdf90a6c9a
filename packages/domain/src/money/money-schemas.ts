import { z } from 'zod';
import { calendarDateSchema } from '../lib/calendar-date.ts';
import { signatureInputSchema } from '../jobs/visit-schemas.ts';
import { optionalPlainText, singleLineName } from '../lib/text.ts';
import { penceSchema, vatRateBpSchema } from './pence.ts';
import { bandsProblem, priceItemKinds, priceVisitKinds, visitPricings } from './price-list.ts';

/**
 * A UK VAT registration number: GB and 9 digits (or 12 for a branch), spaces allowed as printed
 * (HMRC VAT Notice 700/1, "Should I be registered for VAT?", from memory); stored without spaces.
 */
export const vatNumberSchema = z
  .string({ error: 'The VAT number must be text.' })
  .trim()
  .transform((s) => s.replace(/\s+/g, '').toUpperCase())
  .refine((s) => /^(GB)?(\d{9}|\d{12})$/.test(s), {
    error: 'A UK VAT number is GB followed by 9 digits (12 for a branch), e.g. GB 123 4567 89.',
  })
  .transform((s) => (s.startsWith('GB') ? s : `GB${s}`));

export const moneySettingsInputSchema = z
  .strictObject({
    vatRegistered: z.boolean({ error: 'Say whether the firm is registered for VAT.' }),
    vatNumber: vatNumberSchema.nullable().optional(),
    vatRateBp: vatRateBpSchema,
    paymentTermsDays: z.number().int().min(0, { error: 'Payment terms cannot be negative.' }).max(120),
    quoteValidityDays: z.number().int().min(1, { error: 'A quote must be valid for at least a day.' }).max(365),
    firstReminderDays: z.number().int().min(1).max(365),
    secondReminderDays: z.number().int().min(1).max(365),
    /** Issue the invoice when a job is completed (else the office makes it by hand). */
    invoiceOnCompletion: z.boolean().optional().default(true),
  })
  .refine((s) => !s.vatRegistered || !!s.vatNumber, {
    error: 'A VAT-registered firm must give its VAT number (it is printed on every invoice).',
    path: ['vatNumber'],
  })
  .refine((s) => s.secondReminderDays > s.firstReminderDays, {
    error: 'The second reminder must come after the first.',
    path: ['secondReminderDays'],
  });
export type MoneySettingsInput = z.infer<typeof moneySettingsInputSchema>;

export const radiatorBandSchema = z.strictObject({
  upToRadiators: z.number().int().min(1, { error: 'A band covers at least 1 radiator.' }).max(200),
  pricePence: penceSchema('The band price'),
});

export const priceItemInputSchema = z
  .strictObject({
    kind: z.enum(priceItemKinds, { error: () => ({ message: 'Choose visit, chemical or extra.' }) }),
    name: singleLineName('The name', { max: 120 }),
    visitKind: z.enum(priceVisitKinds).nullable().optional(),
    pricing: z.enum(visitPricings).nullable().optional(),
    basePence: penceSchema('The base price').optional().default(0),
    perRadiatorPence: penceSchema('The price per radiator').optional().default(0),
    bands: z.array(radiatorBandSchema).max(20).optional().default([]),
    /** Chemicals: the product in stock this price sells (so a job's chemicals find their price). */
    productId: z.number().int().positive().nullable().optional(),
    /** Chemicals and extras: the sell price of one. */
    unitPence: penceSchema('The price').optional().default(0),
    active: z.boolean().optional().default(true),
  })
  .superRefine((v, ctx) => {
    if (v.kind === 'visit') {
      if (!v.visitKind) ctx.addIssue({ code: 'custom', path: ['visitKind'], message: 'Choose the kind of visit.' });
      if (!v.pricing) ctx.addIssue({ code: 'custom', path: ['pricing'], message: 'Choose per radiator or bands.' });
      if (v.pricing === 'bands') {
        if (!v.bands.length) ctx.addIssue({ code: 'custom', path: ['bands'], message: 'Give at least one band.' });
        const problem = bandsProblem(v.bands);
        if (problem) ctx.addIssue({ code: 'custom', path: ['bands'], message: problem });
      }
    }
    if (v.kind === 'chemical' && !v.productId)
      ctx.addIssue({ code: 'custom', path: ['productId'], message: 'Choose the product this price is for.' });
  });
export type PriceItemInput = z.infer<typeof priceItemInputSchema>;

/** A line as the firm edits it on a quote or a hand-made invoice. */
export const moneyLineInputSchema = z.strictObject({
  kind: z.enum(['visit', 'chemical', 'extra', 'other']),
  priceItemId: z.number().int().positive().nullable().optional(),
  productId: z.number().int().positive().nullable().optional(),
  description: singleLineName('The description', { max: 200 }),
  quantity: z
    .number()
    .int({ error: 'Quantity must be whole.' })
    .min(1, { error: 'Quantity must be at least 1.' })
    .max(10_000),
  unitPence: penceSchema('The unit price'),
});
export type MoneyLineInput = z.infer<typeof moneyLineInputSchema>;

export const quoteInputSchema = z.strictObject({
  jobId: z.number().int().positive(),
  lines: z.array(moneyLineInputSchema).min(1, { error: 'A quote needs at least one line.' }).max(50),
  validUntil: calendarDateSchema.optional(),
  notes: optionalPlainText('Notes', 1000),
});
export type QuoteInput = z.infer<typeof quoteInputSchema>;

export const quoteLinesInputSchema = quoteInputSchema.pick({ lines: true, validUntil: true, notes: true });

/** The customer's answer on the link, or taken on the phone (then with a signature, multipart). */
export const quoteAcceptInputSchema = z.strictObject({
  name: singleLineName('Your name', { max: 120 }),
  agree: z.literal(true, { error: 'Tick the box to accept the quote.' }),
  /** Consumer Contracts Regulations 2013, regulation 36: the work to begin within the cancellation period. */
  expressRequest: z.boolean().optional().default(false),
});
export type QuoteAcceptInput = z.infer<typeof quoteAcceptInputSchema>;

export const quoteDeclineInputSchema = z.strictObject({
  reason: optionalPlainText('Reason', 500),
});

export const invoiceFromJobInputSchema = z.strictObject({ jobId: z.number().int().positive() });

export const creditNoteInputSchema = z.strictObject({
  reason: singleLineName('The reason', { max: 300 }),
  /** Lines of the invoice to credit and how many of each; none given credits the whole invoice. */
  lines: z
    .array(
      z.strictObject({ invoiceLineId: z.number().int().positive(), quantity: z.number().int().min(1).max(10_000) }),
    )
    .max(50)
    .optional(),
});
export type CreditNoteInput = z.infer<typeof creditNoteInputSchema>;

export const exportQuerySchema = z.strictObject({ from: calendarDateSchema, to: calendarDateSchema });
export const tokenParamSchema = z.strictObject({
  token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, { error: 'That link is not valid.' }),
});

export const invoiceLinesInputSchema = z.strictObject({
  lines: z.array(moneyLineInputSchema).min(1, { error: 'An invoice needs at least one line.' }).max(50),
});
export const invoiceListQuerySchema = z.strictObject({
  status: z.enum(['draft', 'issued', 'part_paid', 'paid', 'credited']).optional(),
  jobId: z.coerce.number().int().positive().optional(),
});
export const jobIdQuerySchema = z.strictObject({ jobId: z.coerce.number().int().positive().optional() });
export const suggestedLinesSchema = z.object({ lines: z.array(moneyLineInputSchema) });

/** Acceptance taken on the engineer's phone: the customer's name, tick, express request and drawn signature. */
export const quotePhoneAcceptInputSchema = quoteAcceptInputSchema.extend({
  imagePngDataUrl: signatureInputSchema.shape.imagePngDataUrl,
});
export type QuotePhoneAcceptInput = z.infer<typeof quotePhoneAcceptInputSchema>;
