import { z } from 'zod';

/** The one error body every API answer uses; the web client parses it too. */
export const apiErrorBodySchema = z.object({
  statusCode: z.number().int(),
  error: z.string(),
  message: z.string(),
  details: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
  requestId: z.string(),
});
export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;
export type ApiErrorDetail = NonNullable<ApiErrorBody['details']>[number];

export const apiErrorNames = {
  400: 'RuleBroken',
  401: 'SignedOut',
  403: 'NotAllowed',
  404: 'NotFound',
  409: 'Conflict',
  413: 'TooLarge',
  415: 'UnsupportedMediaType',
  422: 'ValidationFailed',
  429: 'TooManyRequests',
  500: 'InternalError',
  503: 'ServiceUnavailable',
} as const;
