import type { RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { idParamSchema, PHOTO_MAX_BYTES, photoSchema } from '@heatfleet/domain';
import { HttpError } from '../../lib/http-error.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { openPhoto, savePhoto } from './photo-service.ts';

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: PHOTO_MAX_BYTES, files: 1, fields: 5 } }).single('photo');

/** Multer, with its errors turned into the API's error body. */
const receivePhoto: RequestHandler = (req, res, next) => {
  upload(req, res, (err: unknown) => {
    if (!err) return next();
    const code = (err as { code?: string }).code;
    if (code === 'LIMIT_FILE_SIZE') {
      return next(new HttpError(413, `That photo is over ${PHOTO_MAX_BYTES / 1024 / 1024} MB; take a smaller one.`, 'TooLarge', [{ path: 'photo', message: 'Too large' }]));
    }
    next(new HttpError(422, 'Send the photo as multipart form data in a field called "photo".', 'ValidationFailed', [{ path: 'photo', message: String((err as Error).message) }]));
  });
};

export const photoFieldsSchema = z.strictObject({
  itemId: z.coerce.number().int().positive().optional(),
  caption: z.string().trim().max(200).optional(),
});

export const photoRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'post', path: '/photos', tag: 'Photos', access: 'member', tenantData: true,
    summary: 'Upload a photo (multipart field "photo": JPEG, PNG or WebP, up to 8 MB; optional itemId, caption)',
    request: {},
    multipart: { fileField: 'photo', fields: photoFieldsSchema },
    responses: { 201: { description: 'Stored', schema: z.object({ photo: photoSchema }) }, 413: { description: 'Too large' }, 422: { description: 'Not a JPEG, PNG or WebP' } },
    before: () => [receivePhoto],
    handle: async ({ req, res, deps, actor }) => {
      const fields = photoFieldsSchema.parse(req.body ?? {});
      if (!req.file) throw new HttpError(422, 'Attach a photo in the field "photo".', 'ValidationFailed', [{ path: 'photo', message: 'Required' }]);
      res.status(201).json({ photo: await savePhoto(deps, actor, req.file.buffer, fields) });
    },
  }),
  defineRoute({
    method: 'get', path: '/photos/:id/content', tag: 'Photos', access: 'member', tenantData: true,
    summary: 'The photo itself, for members of its firm only',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Image bytes' } },
    handle: async ({ params, res, deps, actor }) => {
      const { photo, body } = await openPhoto(deps, actor, params.id);
      res.setHeader('Content-Type', photo.contentType);
      res.setHeader('Content-Disposition', `inline; filename="photo-${photo.id}.${photo.contentType.split('/')[1]}"`);
      res.setHeader('X-Content-Type-Options', 'nosniff');
      res.setHeader('Cache-Control', 'private, max-age=3600');
      body.pipe(res);
    },
  }),
];
