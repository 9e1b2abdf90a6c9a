import { queryOptions } from '@tanstack/react-query';
import {
  customerListResponseSchema,
  customerResponseSchema,
  jobDetailSchema,
  jobListResponseSchema,
  type JobListQuery,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';

// The answers' shapes are the domain's, the same schemas the API declares for these routes.

/** The jobs list's filters as the API takes them (jobListQuerySchema); empty ones are left out. */
export function jobListSearch(filters: JobListQuery): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters))
    if (value !== undefined && value !== '') params.set(key, String(value));
  const text = params.toString();
  return text ? `?${text}` : '';
}

export async function listJobs(filters: JobListQuery = {}) {
  return (await apiClient.get(`/api/jobs${jobListSearch(filters)}`, jobListResponseSchema)).jobs;
}

export function getJob(id: number) {
  return apiClient.get(`/api/jobs/${id}`, jobDetailSchema);
}

export async function listCustomers(q?: string) {
  const search = q ? `?q=${encodeURIComponent(q)}` : '';
  return (await apiClient.get(`/api/customers${search}`, customerListResponseSchema)).customers;
}

export async function getCustomer(id: number) {
  return (await apiClient.get(`/api/customers/${id}`, customerResponseSchema)).customer;
}

export const jobQueries = {
  all: () => queryRoots.jobs,
  lists: () => [...jobQueries.all(), 'list'] as const,
  list: (filters: JobListQuery = {}) =>
    queryOptions({ queryKey: [...jobQueries.lists(), filters] as const, queryFn: () => listJobs(filters) }),
  details: () => [...jobQueries.all(), 'detail'] as const,
  detail: (id: number) => queryOptions({ queryKey: [...jobQueries.details(), id] as const, queryFn: () => getJob(id) }),
};

export const customerQueries = {
  all: () => ['customers'] as const,
  lists: () => [...customerQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: customerQueries.lists(), queryFn: () => listCustomers() }),
  /** The type-ahead: at most 10 by name, postcode or address. */
  search: (q: string) =>
    queryOptions({
      queryKey: [...customerQueries.lists(), 'search', q] as const,
      queryFn: () => listCustomers(q),
      enabled: q.trim().length > 0,
      staleTime: 30_000,
    }),
  detail: (id: number) =>
    queryOptions({ queryKey: [...customerQueries.all(), 'detail', id] as const, queryFn: () => getCustomer(id) }),
};
