import { z } from 'zod';
import { cisternConditions, visitKinds } from './job-schemas.ts';
import { completionCodes, signatureKinds } from './visit-schemas.ts';
import { visitCautionKeys } from './visit-steps.ts';

// The answers' parts added for the visit (issue 12); job-responses.ts puts them into the job and its sheet.

export const visitKindSchema = z.enum(visitKinds);

/** The system as the report describes it; null where nobody has said yet. */
export const systemDetailsAnswerSchema = z.object({
  boilerMake: z.string().nullable(),
  boilerModel: z.string().nullable(),
  boilerLocation: z.string().nullable(),
  magneticFilterFitted: z.boolean().nullable(),
  cisternCondition: z.enum(cisternConditions).nullable(),
});
export type SystemDetailsAnswer = z.infer<typeof systemDetailsAnswerSchema>;

export const visitCautionSchema = z.object({ key: z.enum(visitCautionKeys), text: z.string() });

/** A drawn signature: the PNG is served at `url` to members of the firm. */
export const jobSignatureSchema = z.object({
  kind: z.enum(signatureKinds),
  name: z.string(),
  signedAt: z.string(),
  url: z.string(),
});
export type JobSignature = z.infer<typeof jobSignatureSchema>;
export const jobSignatureResponseSchema = z.object({ signature: jobSignatureSchema });

/** Something not done at completion, what was found, and the reason the engineer gave (printed on the report). */
export const completionReasonSchema = z.object({
  code: z.enum(completionCodes),
  label: z.string(),
  found: z.string(),
  reason: z.string(),
});
export type CompletionReason = z.infer<typeof completionReasonSchema>;

/** What completing now would ask a reason for (the sheet shows it before Complete is tapped). */
export const completionIssueSchema = z.object({ code: z.enum(completionCodes), found: z.string() });

/**
 * The order the radiators are flushed in, as survey indexes, every radiator once: kept on the site
 * once the engineer sets it ('site'), else the survey's order ('survey').
 */
export const flushOrderSchema = z.object({
  radiatorIndexes: z.array(z.number()),
  from: z.enum(['site', 'survey']),
});

export const jobCancellationSchema = z.object({
  at: z.string(),
  byName: z.string().nullable(),
  reason: z.string(),
});

/** Report numbers run per firm from 1, printed as HF-000123. */
export function formatReportNumber(n: number): string {
  return `HF-${String(n).padStart(6, '0')}`;
}
