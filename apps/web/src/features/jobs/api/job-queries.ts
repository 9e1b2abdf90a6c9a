import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { jobSteps, surveySchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';

// The API answers jobs without a shared response schema, so the client pins down the fields it reads.
// Counts that come from SQL arithmetic may arrive as strings, hence the coercion.
const count = z.coerce.number();

const jobStatusSchema = z.enum(['planned', 'completed']);
export type JobStatus = z.infer<typeof jobStatusSchema>;

const jobListRowSchema = z.object({
  id: z.number(),
  status: jobStatusSchema,
  scheduledOn: z.string(),
  address: z.string(),
  customerName: z.string(),
  nextCheckOn: z.string().nullable(),
});
export type JobListRow = z.infer<typeof jobListRowSchema>;

const volumeSchema = z.object({
  radiatorsLitres: z.number(),
  pipeworkLitres: z.number(),
  heatExchangerLitres: z.number(),
  cylinderCoilLitres: z.number(),
  otherLitres: z.number(),
  totalLitres: z.number(),
  estimate: z.boolean(),
  howReached: z.string(),
});

const allocationSchema = z.object({ batchId: z.number(), lotNumber: z.string(), expiresOn: z.string(), quantity: count });

const doseSchema = z.object({
  product: z.object({ id: z.number(), name: z.string(), kind: z.string(), packSizeMl: z.number() }),
  litres: z.number().nullable(),
  packsByVolume: z.number().nullable(),
  packsByRadiators: z.number().nullable(),
  packs: z.number(),
  decidedBy: z.enum(['volume', 'radiators', 'none']),
  takeFromVan: z.array(allocationSchema),
  shortfall: count,
});
export type JobDose = z.infer<typeof doseSchema>;

const readingSchema = z.object({
  topC: z.number(),
  bottomC: z.number(),
  flowC: z.number().nullable().optional(),
  returnC: z.number().nullable().optional(),
  roomC: z.number().nullable().optional(),
  roomUsedC: z.number(),
  differenceK: z.number(),
  coldBottom: z.boolean(),
  deltaTK: z.number(),
  deltaTFrom: z.enum(['flow_return', 'surfaces']),
  outputWatts: z.number().nullable(),
});
export type SavedReading = z.infer<typeof readingSchema>;

const kitItemSchema = z.object({ id: z.number(), assetTag: z.string(), kindName: z.string(), kitName: z.string().nullable() });

export const jobPhotoSchema = z.object({ id: z.number(), url: z.string(), tag: z.string(), caption: z.string().nullable(), createdAt: z.string() });
export type JobPhoto = z.infer<typeof jobPhotoSchema>;

/** The on-site record (see the job sheet contract): what was ticked, read, tested and used. */
export const jobSheetSchema = z.object({
  editable: z.boolean(),
  steps: z.array(z.object({ step: z.enum(jobSteps), label: z.string(), doneAt: z.string().nullable(), doneByName: z.string().nullable() })),
  circulation: z.object({
    minimumMinutes: z.number().nullable(),
    startedAt: z.string().nullable(),
    elapsedMinutes: z.number().nullable(),
    met: z.boolean().nullable(),
  }),
  coldBottomThresholdK: z.coerce.number(),
  radiators: z.array(
    z.object({
      index: z.number(),
      room: z.string(),
      panel: z.string(),
      ratedWatts: z.number().nullable(),
      before: readingSchema.nullable(),
      after: readingSchema.nullable(),
      flushedAt: z.string().nullable(),
      agitation: z
        .object({
          minutes: z.number(),
          kitItemId: z.number().nullable(),
          kitItemTag: z.string().nullable(),
          magnitudeMs2: z.coerce.number().nullable(),
          points: z.number(),
        })
        .nullable(),
    }),
  ),
  hav: z.object({
    engineerName: z.string().nullable(),
    day: z.string(),
    points: z.number(),
    level: z.enum(['low', 'nearing_action', 'above_action', 'nearing_limit', 'above_limit']),
    message: z.string(),
  }),
  water: z.object({
    mainsTdsPpm: z.coerce.number().nullable(),
    systemTdsPpm: z.coerce.number().nullable(),
    waterClear: z.boolean().nullable(),
    inhibitorReading: z.coerce.number().nullable(),
    inhibitorProductId: z.number().nullable(),
    ph: z.coerce.number().nullable(),
    figures: z.object({
      flush: z.object({ complete: z.boolean(), withinPercent: z.number() }).nullable(),
      inhibitor: z.object({ result: z.enum(['pass', 'low', 'high']), min: z.number(), max: z.number(), unit: z.string().nullable() }).nullable(),
    }),
  }),
  kitUsed: z.array(kitItemSchema),
  kitOnVan: z.array(kitItemSchema.extend({ vibrationMs2: z.coerce.number().nullable() })),
  photos: z.array(jobPhotoSchema),
  notes: z.string(),
});
export type JobSheet = z.infer<typeof jobSheetSchema>;
export type SheetRadiator = JobSheet['radiators'][number];
export type SheetKitItem = JobSheet['kitOnVan'][number];

export const jobDetailSchema = z.object({
  job: z.object({
    id: z.number(),
    status: jobStatusSchema,
    scheduledOn: z.string(),
    engineerMemberId: z.number().nullable(),
    vanLocationId: z.number().nullable(),
    completedAt: z.string().nullable(),
    nextCheckOn: z.string().nullable(),
    site: z.object({ id: z.number(), address: z.string(), postcode: z.string().nullable(), customerId: z.number(), customerName: z.string() }),
  }),
  survey: surveySchema,
  volume: volumeSchema,
  doses: z.array(doseSchema),
  chemicalsUsed: z.array(z.object({ product: z.string(), lotNumber: z.string(), expiresOn: z.string(), packs: count })),
  sheet: jobSheetSchema,
});
export type JobDetail = z.infer<typeof jobDetailSchema>;

const customerSchema = z.object({
  id: z.number(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  contact: z.string().nullable(),
});
export type Customer = z.infer<typeof customerSchema>;

const siteSchema = z.object({
  id: z.number(),
  address: z.string(),
  postcode: z.string().nullable().optional(),
  nextCheckOn: z.string().nullable().optional(),
});
export type Site = z.infer<typeof siteSchema>;

export const customerEnvelopeSchema = z.object({ customer: customerSchema });
export const siteEnvelopeSchema = z.object({ site: siteSchema });
const customerDetailSchema = z.object({ customer: customerSchema.extend({ sites: z.array(siteSchema) }) });

export async function listJobs() {
  return (await apiClient.get('/api/jobs', z.object({ jobs: z.array(jobListRowSchema) }))).jobs;
}

export function getJob(id: number) {
  return apiClient.get(`/api/jobs/${id}`, jobDetailSchema);
}

export async function listCustomers() {
  return (await apiClient.get('/api/customers', z.object({ customers: z.array(customerSchema) }))).customers;
}

export async function getCustomer(id: number) {
  return (await apiClient.get(`/api/customers/${id}`, customerDetailSchema)).customer;
}

export const jobQueries = {
  all: () => queryRoots.jobs,
  lists: () => [...jobQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: jobQueries.lists(), queryFn: listJobs }),
  details: () => [...jobQueries.all(), 'detail'] as const,
  detail: (id: number) => queryOptions({ queryKey: [...jobQueries.details(), id] as const, queryFn: () => getJob(id) }),
};

export const customerQueries = {
  all: () => ['customers'] as const,
  lists: () => [...customerQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: customerQueries.lists(), queryFn: listCustomers }),
  detail: (id: number) => queryOptions({ queryKey: [...customerQueries.all(), 'detail', id] as const, queryFn: () => getCustomer(id) }),
};
