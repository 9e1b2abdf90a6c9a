import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '@/lib/api-client';

// The API answers the overview without a shared response schema, so the client pins down what it reads.
const dueState = z.enum(['ok', 'due_soon', 'overdue']);

const vanRowSchema = z.object({
  id: z.number(),
  name: z.string(),
  registration: z.string().nullable(),
  engineerName: z.string().nullable(),
  stock: z.object({ belowMinimum: z.number(), outOfStock: z.number(), usablePacks: z.number() }),
  motDueOn: z.string().nullable(),
  serviceDueOn: z.string().nullable(),
  nextDue: z.object({ what: z.enum(['MOT', 'service']), on: z.string(), daysLeft: z.number(), state: dueState }).nullable(),
});
export type OverviewVan = z.infer<typeof vanRowSchema>;

const dueItemSchema = z.object({
  id: z.number(),
  assetTag: z.string(),
  kindName: z.string(),
  locationName: z.string().nullable(),
  state: z.enum(['overdue', 'due_soon']),
  dueOn: z.string().nullable(),
  usesLeft: z.number().nullable(),
  reason: z.enum(['days', 'uses']).nullable(),
});
export type OverviewDueItem = z.infer<typeof dueItemSchema>;

const havEngineerSchema = z.object({
  memberId: z.number(),
  name: z.string(),
  points: z.number(),
  level: z.enum(['low', 'nearing_action', 'above_action', 'nearing_limit', 'above_limit']),
  message: z.string(),
});
export type HavEngineer = z.infer<typeof havEngineerSchema>;

export const overviewSchema = z.object({
  today: z.string(),
  timeZone: z.string(),
  vans: z.array(vanRowSchema),
  vansDue: z.number(),
  kit: z.object({ overdueCount: z.number(), dueSoonCount: z.number(), overdue: z.array(dueItemSchema), dueSoon: z.array(dueItemSchema) }),
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
  // A list of kinds rather than a record: z.record would add its code to the first download, where zod lives.
  usageByMonth: z.array(z.object({ month: z.string(), byKind: z.array(z.object({ kind: z.string(), litres: z.number() })), totalLitres: z.number() })),
  reminders: z.array(z.object({ id: z.number(), kind: z.string(), subjectType: z.string(), subjectId: z.number(), summary: z.string(), createdAt: z.string() })).nullable(),
  hav: z.object({ day: z.string(), engineers: z.array(havEngineerSchema) }).nullable(),
});
export type Overview = z.infer<typeof overviewSchema>;

export async function getOverview() {
  return (await apiClient.get('/api/overview', z.object({ overview: overviewSchema }))).overview;
}

export const overviewQueries = {
  all: () => ['overview'] as const,
  // Figures move with every job and stock change; a minute old is fresh enough for a glance.
  detail: () => queryOptions({ queryKey: overviewQueries.all(), queryFn: getOverview, staleTime: 60_000 }),
};
