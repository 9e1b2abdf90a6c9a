import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { outboxMessageSchema, outboxMessageSummarySchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const listEnvelopeSchema = z.object({ messages: z.array(outboxMessageSummarySchema) });
const messageEnvelopeSchema = z.object({ message: outboxMessageSchema });

export async function listOutboxMessages() {
  const { messages } = await apiClient.get('/api/outbox', listEnvelopeSchema);
  return [...messages].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
}

export async function getOutboxMessage(id: string) {
  return (await apiClient.get(`/api/outbox/${encodeURIComponent(id)}`, messageEnvelopeSchema)).message;
}

export const outboxQueries = {
  all: () => ['outbox'] as const,
  lists: () => [...outboxQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: outboxQueries.lists(), queryFn: listOutboxMessages, staleTime: 0 }),
  detail: (id: string) =>
    queryOptions({ queryKey: [...outboxQueries.all(), 'detail', id] as const, queryFn: () => getOutboxMessage(id), staleTime: Infinity }),
};
