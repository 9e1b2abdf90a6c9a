import { queryOptions } from '@tanstack/react-query';
import { outboxListResponseSchema, outboxMessageResponseSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export async function listOutboxMessages() {
  const { messages } = await apiClient.get('/api/outbox', outboxListResponseSchema);
  return [...messages].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
}

export async function getOutboxMessage(id: string) {
  return (await apiClient.get(`/api/outbox/${encodeURIComponent(id)}`, outboxMessageResponseSchema)).message;
}

export const outboxQueries = {
  all: () => ['outbox'] as const,
  lists: () => [...outboxQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: outboxQueries.lists(), queryFn: listOutboxMessages, staleTime: 0 }),
  detail: (id: string) =>
    queryOptions({
      queryKey: [...outboxQueries.all(), 'detail', id] as const,
      queryFn: () => getOutboxMessage(id),
      staleTime: Infinity,
    }),
};
