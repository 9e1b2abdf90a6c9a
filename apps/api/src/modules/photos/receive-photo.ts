import type { RequestHandler } from 'express';
import multer from 'multer';
import { PHOTO_MAX_BYTES } from '@heatfleet/domain';
import { HttpError } from '../../lib/http-error.ts';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: PHOTO_MAX_BYTES, files: 1, fields: 5 },
}).single('photo');

/** Multer for one photo in the field "photo", with its errors turned into the API's error body. */
export const receivePhoto: RequestHandler = (req, res, next) => {
  upload(req, res, (err: unknown) => {
    if (!err) return next();
    if ((err as { code?: string }).code === 'LIMIT_FILE_SIZE') {
      return next(
        new HttpError(413, `That photo is over ${PHOTO_MAX_BYTES / 1024 / 1024} MB; take a smaller one.`, 'TooLarge', [
          { path: 'photo', message: 'Too large' },
        ]),
      );
    }
    next(
      new HttpError(422, 'Send the photo as multipart form data in a field called "photo".', 'ValidationFailed', [
        { path: 'photo', message: String((err as Error).message) },
      ]),
    );
  });
};
