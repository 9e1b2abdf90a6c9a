import { queryOptions } from '@tanstack/react-query';
import {
  customerListResponseSchema,
  customerResponseSchema,
  jobDetailSchema,
  jobListResponseSchema,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';

// The answers' shapes are the domain's, the same schemas the API declares for these routes.

export async function listJobs() {
  return (await apiClient.get('/api/jobs', jobListResponseSchema)).jobs;
}

export function getJob(id: number) {
  return apiClient.get(`/api/jobs/${id}`, jobDetailSchema);
}

export async function listCustomers() {
  return (await apiClient.get('/api/customers', customerListResponseSchema)).customers;
}

export async function getCustomer(id: number) {
  return (await apiClient.get(`/api/customers/${id}`, customerResponseSchema)).customer;
}

export const jobQueries = {
  all: () => queryRoots.jobs,
  lists: () => [...jobQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: jobQueries.lists(), queryFn: listJobs }),
  details: () => [...jobQueries.all(), 'detail'] as const,
  detail: (id: number) => queryOptions({ queryKey: [...jobQueries.details(), id] as const, queryFn: () => getJob(id) }),
};

export const customerQueries = {
  all: () => ['customers'] as const,
  lists: () => [...customerQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: customerQueries.lists(), queryFn: listCustomers }),
  detail: (id: number) =>
    queryOptions({ queryKey: [...customerQueries.all(), 'detail', id] as const, queryFn: () => getCustomer(id) }),
};
