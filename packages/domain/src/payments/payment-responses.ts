import { z } from 'zod';
import { invoiceStates } from '../money/invoice-state.ts';
import { SUBSCRIPTION_GRACE_DAYS } from './payment-schemas.ts';

export const paymentStatuses = ['pending', 'succeeded', 'failed', 'expired'] as const;
export type PaymentStatus = (typeof paymentStatuses)[number];
export const paymentStatusLabels: Record<PaymentStatus, string> = {
  pending: 'Waiting for the customer',
  succeeded: 'Paid',
  failed: 'Card declined',
  expired: 'Not completed',
};

export const paymentSchema = z.object({
  id: z.number(),
  invoiceId: z.number(),
  amountPence: z.number(),
  refundedPence: z.number(),
  status: z.enum(paymentStatuses),
  failureMessage: z.string().nullable(),
  startedFrom: z.enum(['email_link', 'doorstep']),
  paidAt: z.string().nullable(),
  createdAt: z.string(),
  refunds: z.array(
    z.object({ id: z.number(), amountPence: z.number(), reason: z.string().nullable(), createdAt: z.string() }),
  ),
});
export type Payment = z.infer<typeof paymentSchema>;

export const invoicePaymentsResponseSchema = z.object({
  invoiceId: z.number(),
  /** The invoice's money as its own record holds it (the state follows payments and refunds). */
  invoice: z.object({
    number: z.string().nullable(),
    customerName: z.string(),
    status: z.enum(invoiceStates),
    totalPence: z.number(),
    paidPence: z.number(),
    duePence: z.number(),
  }),
  payments: z.array(paymentSchema),
  /** Whether the firm's payment account takes cards yet (the pay QR needs it). */
  cardPaymentsReady: z.boolean(),
});
export type InvoicePaymentsResponse = z.infer<typeof invoicePaymentsResponseSchema>;

export const payLinkResponseSchema = z.object({
  url: z.string(),
  /** The same link as an SVG QR code, for the customer to scan from the engineer's phone. */
  qrSvg: z.string(),
  duePence: z.number(),
  expiresAt: z.string(),
});
export type PayLinkResponse = z.infer<typeof payLinkResponseSchema>;

/** What the customer sees on the public pay link before they are sent to the hosted checkout. */
export const publicPayLinkSchema = z.object({
  firmName: z.string(),
  invoiceNumber: z.string(),
  totalPence: z.number(),
  duePence: z.number(),
  state: z.enum(['payable', 'paid', 'not_payable']),
});
export type PublicPayLink = z.infer<typeof publicPayLinkSchema>;

export const checkoutRedirectSchema = z.object({ url: z.string() });
export type CheckoutRedirect = z.infer<typeof checkoutRedirectSchema>;

export const paymentAccountSchema = z.object({
  connected: z.boolean(),
  chargesEnabled: z.boolean(),
  detailsSubmitted: z.boolean(),
});
export type PaymentAccount = z.infer<typeof paymentAccountSchema>;

export const onboardingLinkSchema = z.object({ url: z.string() });

export const webhookAnswerSchema = z.object({ received: z.literal(true), applied: z.boolean() });

export const billingStatusSchema = z.object({
  readOnly: z.boolean(),
  /** When a failed payment turns (or turned) the firm read-only; null while nothing is owed. */
  readOnlyFrom: z.string().nullable(),
  paymentFailed: z.boolean(),
});
export type BillingStatus = z.infer<typeof billingStatusSchema>;

export const billingInvoiceSchema = z.object({
  id: z.string(),
  number: z.string().nullable(),
  status: z.string(),
  amountDuePence: z.number(),
  amountPaidPence: z.number(),
  createdAt: z.string(),
  url: z.string().nullable(),
});

export const billingResponseSchema = z.object({
  plan: z.object({
    status: z.string(),
    vans: z.number(),
    unitPence: z.number(),
    monthlyPence: z.number(),
    trialEndsAt: z.string().nullable(),
    periodEndsAt: z.string().nullable(),
  }),
  card: z.object({ brand: z.string(), last4: z.string(), expMonth: z.number(), expYear: z.number() }).nullable(),
  invoices: z.array(billingInvoiceSchema),
  status: billingStatusSchema,
  graceDays: z.literal(SUBSCRIPTION_GRACE_DAYS),
});
export type BillingResponse = z.infer<typeof billingResponseSchema>;
