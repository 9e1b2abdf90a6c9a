import { z } from 'zod';
import { calendarDateSchema, calendarDateWithin, dateRanges } from '../lib/calendar-date.ts';
import { optionalPlainText, plainText, singleLineName } from '../lib/text.ts';
import { surveySchema, systemDetailsSchema, timeOfDaySchema, visitKinds } from './job-schemas.ts';

// The inputs of the visit (issue 12): editing, rescheduling and cancelling a booked job, the jobs
// list's filters, the customer type-ahead, the flush order, signatures and the guarded completion.

const memberId = z.number().int().positive();

/** Edit a booked job: any field sent is changed, one left out stays as it is. */
export const updateJobInputSchema = z
  .strictObject({
    scheduledOn: calendarDateWithin('The visit date', dateRanges.planned).optional(),
    scheduledTime: timeOfDaySchema.nullable().optional(),
    engineerMemberId: memberId.nullable().optional(),
    survey: surveySchema.optional(),
    /** The surveyVersion the survey was edited from: another change since then is a 409, not overwritten. */
    surveyVersion: z.number().int().min(0).optional(),
    productIds: z.array(z.number().int().positive()).max(6).optional(),
    visitKind: z
      .enum(visitKinds, { error: () => ({ message: 'The visit must be a full clean or inhibitor only.' }) })
      .optional(),
    systemDetails: systemDetailsSchema.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { error: 'Send at least one thing to change.' });
export type UpdateJobInput = z.infer<typeof updateJobInputSchema>;

export const cancelJobInputSchema = z.strictObject({
  reason: plainText('The reason', 500).pipe(
    z.string().min(3, { error: 'Say why the job is cancelled (a few words).' }),
  ),
});
export type CancelJobInput = z.infer<typeof cancelJobInputSchema>;

export const jobListStatuses = ['planned', 'completed', 'cancelled'] as const;
/** The jobs list's filters (query string); `upcoming` sorts the soonest planned visit first, then the rest newest first. */
export const jobListQuerySchema = z.strictObject({
  status: z
    .enum(jobListStatuses, { error: () => ({ message: 'Status must be planned, completed or cancelled.' }) })
    .optional(),
  engineerMemberId: z.coerce.number({ error: 'The engineer must be a member id.' }).int().positive().optional(),
  from: calendarDateSchema.optional(),
  to: calendarDateSchema.optional(),
  sort: z.enum(['newest', 'upcoming']).optional(),
});
export type JobListQuery = z.infer<typeof jobListQuerySchema>;

/** The type-ahead: a few letters of the name, the postcode or the address; at most 10 answers. */
export const CUSTOMER_SEARCH_LIMIT = 10;
export const customerListQuerySchema = z.strictObject({
  q: z
    .string()
    .trim()
    .min(1, { error: 'Type a letter or more to search.' })
    .max(80, { error: 'Search with at most 80 characters.' })
    .optional(),
});
export type CustomerListQuery = z.infer<typeof customerListQuerySchema>;

/** The order the radiators are flushed in: every radiator of the job's survey once, by its index, the first flushed first. */
export const flushOrderInputSchema = z.strictObject({
  radiatorIndexes: z.array(z.number().int().min(0).max(999)).max(80),
});
export type FlushOrderInput = z.infer<typeof flushOrderInputSchema>;

export const signatureKinds = ['acknowledgement', 'acceptance'] as const;
export type SignatureKind = (typeof signatureKinds)[number];
export const signatureKindLabels: Record<SignatureKind, string> = {
  acknowledgement: 'Before the work: cleaning can reveal weak radiators, valves or joints',
  acceptance: 'After the work: the work is accepted',
};
/** A drawn signature, stored as a PNG: small enough to send in one request body (the API takes 100 kB of JSON). */
export const SIGNATURE_MAX_BYTES = 64 * 1024;
const PNG_DATA_URL = /^data:image\/png;base64,[A-Za-z0-9+/]+={0,2}$/;
export const signatureInputSchema = z.strictObject({
  kind: z.enum(signatureKinds, {
    error: () => ({ message: 'The signature must be an acknowledgement or an acceptance.' }),
  }),
  name: singleLineName('The name of the person signing', { max: 120 }),
  imagePngDataUrl: z
    .string({ error: 'Draw the signature.' })
    .max(Math.ceil(SIGNATURE_MAX_BYTES / 3) * 4 + 22, { error: 'The signature image must be at most 64 kB.' })
    .regex(PNG_DATA_URL, { error: 'The signature must be a PNG image (a data URL starting data:image/png;base64,).' }),
});
export type SignatureInput = z.infer<typeof signatureInputSchema>;

/** What completing a job asks a reason for when it is missing (see `completionChecks`). */
export const completionCodes = [
  'circulation_short',
  'no_water_test',
  'after_readings_missing',
  'flush_ticks_missing',
  'unsaved_input',
] as const;
export type CompletionCode = (typeof completionCodes)[number];
export const completionCodeLabels: Record<CompletionCode, string> = {
  circulation_short: 'Hot circulation shorter than the cleaner\u2019s minimum',
  no_water_test: 'Water test not done',
  after_readings_missing: 'Radiators without after readings',
  flush_ticks_missing: 'Radiators not ticked as flushed',
  unsaved_input: 'Input on the page not saved',
};

export const completeJobInputSchema = z.strictObject({
  /** A reason for each thing not done; the answer 422 lists what needs one. */
  confirmations: z
    .array(
      z.strictObject({
        code: z.enum(completionCodes, {
          error: () => ({ message: `The code must be one of: ${completionCodes.join(', ')}.` }),
        }),
        reason: plainText('The reason', 500).pipe(z.string().min(3, { error: 'Give a reason (a few words).' })),
      }),
    )
    .max(completionCodes.length)
    .optional(),
  /** The page held input it had not saved when Complete was tapped. */
  unsavedInput: z.boolean().optional(),
  /** What the engineer recommends to the customer; printed in the customer's report's result box. */
  recommendation: optionalPlainText('The recommendation', 500),
});
export type CompleteJobInput = z.infer<typeof completeJobInputSchema>;
