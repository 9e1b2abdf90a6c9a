import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { memberSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const membersEnvelopeSchema = z.object({ members: z.array(memberSchema) });
export const memberEnvelopeSchema = z.object({ member: memberSchema });

export async function listMembers() {
  return (await apiClient.get('/api/members', membersEnvelopeSchema)).members;
}

export const memberQueries = {
  all: () => ['members'] as const,
  lists: () => [...memberQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: memberQueries.lists(), queryFn: listMembers }),
};
