import { useMutation, useQueryClient } from '@tanstack/react-query';
import { siteCheckResponseSchema, type InhibitorCheckVisitInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';
import { siteQueries } from '@/features/sites/api/site-queries';

export function useRecordSiteCheck(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    // One key per attempt, made by the form: a retry of the same save replays it rather than taking packs twice.
    mutationFn: ({ input, idempotencyKey }: { input: InhibitorCheckVisitInput; idempotencyKey: string }) =>
      apiClient.post(`/api/sites/${siteId}/checks`, input, siteCheckResponseSchema, { idempotencyKey }),
    onSuccess: (answer) => {
      queryClient.setQueryData(siteQueries.detail(siteId).queryKey, answer.site);
      void queryClient.invalidateQueries({ queryKey: siteQueries.lists() });
      // The jobs list shows each site's next check date; a top-up took packs off a van.
      void queryClient.invalidateQueries({ queryKey: queryRoots.jobs });
      if (answer.check.topUp) {
        void queryClient.invalidateQueries({ queryKey: queryRoots.stock });
        void queryClient.invalidateQueries({ queryKey: queryRoots.vans });
      }
    },
  });
}
