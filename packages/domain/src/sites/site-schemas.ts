import { z } from 'zod';
import { jobStatusSchema } from '../jobs/job-responses.ts';

// The inhibitor check visit's input and outcome travel with the site schemas (the domain's index exports this file).
export * from './inhibitor-check-visit.ts';

// The success bodies of the customer and site routes: the API declares them, the client's queries parse with them.

export const customerSchema = z.object({
  id: z.number(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  contact: z.string().nullable(),
});
export type Customer = z.infer<typeof customerSchema>;
/** A site in a customer list or search answer: enough to book a job on it. */
export const customerSiteBriefSchema = z.object({
  id: z.number(),
  address: z.string(),
  postcode: z.string().nullable(),
});
/** Customers with their sites; a search (`?q=`) answers at most 10, best matches first. */
export const customerListResponseSchema = z.object({
  customers: z.array(customerSchema.extend({ sites: z.array(customerSiteBriefSchema) })),
});

export const customerSiteSchema = z.object({
  id: z.number(),
  address: z.string(),
  postcode: z.string().nullable(),
  accessNotes: z.string().nullable(),
  systemNotes: z.string().nullable(),
  nextCheckOn: z.string().nullable(),
});
export type CustomerSite = z.infer<typeof customerSiteSchema>;

export const customerDetailSchema = customerSchema.extend({ sites: z.array(customerSiteSchema) });
export type CustomerDetail = z.infer<typeof customerDetailSchema>;
/** A customer with their sites: the answer to reading one and to adding one. */
export const customerResponseSchema = z.object({ customer: customerDetailSchema });

/** A site just added: its id and what was sent (a field left out stays out). */
export const newSiteSchema = z.object({
  id: z.number(),
  address: z.string(),
  postcode: z.string().nullable().optional(),
  accessNotes: z.string().nullable().optional(),
  systemNotes: z.string().nullable().optional(),
});
export type NewSite = z.infer<typeof newSiteSchema>;
export const newSiteResponseSchema = z.object({ site: newSiteSchema });

export const siteListRowSchema = z.object({
  id: z.number(),
  address: z.string(),
  postcode: z.string().nullable(),
  nextCheckOn: z.string().nullable(),
  customer: z.object({ id: z.number(), name: z.string() }),
});
export type SiteListRow = z.infer<typeof siteListRowSchema>;
export const siteListResponseSchema = z.object({ sites: z.array(siteListRowSchema) });

/** An inhibitor check visit, with the target range copied onto it when it was recorded. */
export const siteCheckSchema = z.object({
  id: z.number(),
  checkedOn: z.string(),
  product: z.object({ id: z.number(), name: z.string() }),
  inhibitorReading: z.number(),
  target: z.object({ min: z.number(), max: z.number(), unit: z.string().nullable() }),
  systemTdsPpm: z.number().nullable(),
  /** The visit's result: the re-test's when there was one. */
  result: z.enum(['pass', 'fail']),
  /** The first reading's result, before any top-up. */
  firstResult: z.enum(['pass', 'fail']),
  retestReading: z.number().nullable(),
  /** Inhibitor added in the visit, taken off that van's stock. */
  topUp: z.object({ packs: z.number(), van: z.object({ id: z.number(), name: z.string() }) }).nullable(),
  /** The next check this visit set: a year on when it passed, sooner when it failed (null for older visits). */
  nextCheckOn: z.string().nullable(),
  /** Whether the customer was sent a note of the result. */
  noteEmailed: z.boolean(),
  notes: z.string().nullable(),
  byName: z.string(),
  createdAt: z.string(),
});
export type SiteCheck = z.infer<typeof siteCheckSchema>;

/** An active inhibitor with a target range: one a check can be recorded against. */
export const checkableInhibitorSchema = z.object({
  id: z.number(),
  name: z.string(),
  targetMin: z.number(),
  targetMax: z.number(),
  targetUnit: z.string().nullable(),
  testMethod: z.string().nullable(),
});
export type CheckableInhibitor = z.infer<typeof checkableInhibitorSchema>;

export const siteJobSchema = z.object({
  id: z.number(),
  status: jobStatusSchema,
  scheduledOn: z.string(),
  completedAt: z.string().nullable(),
  nextCheckOn: z.string().nullable(),
  engineerName: z.string().nullable(),
});

/** A site's history: its customer, its jobs newest first, its inhibitor checks and the next check date. */
export const siteDetailSchema = z.object({
  site: customerSiteSchema,
  customer: customerSchema,
  jobs: z.array(siteJobSchema),
  checks: z.array(siteCheckSchema),
  nextCheckOn: z.string().nullable(),
  inhibitors: z.array(checkableInhibitorSchema),
});
export type SiteDetail = z.infer<typeof siteDetailSchema>;

export const siteCheckResponseSchema = z.object({ check: siteCheckSchema, site: siteDetailSchema });
export type SiteCheckResponse = z.infer<typeof siteCheckResponseSchema>;
