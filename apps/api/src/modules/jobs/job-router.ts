import { z } from 'zod';
import { createJobInputSchema, customerInputSchema, idParamSchema, siteInputSchema } from '@heatfleet/domain';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { idempotencyKeyOf, runIdempotent } from '../../lib/idempotency.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { completeJob, createCustomer, createJob, createSite, getCustomer, getJob, listCustomers, listJobs } from './job-service.ts';
import { renderReportFor } from './job-report.ts';
import { queueJobReportEmail } from './job-report-email.ts';

export const jobRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get', path: '/customers', tag: 'Jobs', access: 'member', tenantData: true, summary: 'Customers', request: {},
    responses: { 200: { description: 'Customers' } },
    handle: async ({ res, deps, actor }) => {
      res.json({ customers: await listCustomers(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post', path: '/customers', tag: 'Jobs', access: 'member', tenantData: true, summary: 'Add a customer', request: { body: customerInputSchema },
    responses: { 201: { description: 'Added' } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ customer: await createCustomer(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get', path: '/customers/:id', tag: 'Jobs', access: 'member', tenantData: true, summary: 'A customer and their sites', request: { params: idParamSchema },
    responses: { 200: { description: 'Customer' } },
    handle: async ({ params, res, deps, actor }) => {
      res.json({ customer: await getCustomer(deps, actor, params.id) });
    },
  }),
  defineRoute({
    method: 'post', path: '/customers/:id/sites', tag: 'Jobs', access: 'member', tenantData: true, summary: 'Add a site to a customer', request: { params: idParamSchema, body: siteInputSchema },
    responses: { 201: { description: 'Added' } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.status(201).json({ site: await createSite(deps, actor, params.id, body) });
    },
  }),
  defineRoute({
    method: 'get', path: '/jobs', tag: 'Jobs', access: 'member', tenantData: true, summary: 'Cleaning jobs, newest first', request: {},
    responses: { 200: { description: 'Jobs' } },
    handle: async ({ res, deps, actor }) => {
      res.json({ jobs: await listJobs(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post', path: '/jobs', tag: 'Jobs', access: 'member', tenantData: true,
    summary: 'Book a job with its survey; the answer has the volume, dose plan and van check', request: { body: createJobInputSchema },
    responses: { 201: { description: 'Booked' } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json(await createJob(deps, actor, body));
    },
  }),
  defineRoute({
    method: 'get', path: '/jobs/:id', tag: 'Jobs', access: 'member', tenantData: true,
    summary: 'A job: system volume and how it was reached, dose plan, batches to take from the van, chemicals used',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Job' } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getJob(deps, actor, params.id));
    },
  }),
  defineRoute({
    method: 'post', path: '/jobs/:id/complete', tag: 'Jobs', access: 'member', tenantData: true,
    summary: 'Complete a job: its chemicals come off the van by batch, exactly once (send an Idempotency-Key)',
    request: { params: idParamSchema, body: z.strictObject({}).optional() },
    responses: { 200: { description: 'Completed' }, 409: { description: 'Already completed, or the van is short' } },
    handle: async ({ params, req, res, deps, actor }) => {
      const key = idempotencyKeyOf(req);
      let emailId: number | null = null;
      const out = await withTransactionRetry(() =>
        runIdempotent(deps, actor, key, `complete job ${params.id}`, async (trx) => {
          await completeJob(trx, deps, actor, params.id);
          const detail = await getJob(deps, actor, params.id, trx);
          // The report e-mail is written with the completion, so it exists exactly when the job is done.
          emailId = await queueJobReportEmail(trx, deps, actor, detail);
          return { status: 200, body: detail };
        }),
      );
      if (emailId !== null) await deps.mailQueue.notify([emailId]);
      res.status(out.status).json(out.body);
    },
  }),
  defineRoute({
    method: 'get', path: '/jobs/:id/report.pdf', tag: 'Jobs', access: 'member', tenantData: true,
    summary: 'The completion report as a PDF (firm, customer, system, volume, chemicals with lots, radiator table, water tests, kit, steps, photos, cautions, next check)',
    request: { params: idParamSchema },
    responses: { 200: { description: 'PDF' } },
    handle: async ({ params, res, deps, actor }) => {
      const detail = await getJob(deps, actor, params.id);
      const pdf = await renderReportFor(deps, deps.db, actor.firmId, detail);
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader('Content-Disposition', `attachment; filename="cleaning-report-${params.id}.pdf"`);
      res.send(pdf);
    },
  }),
];
