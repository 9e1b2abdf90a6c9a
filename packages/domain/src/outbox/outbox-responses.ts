import { z } from 'zod';
import { outboxMessageSchema, outboxMessageSummarySchema } from './outbox-schemas.ts';

// The success bodies of the local outbox routes (development and tests only).

export const outboxListResponseSchema = z.object({ messages: z.array(outboxMessageSummarySchema) });
export const outboxMessageResponseSchema = z.object({ message: outboxMessageSchema });
