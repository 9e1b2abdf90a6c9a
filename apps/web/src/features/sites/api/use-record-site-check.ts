import { useMutation, useQueryClient } from '@tanstack/react-query';
import { siteCheckResponseSchema, type SiteCheckInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';
import { siteQueries } from '@/features/sites/api/site-queries';

export function useRecordSiteCheck(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SiteCheckInput) =>
      apiClient.post(`/api/sites/${siteId}/checks`, input, siteCheckResponseSchema),
    onSuccess: (answer) => {
      queryClient.setQueryData(siteQueries.detail(siteId).queryKey, answer.site);
      void queryClient.invalidateQueries({ queryKey: siteQueries.lists() });
      // The jobs list shows each site's next check date.
      void queryClient.invalidateQueries({ queryKey: queryRoots.jobs });
    },
  });
}
