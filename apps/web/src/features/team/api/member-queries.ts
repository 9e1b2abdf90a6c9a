import { queryOptions } from '@tanstack/react-query';
import { memberListResponseSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export async function listMembers() {
  return (await apiClient.get('/api/members', memberListResponseSchema)).members;
}

export const memberQueries = {
  all: () => ['members'] as const,
  lists: () => [...memberQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: memberQueries.lists(), queryFn: listMembers }),
};
