import { z } from 'zod';
import type { HavLevel } from '../jobs/job-sheet.ts';
import { stockHealth } from '../stock/stock-health.ts';

// The owner's overview (GET /api/overview): the API declares this answer, the client parses with it.

/** How many of a van's products that need something the overview lists (the worst first). */
export const OVERVIEW_VAN_PRODUCTS_LISTED = 5;

export const overviewDueStates = ['ok', 'due_soon', 'overdue'] as const;

export const overviewVanSchema = z.object({
  id: z.number(),
  name: z.string(),
  registration: z.string().nullable(),
  engineerName: z.string().nullable(),
  /**
   * Stock health by the domain's one rule (`stockHealthOf`), product by product: the van's health is
   * its worst product's. Packs are never added across products (a pack of cleaner is not inhibitor).
   */
  stock: z.object({
    health: z.enum(stockHealth),
    belowMinimum: z.number(),
    outOfStock: z.number(),
    shortForJobs: z.number(),
    belowTarget: z.number(),
    /** How many of the van's products are not OK (empty, short for jobs, below minimum or below target). */
    productsNotOk: z.number(),
    /**
     * The first `OVERVIEW_VAN_PRODUCTS_LISTED` of them, worst first, then by name: what the van's card lists (the
     * van's page has them all). Every van's every product made the answer 2.3 MB for 200 vans (issue 16).
     */
    products: z.array(
      z.object({
        productId: z.number(),
        name: z.string(),
        packSizeMl: z.number(),
        usable: z.number(),
        target: z.number().nullable(),
        booked: z.number(),
        health: z.enum(stockHealth),
      }),
    ),
  }),
  motDueOn: z.string().nullable(),
  serviceDueOn: z.string().nullable(),
  nextDue: z
    .object({
      what: z.enum(['MOT', 'service']),
      on: z.string(),
      daysLeft: z.number(),
      state: z.enum(overviewDueStates),
    })
    .nullable(),
});
export type OverviewVan = z.infer<typeof overviewVanSchema>;

export const overviewDueItemSchema = z.object({
  id: z.number(),
  assetTag: z.string(),
  kindName: z.string(),
  locationName: z.string().nullable(),
  state: z.enum(['overdue', 'due_soon']),
  dueOn: z.string().nullable(),
  usesLeft: z.number().nullable(),
  reason: z.enum(['days', 'uses']).nullable(),
});
export type OverviewDueItem = z.infer<typeof overviewDueItemSchema>;

const havLevels = [
  'low',
  'nearing_action',
  'above_action',
  'nearing_limit',
  'above_limit',
] as const satisfies readonly HavLevel[];

export const havEngineerSchema = z.object({
  memberId: z.number(),
  name: z.string(),
  points: z.number(),
  level: z.enum(havLevels),
  message: z.string(),
});
export type HavEngineer = z.infer<typeof havEngineerSchema>;

export const overviewSchema = z.object({
  today: z.string(),
  timeZone: z.string(),
  vans: z.array(overviewVanSchema),
  vansDue: z.number(),
  kit: z.object({
    overdueCount: z.number(),
    dueSoonCount: z.number(),
    overdue: z.array(overviewDueItemSchema),
    dueSoon: z.array(overviewDueItemSchema),
  }),
  expiringBatches: z.object({
    withinDays: z.number(),
    count: z.number(),
    packs: z.number(),
    batches: z.array(
      z.object({
        batchId: z.number(),
        lotNumber: z.string(),
        expiresOn: z.string(),
        productName: z.string(),
        expired: z.boolean(),
        packs: z.number(),
        places: z.array(z.object({ name: z.string(), quantity: z.number() })),
      }),
    ),
  }),
  jobsThisMonth: z.object({ month: z.string(), planned: z.number(), completed: z.number() }),
  // A list of kinds rather than a record: z.record would add its code to the client's first download, where zod lives.
  usageByMonth: z.array(
    z.object({
      month: z.string(),
      byKind: z.array(z.object({ kind: z.string(), litres: z.number() })),
      totalLitres: z.number(),
    }),
  ),
  reminders: z
    .array(
      z.object({
        id: z.number(),
        kind: z.string(),
        subjectType: z.string(),
        subjectId: z.number(),
        summary: z.string(),
        createdAt: z.string(),
      }),
    )
    .nullable(),
  hav: z.object({ day: z.string(), engineers: z.array(havEngineerSchema) }).nullable(),
});
export type Overview = z.infer<typeof overviewSchema>;

export const overviewResponseSchema = z.object({ overview: overviewSchema });
