import {
  completeJobInputSchema,
  createJobInputSchema,
  idParamSchema,
  jobDetailSchema,
  jobListQuerySchema,
  jobListResponseSchema,
} from '@heatfleet/domain';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { readTappedAt, tappedAtOf } from '../../middleware/tapped-at.ts';
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
    summary:
      'Cleaning jobs (at most 500), newest first or upcoming first; filtered by status, engineer and dates (from, to: YYYY-MM-DD)',
    request: { query: jobListQuerySchema },
    responses: { 200: { description: 'Jobs', schema: jobListResponseSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json({ jobs: await listJobs(deps, actor, query) });
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
    summary:
      'Complete a job: its chemicals come off the van by batch, exactly once (send an Idempotency-Key; X-Tapped-At records when the engineer tapped). Anything not done (short circulation, no water test, radiators without after readings or flush ticks, unsaved input) needs a reason in confirmations; the reasons are kept and printed on the report',
    request: { params: idParamSchema, body: completeJobInputSchema.optional() },
    responses: {
      200: { description: 'Completed', schema: jobDetailSchema },
      409: { description: 'Already completed or cancelled, or the van is short' },
      422: { description: 'Something not done needs a reason: details list each, path confirmations.<code>' },
    },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      const out = await completeJob(deps, actor, params.id, body ?? {}, idempotencyKeyOf(req), tappedAtOf(res));
      res.status(out.status).json(out.body);
    },
  }),
];
