import { z } from 'zod';

export const PHOTO_MAX_BYTES = 8 * 1024 * 1024;
export const photoContentTypes = ['image/jpeg', 'image/png', 'image/webp'] as const;

export const photoSchema = z.object({
  id: z.number(),
  url: z.string(),
  contentType: z.enum(photoContentTypes),
  byteSize: z.number(),
  caption: z.string().nullable(),
  createdAt: z.string(),
});
export type Photo = z.infer<typeof photoSchema>;
