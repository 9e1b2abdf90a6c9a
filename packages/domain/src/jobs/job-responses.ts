import { z } from 'zod';
import { havLevels } from './hav-day.ts';
import { panelTypes, surveySchema } from './job-schemas.ts';
import { jobSteps } from './job-sheet.ts';
import {
  completionIssueSchema,
  completionReasonSchema,
  flushOrderSchema,
  jobCancellationSchema,
  jobSignatureSchema,
  systemDetailsAnswerSchema,
  visitCautionSchema,
  visitKindSchema,
} from './visit-responses.ts';

// The success bodies of the job routes: the API declares them, the client's queries parse with them.

export const jobStatuses = ['planned', 'completed', 'cancelled'] as const;
export const jobStatusSchema = z.enum(jobStatuses);
export type JobStatus = z.infer<typeof jobStatusSchema>;

export const jobListRowSchema = z.object({
  id: z.number(),
  status: jobStatusSchema,
  scheduledOn: z.string(),
  scheduledTime: z.string().nullable(),
  address: z.string(),
  customerName: z.string(),
  nextCheckOn: z.string().nullable(),
  postcode: z.string().nullable(),
  engineerMemberId: z.number().nullable(),
  engineerName: z.string().nullable(),
  visitKind: visitKindSchema,
  systemType: z.enum(['open_vented', 'sealed']),
  radiatorCount: z.number(),
});
export type JobListRow = z.infer<typeof jobListRowSchema>;
export const jobListResponseSchema = z.object({ jobs: z.array(jobListRowSchema) });

/** The system volume part by part (see `surveyVolume`). */
export const volumeBreakdownSchema = z.object({
  radiatorsLitres: z.number(),
  pipeworkLitres: z.number(),
  heatExchangerLitres: z.number(),
  cylinderCoilLitres: z.number(),
  otherLitres: z.number(),
  totalLitres: z.number(),
  estimate: z.boolean(),
  label: z.enum(['Calculated from the survey', 'Estimated']),
  heatExchangerFrom: z.enum(['survey', 'default']),
  howReached: z.string(),
});

export const batchAllocationSchema = z.object({
  batchId: z.number(),
  lotNumber: z.string(),
  expiresOn: z.string(),
  quantity: z.number(),
});

/** One product's dose (see `dosePlan`) with the van's batches to take it from, first expiry first. */
export const jobDoseSchema = z.object({
  product: z.object({ id: z.number(), name: z.string(), kind: z.string(), packSizeMl: z.number() }),
  litres: z.number().nullable(),
  packsByVolume: z.number().nullable(),
  packsByRadiators: z.number().nullable(),
  packs: z.number(),
  decidedBy: z.enum(['volume', 'radiators', 'none']),
  takeFromVan: z.array(batchAllocationSchema),
  shortfall: z.number(),
});
export type JobDose = z.infer<typeof jobDoseSchema>;

/** A saved radiator reading with its figures (see `readingFigures`). */
export const savedReadingSchema = z.object({
  topC: z.number(),
  bottomC: z.number(),
  flowC: z.number().nullable(),
  returnC: z.number().nullable(),
  roomC: z.number().nullable(),
  differenceK: z.number(),
  coldBottom: z.boolean(),
  deltaTK: z.number(),
  deltaTFrom: z.enum(['flow_return', 'surfaces']),
  roomUsedC: z.number(),
  outputWatts: z.number().nullable(),
});
export type SavedReading = z.infer<typeof savedReadingSchema>;

export const sheetKitItemSchema = z.object({
  id: z.number(),
  assetTag: z.string(),
  kindName: z.string(),
  kitName: z.string().nullable(),
});

export const jobPhotoSchema = z.object({
  id: z.number(),
  url: z.string(),
  tag: z.string().nullable(),
  caption: z.string().nullable(),
  contentType: z.string(),
  createdAt: z.string(),
});
export type JobPhoto = z.infer<typeof jobPhotoSchema>;

export const sheetRadiatorSchema = z.object({
  index: z.number(),
  room: z.string(),
  panel: z.enum(panelTypes),
  ratedWatts: z.number().nullable(),
  before: savedReadingSchema.nullable(),
  after: savedReadingSchema.nullable(),
  flushedAt: z.string().nullable(),
  agitation: z
    .object({
      minutes: z.number(),
      kitItemId: z.number().nullable(),
      kitItemTag: z.string().nullable(),
      magnitudeMs2: z.number().nullable(),
      points: z.number(),
    })
    .nullable(),
});
export type SheetRadiator = z.infer<typeof sheetRadiatorSchema>;

