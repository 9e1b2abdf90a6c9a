import { z } from 'zod';
import {
  agitationInputSchema,
  jobKitInputSchema,
  jobNotesInputSchema,
  jobPhotoResponseSchema,
  jobPhotoTags,
  jobSheetResponseSchema,
  jobSteps,
  radiatorReadingInputSchema,
  readingPhases,
  waterTestsInputSchema,
} from '@heatfleet/domain';
import type { Request, Response } from 'express';
import { HttpError } from '../../lib/http-error.ts';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { readTappedAt, tappedAtOf } from '../../middleware/tapped-at.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { receivePhoto } from '../photos/receive-photo.ts';
import {
  addJobPhoto,
  recordAgitation,
  recordKit,
  recordNotes,
  recordReading,
  recordWaterTests,
  setFlushed,
  setStep,
} from './job-sheet-service.ts';

const jobId = z.coerce.number({ error: 'The job id must be a number.' }).int().positive();
const radiatorIndex = z.coerce
  .number({ error: 'The radiator must be its place in the survey (0, 1, ...).' })
  .int()
  .min(0)
  .max(999);

const stepParams = z.strictObject({
  id: jobId,
  step: z.enum(jobSteps, { error: () => ({ message: `The step must be one of: ${jobSteps.join(', ')}.` }) }),
});
const readingParams = z.strictObject({
  id: jobId,
  index: radiatorIndex,
  phase: z.enum(readingPhases, { error: () => ({ message: 'The phase must be before or after.' }) }),
});
const radiatorParams = z.strictObject({ id: jobId, index: radiatorIndex });
const jobParams = z.strictObject({ id: jobId });
const stepInputSchema = z.strictObject({
  done: z.boolean({ error: 'Send done: true to tick the step, false to clear it.' }),
});

const conflictResponse = {
  409: { description: 'The job is completed (or, for the notes, someone saved them since your version)' },
  404: { description: 'Not this firm\u2019s job, or no such radiator on its survey' },
  422: { description: 'The body, or X-Tapped-At in the future, older than 7 days or before the job was booked' },
};

/** Every sheet write: at most once per Idempotency-Key, and the engineer's tap time (X-Tapped-At). */
const metaOf = (req: Request, res: Response) => ({ idempotencyKey: idempotencyKeyOf(req), tappedAt: tappedAtOf(res) });
const ONCE =
  ' Send an Idempotency-Key header: a retry with the same key applies nothing twice. X-Tapped-At (ISO 8601) records when it was done.';

export const jobPhotoFieldsSchema = z.strictObject({
  tag: z.enum(jobPhotoTags, {
    error: () => ({ message: `Say what the photo shows: one of ${jobPhotoTags.join(', ')}.` }),
  }),
  caption: z.string().trim().max(200, { error: 'A caption must be at most 200 characters.' }).optional(),
});

export const jobSheetRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'put',
    path: '/jobs/:id/steps/:step',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'Tick a step of the visit (the first tick\u2019s time stands) or clear it' + ONCE,
    request: { params: stepParams, body: stepInputSchema },
    responses: { 200: { description: 'The job sheet', schema: jobSheetResponseSchema }, ...conflictResponse },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.json({ sheet: await setStep(deps, actor, params.id, params.step, body.done, metaOf(req, res)) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/jobs/:id/radiators/:index/readings/:phase',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary:
      'Record a radiator\u2019s surface temperatures before or after the clean (index: its place in the survey, from 0)' +
      ONCE,
    request: { params: readingParams, body: radiatorReadingInputSchema },
    responses: { 200: { description: 'The job sheet', schema: jobSheetResponseSchema }, ...conflictResponse },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.json({
        sheet: await recordReading(deps, actor, params.id, params.index, params.phase, body, metaOf(req, res)),
      });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/jobs/:id/radiators/:index/agitation',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary:
      'Record a radiator\u2019s agitation time and the vibrating tool used (a kit item on the job\u2019s van)' + ONCE,
    request: { params: radiatorParams, body: agitationInputSchema },
    responses: { 200: { description: 'The job sheet', schema: jobSheetResponseSchema }, ...conflictResponse },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.json({ sheet: await recordAgitation(deps, actor, params.id, params.index, body, metaOf(req, res)) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/jobs/:id/radiators/:index/flushed',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'Tick a radiator flushed until clear (the first tick\u2019s time stands) or clear it' + ONCE,
    request: { params: radiatorParams, body: stepInputSchema },
    responses: { 200: { description: 'The job sheet', schema: jobSheetResponseSchema }, ...conflictResponse },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.json({ sheet: await setFlushed(deps, actor, params.id, params.index, body.done, metaOf(req, res)) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/jobs/:id/water-tests',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'Record the water tests (the whole set: a field left out is cleared)' + ONCE,
    request: { params: jobParams, body: waterTestsInputSchema },
    responses: { 200: { description: 'The job sheet', schema: jobSheetResponseSchema }, ...conflictResponse },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.json({ sheet: await recordWaterTests(deps, actor, params.id, body, metaOf(req, res)) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/jobs/:id/kit',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'Record the kit used, as a set chosen from the items on the job\u2019s van' + ONCE,
    request: { params: jobParams, body: jobKitInputSchema },
    responses: { 200: { description: 'The job sheet', schema: jobSheetResponseSchema }, ...conflictResponse },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.json({ sheet: await recordKit(deps, actor, params.id, body.kitItemIds, metaOf(req, res)) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/jobs/:id/notes',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'The engineer\u2019s notes on the visit' + ONCE,
    request: { params: jobParams, body: jobNotesInputSchema },
    responses: { 200: { description: 'The job sheet', schema: jobSheetResponseSchema }, ...conflictResponse },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      res.json({ sheet: await recordNotes(deps, actor, params.id, body, metaOf(req, res)) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/jobs/:id/photos',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary:
      'Add a photo to the job (multipart field "photo": JPEG, PNG or WebP, up to 8 MB; tag; optional caption).' + ONCE,
    request: { params: jobParams },
    multipart: { fileField: 'photo', fields: jobPhotoFieldsSchema },
    responses: {
      201: { description: 'Stored', schema: jobPhotoResponseSchema },
      413: { description: 'Too large' },
      ...conflictResponse,
      422: { description: 'Not a JPEG, PNG or WebP, or no tag; or X-Tapped-At not sane' },
    },
    before: (deps) => [readTappedAt(deps), receivePhoto],
    handle: async ({ params, req, res, deps, actor }) => {
      const fields = jobPhotoFieldsSchema.parse(req.body ?? {});
      if (!req.file)
        throw new HttpError(422, 'Attach a photo in the field "photo".', 'ValidationFailed', [
          { path: 'photo', message: 'Required' },
        ]);
      res
        .status(201)
        .json({ photo: await addJobPhoto(deps, actor, params.id, req.file.buffer, fields, metaOf(req, res)) });
    },
  }),
];
