import { queryOptions } from '@tanstack/react-query';
import { kitLabelListResponseSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export type LabelSelection = { kitId: number } | { ids: number[] };

export async function listLabels(selection: LabelSelection) {
  const query = 'kitId' in selection ? `kitId=${selection.kitId}` : `ids=${selection.ids.join(',')}`;
  return (await apiClient.get(`/api/kit-items/labels?${query}`, kitLabelListResponseSchema)).labels;
}

export const labelQueries = {
  all: () => ['labels'] as const,
  sheet: (selection: LabelSelection) =>
    queryOptions({ queryKey: [...labelQueries.all(), selection] as const, queryFn: () => listLabels(selection) }),
};