/** The on-site record of a visit (see job-sheet.ts): what was ticked, read, tested and used, with its figures. */
export const jobSheetSchema = z.object({
  editable: z.boolean(),
  visitKind: visitKindSchema,
  /** The steps of this visit (see `visitSteps`), each with the cautions that belong beside it. */
  steps: z.array(
    z.object({
      step: z.enum(jobSteps),
      label: z.string(),
      cautions: z.array(visitCautionSchema),
      doneAt: z.string().nullable(),
      doneByName: z.string().nullable(),
    }),
  ),
  /** The visit's cautions in one list, only those that fit the system, fuel and visit (see `visitCautions`). */
  cautions: z.array(visitCautionSchema),
  flushOrder: flushOrderSchema,
  signatures: z.array(jobSignatureSchema),
  /** What completing now would ask a reason for (see `completionChecks`). */
  completionIssues: z.array(completionIssueSchema),
  circulation: z.object({
    minimumMinutes: z.number().nullable(),
    startedAt: z.string().nullable(),
    elapsedMinutes: z.number().nullable(),
    met: z.boolean().nullable(),
  }),
  coldBottomThresholdK: z.number(),
  radiators: z.array(sheetRadiatorSchema),
  hav: z.object({
    engineerName: z.string().nullable(),
    day: z.string(),
    points: z.number(),
    level: z.enum(havLevels),
    message: z.string(),
  }),
  water: z.object({
    mainsTdsPpm: z.number().nullable(),
    systemTdsPpm: z.number().nullable(),
    waterClear: z.boolean().nullable(),
    inhibitorReading: z.number().nullable(),
    inhibitorProductId: z.number().nullable(),
    ph: z.number().nullable(),
    figures: z.object({
      flush: z.object({ complete: z.boolean(), withinPercent: z.number() }).nullable(),
      inhibitor: z
        .object({
          result: z.enum(['pass', 'low', 'high']),
          min: z.number(),
          max: z.number(),
          unit: z.string().nullable(),
        })
        .nullable(),
    }),
  }),
  kitUsed: z.array(sheetKitItemSchema),
  kitOnVan: z.array(sheetKitItemSchema.extend({ vibrationMs2: z.number().nullable() })),
  photos: z.array(jobPhotoSchema),
  notes: z.string(),
  /** Raised by each change of the notes: a write names the version it was made on (409 when stale). */
  notesVersion: z.number(),
});
export type JobSheet = z.infer<typeof jobSheetSchema>;
export type SheetKitItem = JobSheet['kitOnVan'][number];

/** Every job sheet write answers with the whole sheet. */
export const jobSheetResponseSchema = z.object({ sheet: jobSheetSchema });
export const jobPhotoResponseSchema = z.object({ photo: jobPhotoSchema });

export const jobSiteSchema = z.object({
  id: z.number(),
  address: z.string(),
  postcode: z.string().nullable(),
  customerId: z.number(),
  customerName: z.string(),
});

/** A job with its plan (volume, doses, batches from the van), the chemicals used and the sheet; also the answer to booking and completing. */
export const jobDetailSchema = z.object({
  job: z.object({
    id: z.number(),
    status: jobStatusSchema,
    scheduledOn: z.string(),
    scheduledTime: z.string().nullable(),
    engineerMemberId: z.number().nullable(),
    vanLocationId: z.number().nullable(),
    completedAt: z.string().nullable(),
    nextCheckOn: z.string().nullable(),
    site: jobSiteSchema,
    visitKind: visitKindSchema,
    engineerName: z.string().nullable(),
    systemDetails: systemDetailsAnswerSchema,
    /** Given at completion (see `formatReportNumber`); null until then. */
    reportNumber: z.string().nullable(),
    cancellation: jobCancellationSchema.nullable(),
    /** The reasons given at completion for anything not done. */
    completionReasons: z.array(completionReasonSchema),
    /** What the engineer recommends to the customer, given at completion. */
    recommendation: z.string().nullable(),
    /** Raised by each change of the survey: an edit names the version it was made on (409 when stale). */
    surveyVersion: z.number(),
  }),
  survey: surveySchema,
  volume: volumeBreakdownSchema,
  doses: z.array(jobDoseSchema),
  /** The firm's calendar day the plan was made for (batches past their expiry day are not taken). */
  today: z.string(),
  chemicalsUsed: z.array(
    z.object({ product: z.string(), lotNumber: z.string(), expiresOn: z.string(), packs: z.number() }),
  ),
  sheet: jobSheetSchema,
});
export type JobDetail = z.infer<typeof jobDetailSchema>;
