import { z } from 'zod';

// The success bodies of the routes about the API itself.

export const healthResponseSchema = z.object({ status: z.literal('ok') });
export type HealthResponse = z.infer<typeof healthResponseSchema>;

/** The OpenAPI 3.1 document, checked only at its top level (the rest is the generator's). */
export const openApiDocumentSchema = z.looseObject({
  openapi: z.string(),
  info: z.looseObject({ title: z.string(), version: z.string() }),
  paths: z.record(z.string(), z.unknown()),
});
