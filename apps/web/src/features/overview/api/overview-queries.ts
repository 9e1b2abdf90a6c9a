import { queryOptions } from '@tanstack/react-query';
import { overviewResponseSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

// Parsed with the domain's schema, the one the API declares for GET /api/overview.
export async function getOverview() {
  return (await apiClient.get('/api/overview', overviewResponseSchema)).overview;
}

export const overviewQueries = {
  all: () => ['overview'] as const,
  // Figures move with every job and stock change; a minute old is fresh enough for a glance.
  detail: () => queryOptions({ queryKey: overviewQueries.all(), queryFn: getOverview, staleTime: 60_000 }),
};
