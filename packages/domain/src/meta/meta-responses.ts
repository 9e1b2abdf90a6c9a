import { z } from 'zod';

// The success bodies of the routes about the API itself.

// The balancer takes a replica out on anything but 200, so a replica that reaches the database answers 200 and
// says whether it reaches Redis too: without Redis most routes still work (e-mails wait for the sweep).
export const healthResponseSchema = z.object({
  status: z.literal('ok'),
  database: z.literal('reachable'),
  redis: z.enum(['reachable', 'unreachable']),
});
export type HealthResponse = z.infer<typeof healthResponseSchema>;

/** The OpenAPI 3.1 document, checked only at its top level (the rest is the generator's). */
export const openApiDocumentSchema = z.looseObject({
  openapi: z.string(),
  info: z.looseObject({ title: z.string(), version: z.string() }),
  paths: z.record(z.string(), z.unknown()),
});
