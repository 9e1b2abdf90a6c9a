import { z } from 'zod';
import { idParamSchema, photoResponseSchema } from '@heatfleet/domain';
import { HttpError } from '../../lib/http-error.ts';
import { idempotencyKeyOf } from '../../lib/idempotency.ts';
import { readTappedAt, tappedAtOf } from '../../middleware/tapped-at.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { openPhoto, savePhoto } from './photo-service.ts';
import { receivePhoto } from './receive-photo.ts';

export const photoFieldsSchema = z.strictObject({
  itemId: z.coerce.number().int().positive().optional(),
  caption: z.string().trim().max(200).optional(),
});

export const photoRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'post',
    path: '/photos',
    tag: 'Photos',
    access: 'member',
    tenantData: true,
    summary:
      'Upload a photo (multipart field "photo": JPEG, PNG or WebP, up to 8 MB; optional itemId, caption). Send an Idempotency-Key header: a retry with the same key answers the first photo. X-Tapped-At (ISO 8601) records when it was taken.',
    request: {},
    multipart: { fileField: 'photo', fields: photoFieldsSchema },
    responses: {
      201: { description: 'Stored', schema: photoResponseSchema },
      413: { description: 'Too large' },
      422: { description: 'Not a JPEG, PNG or WebP, or X-Tapped-At in the future or older than 7 days' },
    },
    before: (deps) => [readTappedAt(deps), receivePhoto],
    handle: async ({ req, res, deps, actor }) => {
      const fields = photoFieldsSchema.parse(req.body ?? {});
      if (!req.file)
        throw new HttpError(422, 'Attach a photo in the field "photo".', 'ValidationFailed', [
          { path: 'photo', message: 'Required' },
        ]);
      const photo = await savePhoto(deps, actor, req.file.buffer, {
        ...fields,
        idempotencyKey: idempotencyKeyOf(req),
        tappedAt: tappedAtOf(res),
      });
      res.status(201).json({ photo });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/photos/:id/content',
    tag: 'Photos',
    access: 'member',
    tenantData: true,
    summary: 'The photo itself, for members of its firm only',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Image bytes' } },
    handle: async ({ params, res, deps, actor }) => {
      const { photo, body } = await openPhoto(deps, actor, params.id);
      res.setHeader('Content-Type', photo.contentType);
      res.setHeader('Content-Disposition', `inline; filename="photo-${photo.id}.${photo.contentType.split('/')[1]}"`);
      res.setHeader('X-Content-Type-Options', 'nosniff');
      // no-store like every other signed-in answer: a shared browser keeps nothing after sign-out.
      res.setHeader('Cache-Control', 'no-store');
      body.pipe(res);
    },
  }),
];
