import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '@/lib/api-client';

// The API answers sites without a shared response schema, so the client pins down what it reads.
const siteCheckSchema = z.object({
  id: z.number(),
  checkedOn: z.string(),
  product: z.object({ id: z.number(), name: z.string() }),
  inhibitorReading: z.number(),
  target: z.object({ min: z.number(), max: z.number(), unit: z.string().nullable() }),
  systemTdsPpm: z.number().nullable(),
  result: z.enum(['pass', 'fail']),
  notes: z.string().nullable(),
  byName: z.string(),
  createdAt: z.string(),
});
export type SiteCheck = z.infer<typeof siteCheckSchema>;

const inhibitorSchema = z.object({
  id: z.number(),
  name: z.string(),
  targetMin: z.number(),
  targetMax: z.number(),
  targetUnit: z.string().nullable(),
  testMethod: z.string().nullable(),
});
export type CheckableInhibitor = z.infer<typeof inhibitorSchema>;

export const siteDetailSchema = z.object({
  site: z.object({
    id: z.number(),
    address: z.string(),
    postcode: z.string().nullable(),
    accessNotes: z.string().nullable(),
    systemNotes: z.string().nullable(),
    nextCheckOn: z.string().nullable(),
  }),
  customer: z.object({ id: z.number(), name: z.string(), email: z.string().nullable(), phone: z.string().nullable(), contact: z.string().nullable() }),
  jobs: z.array(
    z.object({
      id: z.number(),
      status: z.enum(['planned', 'completed']),
      scheduledOn: z.string(),
      completedAt: z.string().nullable(),
      nextCheckOn: z.string().nullable(),
      engineerName: z.string().nullable(),
    }),
  ),
  checks: z.array(siteCheckSchema),
  nextCheckOn: z.string().nullable(),
  inhibitors: z.array(inhibitorSchema),
});
export type SiteDetail = z.infer<typeof siteDetailSchema>;

const siteListRowSchema = z.object({
  id: z.number(),
  address: z.string(),
  postcode: z.string().nullable(),
  nextCheckOn: z.string().nullable(),
  customer: z.object({ id: z.number(), name: z.string() }),
});
export type SiteListRow = z.infer<typeof siteListRowSchema>;

const customerRowSchema = z.object({ id: z.number(), name: z.string(), email: z.string().nullable(), phone: z.string().nullable(), contact: z.string().nullable() });
export type CustomerRow = z.infer<typeof customerRowSchema>;

export const recordCheckAnswerSchema = z.object({ check: siteCheckSchema, site: siteDetailSchema });

export function getSite(id: number) {
  return apiClient.get(`/api/sites/${id}`, siteDetailSchema);
}

export async function listSites() {
  return (await apiClient.get('/api/sites', z.object({ sites: z.array(siteListRowSchema) }))).sites;
}

export async function listCustomers() {
  return (await apiClient.get('/api/customers', z.object({ customers: z.array(customerRowSchema) }))).customers;
}

export const siteQueries = {
  all: () => ['sites'] as const,
  lists: () => [...siteQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: siteQueries.lists(), queryFn: listSites }),
  details: () => [...siteQueries.all(), 'detail'] as const,
  detail: (id: number) => queryOptions({ queryKey: [...siteQueries.details(), id] as const, queryFn: () => getSite(id) }),
  customers: () => queryOptions({ queryKey: [...siteQueries.all(), 'customers'] as const, queryFn: listCustomers }),
};
