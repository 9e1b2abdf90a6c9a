import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  customerResponseSchema,
  jobDetailSchema,
  newSiteResponseSchema,
  type CancelJobInput,
  type CreateJobInput,
  type CustomerInput,
  type SiteInput,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { customerQueries, jobQueries } from '@/features/jobs/api/job-queries';

export function useCreateJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateJobInput) => apiClient.post('/api/jobs', input, jobDetailSchema),
    onSuccess: (detail) => {
      queryClient.setQueryData(jobQueries.detail(detail.job.id).queryKey, detail);
      void queryClient.invalidateQueries({ queryKey: jobQueries.lists() });
    },
  });
}

export function useCreateCustomer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: CustomerInput) =>
      (await apiClient.post('/api/customers', input, customerResponseSchema)).customer,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: customerQueries.all() }),
  });
}

export function useCreateSite(customerId: number | null) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: SiteInput) =>
      (await apiClient.post(`/api/customers/${customerId}/sites`, input, newSiteResponseSchema)).site,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: customerQueries.all() }),
  });
}

export function useCancelJob(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CancelJobInput) => apiClient.post(`/api/jobs/${id}/cancel`, input, jobDetailSchema),
    onSuccess: (detail) => {
      queryClient.setQueryData(jobQueries.detail(id).queryKey, detail);
      void queryClient.invalidateQueries({ queryKey: jobQueries.lists() });
    },
  });
}
