import { z } from 'zod';

/** A refund of a card payment: the whole of what is left when no amount is given. */
export const refundInputSchema = z.strictObject({
  amountPence: z
    .number({ error: 'Give the amount to refund in pence, a whole number.' })
    .int({ error: 'Give the amount to refund in pence, a whole number.' })
    .min(1, { error: 'A refund must be at least 1p.' })
    .max(100_000_000, { error: 'That amount is more than any payment here.' })
    .optional(),
  reason: z.string().trim().max(200, { error: 'Keep the reason under 200 characters.' }).optional(),
});
export type RefundInput = z.infer<typeof refundInputSchema>;

export const payLinkTokenParamsSchema = z.strictObject({
  token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, { error: 'This pay link is not valid.' }),
});

/** Where the pay link was opened from: the e-mail, or the QR code shown on the engineer's phone. */
export const payLinkQuerySchema = z.strictObject({ from: z.enum(['email_link', 'doorstep']).optional() });

export const paymentIdParamsSchema = z.strictObject({ id: z.coerce.number().int().positive() });
export const invoicePaymentParamsSchema = z.strictObject({ id: z.coerce.number().int().positive() });

/** The firm turns read-only this many days after its first failed subscription payment (README, Payments). */
export const SUBSCRIPTION_GRACE_DAYS = 14;
/** The trial every new firm gets before its first monthly bill. */
export const SUBSCRIPTION_TRIAL_DAYS = 30;

/** The message every write gets while the firm is read-only. */
export const firmReadOnlyMessage = 'This firm is read-only until its subscription is paid.';
