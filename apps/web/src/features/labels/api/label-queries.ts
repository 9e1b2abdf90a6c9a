import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { kitLabelSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const labelsEnvelopeSchema = z.object({ labels: z.array(kitLabelSchema) });

export type LabelSelection = { kitId: number } | { ids: number[] };

export async function listLabels(selection: LabelSelection) {
  const query = 'kitId' in selection ? `kitId=${selection.kitId}` : `ids=${selection.ids.join(',')}`;
  return (await apiClient.get(`/api/kit-items/labels?${query}`, labelsEnvelopeSchema)).labels;
}

export const labelQueries = {
  all: () => ['labels'] as const,
  sheet: (selection: LabelSelection) =>
    queryOptions({ queryKey: [...labelQueries.all(), selection] as const, queryFn: () => listLabels(selection) }),
};
