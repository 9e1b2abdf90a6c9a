import type { CreateJobInput, CustomerDetail, CustomerInput, JobDetail, NewSite, SiteInput } from '@heatfleet/domain';
import { callApi, type ApiSession } from './api-session';

// Customers, sites and booked jobs for a fixture firm (apps/api/src/modules/jobs and sites).

export async function addCustomer(session: ApiSession, input: CustomerInput): Promise<CustomerDetail> {
  return (await callApi<{ customer: CustomerDetail }>(session, 'post', '/api/customers', { data: input })).customer;
}

export async function addSite(session: ApiSession, customerId: number, input: SiteInput): Promise<NewSite> {
  return (await callApi<{ site: NewSite }>(session, 'post', `/api/customers/${customerId}/sites`, { data: input }))
    .site;
}

/** A job booked with its survey; the answer carries the plan (volume, doses, what the van is short of). */
export async function bookJob(session: ApiSession, input: CreateJobInput): Promise<JobDetail> {
  return callApi<JobDetail>(session, 'post', '/api/jobs', { data: input });
}
