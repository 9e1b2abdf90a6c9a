import { z } from 'zod';
import { emailSchema, tokenSchema } from '../auth/auth-schemas.ts';

// Marketing e-mails (the customer's annual check offer) carry a link that unsubscribes without signing in; the firm
// keeps a suppression list its sender honours (Privacy and Electronic Communications (EC Directive) Regulations
// 2003, regulation 22(3): a simple means of refusing, free of charge, given with every message).

export const unsubscribeTokenParamSchema = z.strictObject({ token: tokenSchema });

/** What the unsubscribe page shows: whose e-mails stop, to which address (partly hidden), and if it is done. */
export const unsubscribePreviewSchema = z.object({
  firmName: z.string(),
  maskedEmail: z.string(),
  unsubscribed: z.boolean(),
});
export type UnsubscribePreview = z.infer<typeof unsubscribePreviewSchema>;
export const unsubscribePreviewResponseSchema = z.object({ unsubscribe: unsubscribePreviewSchema });

export const suppressionSources = ['unsubscribe_link', 'office'] as const;
export const suppressionSourceLabels: Record<(typeof suppressionSources)[number], string> = {
  unsubscribe_link: 'Unsubscribed from an e-mail',
  office: 'Added by the office',
};
export const marketingSuppressionSchema = z.object({
  id: z.number(),
  email: z.string(),
  source: z.enum(suppressionSources),
  createdAt: z.string(),
});
export type MarketingSuppression = z.infer<typeof marketingSuppressionSchema>;
/** The firm's suppression list, newest first. */
export const marketingSuppressionListResponseSchema = z.object({ suppressions: z.array(marketingSuppressionSchema) });

/** The office adds an address a customer asked by phone or letter not to be sent offers (regulation 22(2)). */
export const marketingSuppressionInputSchema = z.strictObject({ email: emailSchema });
export type MarketingSuppressionInput = z.infer<typeof marketingSuppressionInputSchema>;
export const marketingSuppressionResponseSchema = z.object({ suppression: marketingSuppressionSchema });

/** "j•••@example.com": enough for the person to recognise their address, not enough to read it off a shared screen. */
export function maskEmail(email: string): string {
  const at = email.lastIndexOf('@');
  if (at <= 0) return '•••';
  return `${email[0]}•••${email.slice(at)}`;
}
