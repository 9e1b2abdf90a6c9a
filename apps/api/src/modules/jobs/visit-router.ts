import { z } from 'zod';
import {
  cancelJobInputSchema,
  flushOrderInputSchema,
  idParamSchema,
  jobDetailSchema,
  jobSheetResponseSchema,
  jobSignatureResponseSchema,
  signatureInputSchema,
  signatureKinds,
  updateJobInputSchema,
} from '@heatfleet/domain';
import type { Request, Response } from 'express';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { readTappedAt, tappedAtOf } from '../../middleware/tapped-at.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { cancelJob, updateJob } from './job-edit-service.ts';
import { addSignature, openSignature, setFlushOrder } from './visit-service.ts';

const openJobResponses = {
  404: { description: 'Not this firm\u2019s job' },
  409: { description: 'The job is completed or cancelled' },
};
const metaOf = (req: Request, res: Response) => ({ idempotencyKey: idempotencyKeyOf(req), tappedAt: tappedAtOf(res) });
const ONCE =
  ' Send an Idempotency-Key header: a retry with the same key applies nothing twice. X-Tapped-At (ISO 8601) records when it was done.';

const signatureParams = z.strictObject({
  id: z.coerce.number({ error: 'The job id must be a number.' }).int().positive(),
  kind: z.enum(signatureKinds, {
    error: () => ({ message: 'The signature is the acknowledgement or the acceptance.' }),
  }),
});

export const visitRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'patch',
    path: '/jobs/:id',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary:
      'Edit or reschedule a booked job: date, engineer, survey, products, visit kind, system details (a field left out stays as it is). A survey sent with surveyVersion is refused (409) when someone changed it since.' +
      ONCE,
    request: { params: idParamSchema, body: updateJobInputSchema },
    responses: {
      200: { description: 'The job as changed', schema: jobDetailSchema },
      400: { description: 'The engineer is not an active engineer, or the survey drops radiators with records' },
      ...openJobResponses,
      409: { description: 'The job is completed or cancelled, or the survey changed since surveyVersion' },
    },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.json(await updateJob(deps, actor, params.id, body, metaOf(req, res)));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/jobs/:id/cancel',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'Cancel a booked job with a reason (sent again, it changes nothing)',
    request: { params: idParamSchema, body: cancelJobInputSchema },
    responses: {
      200: { description: 'The job as cancelled', schema: jobDetailSchema },
      404: { description: 'Not this firm\u2019s job' },
      409: { description: 'The job is completed' },
    },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json(await cancelJob(deps, actor, params.id, body));
    },
  }),
  defineRoute({
    method: 'put',
    path: '/jobs/:id/flush-order',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary:
      'Set the order the radiators are flushed in (survey indexes, the first flushed first); kept on the site for the next visit.' +
      ONCE,
    request: { params: idParamSchema, body: flushOrderInputSchema },
    responses: { 200: { description: 'The job sheet', schema: jobSheetResponseSchema }, ...openJobResponses },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.json({ sheet: await setFlushOrder(deps, actor, params.id, body.radiatorIndexes, metaOf(req, res)) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/jobs/:id/signatures',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary:
      'The customer\u2019s drawn signature (acknowledgement before the work, acceptance after it): a PNG data URL up to 64 kB, stored with the name and the time; signing again replaces it.' +
      ONCE,
    request: { params: idParamSchema, body: signatureInputSchema },
    responses: {
      201: { description: 'Stored', schema: jobSignatureResponseSchema },
      422: { description: 'Not a PNG, or too large; or X-Tapped-At not sane' },
      ...openJobResponses,
    },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.status(201).json({ signature: await addSignature(deps, actor, params.id, body, metaOf(req, res)) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/jobs/:id/signatures/:kind',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'A signature\u2019s PNG, for members of the job\u2019s firm only',
    request: { params: signatureParams },
    responses: { 200: { description: 'PNG bytes' }, 404: { description: 'Not signed, or not this firm\u2019s job' } },
    handle: async ({ params, res, deps, actor }) => {
      const { body } = await openSignature(deps, actor, params.id, params.kind);
      res.setHeader('Content-Type', 'image/png');
      res.setHeader('Content-Disposition', `inline; filename="signature-${params.id}-${params.kind}.png"`);
      res.setHeader('X-Content-Type-Options', 'nosniff');
      res.setHeader('Cache-Control', 'no-store');
      body.pipe(res);
    },
  }),
];
