import { z } from 'zod';

/** An e-mail caught by the local SMTP server in development and tests. */
export const outboxMessageSummarySchema = z.object({
  id: z.string(),
  to: z.array(z.string()),
  from: z.string(),
  subject: z.string(),
  receivedAt: z.string(),
});
export const outboxMessageSchema = outboxMessageSummarySchema.extend({
  text: z.string(),
  html: z.string().nullable(),
  links: z.array(z.string()),
});
export type OutboxMessageSummary = z.infer<typeof outboxMessageSummarySchema>;
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
