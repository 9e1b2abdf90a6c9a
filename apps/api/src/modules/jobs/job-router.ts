import { z } from 'zod';
import { createJobInputSchema, idParamSchema, jobDetailSchema, jobListResponseSchema } from '@heatfleet/domain';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { completeJob } from './job-completion-service.ts';
import { createJob, getJob, listJobs } from './job-service.ts';

export const jobRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/jobs',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'Cleaning jobs, newest first',
    request: {},
    responses: { 200: { description: 'Jobs', schema: jobListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ jobs: await listJobs(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/jobs',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary:
      'Book a job with its survey; the answer has the volume, dose plan and van check. An engineer books for themself; the office names any active engineer.',
    request: { body: createJobInputSchema },
    responses: {
      201: { description: 'Booked', schema: jobDetailSchema },
      400: { description: 'The member named is not an active engineer' },
      403: { description: 'An engineer named someone else' },
    },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json(await createJob(deps, actor, body));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/jobs/:id',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'A job: system volume and how it was reached, dose plan, batches to take from the van, chemicals used',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Job', schema: jobDetailSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json(await getJob(deps, actor, params.id));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/jobs/:id/complete',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'Complete a job: its chemicals come off the van by batch, exactly once (send an Idempotency-Key)',
    request: { params: idParamSchema, body: z.strictObject({}).optional() },
    responses: {
      200: { description: 'Completed', schema: jobDetailSchema },
      409: { description: 'Already completed, or the van is short' },
    },
    handle: async ({ params, req, res, deps, actor }) => {
      const out = await completeJob(deps, actor, params.id, idempotencyKeyOf(req));
      res.status(out.status).json(out.body);
    },
  }),
];
