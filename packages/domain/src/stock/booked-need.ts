import { addDays, type CalendarDate } from '../lib/calendar-date.ts';
import { dosePlan, type DoseRule } from '../jobs/dose-plan.ts';
import type { HeatExchangerDefaults } from '../jobs/heat-exchanger.ts';
import { surveyVolume, type Survey, type VisitKind } from '../jobs/job-schemas.ts';
import { visitDosesProduct } from '../jobs/visit-steps.ts';

/** How many days ahead the restock run looks at booked jobs, unless the firm sets its own. */
export const DEFAULT_RESTOCK_DAYS = 7;

export interface BookedJob {
  jobId: number;
  vanId: number;
  scheduledOn: CalendarDate;
  /** Packs of each product the job's dose plan takes off the van. */
  packs: { productId: number; packs: number }[];
}

/**
 * The packs a booked job's plan needs of each chosen product: the same dose plan as the job page
 * (the larger of the volume rule and the radiators rule), only for products its visit kind doses.
 */
export function bookedJobPacks(
  survey: Survey,
  visitKind: VisitKind,
  products: ({ productId: number; kind: string } & DoseRule)[],
  heatExchangerDefaults: HeatExchangerDefaults | null = null,
): { productId: number; packs: number }[] {
  const volume = surveyVolume(survey, heatExchangerDefaults).totalLitres;
  return products
    .filter((p) => visitDosesProduct(visitKind, p.kind))
    .map((p) => ({ productId: p.productId, packs: dosePlan(volume, survey.radiators.length, p).packs }))
    .filter((p) => p.packs > 0);
}

export const vanProductKey = (vanId: number, productId: number) => `${vanId}:${productId}`;

/** The jobs on the days [from, from + days): today's count, so do the next days - 1. */
export function jobsWithin<J extends { scheduledOn: CalendarDate }>(jobs: J[], from: CalendarDate, days: number): J[] {
  const end = addDays(from, days);
  return jobs.filter((j) => j.scheduledOn >= from && j.scheduledOn < end);
}

/** Packs each van's booked jobs need of each product, keyed by `vanProductKey`. */
export function bookedPacksByVan(jobs: BookedJob[]): Map<string, number> {
  const need = new Map<string, number>();
  for (const job of jobs)
    for (const p of job.packs) {
      const key = vanProductKey(job.vanId, p.productId);
      need.set(key, (need.get(key) ?? 0) + p.packs);
    }
  return need;
}

export interface BookedJobShortfall {
  jobId: number;
  vanId: number;
  scheduledOn: CalendarDate;
  short: { productId: number; packs: number; available: number; shortBy: number }[];
}

/**
 * The booked jobs whose van will not hold their packs: jobs take from the van in date order (then
 * by id), so a later job is short when earlier ones use up what is on board. `usable` is keyed by
 * `vanProductKey`: usable (in-date) packs on each van now.
 */
export function bookedJobShortfalls(jobs: BookedJob[], usable: Map<string, number>): BookedJobShortfall[] {
  const left = new Map(usable);
  const ordered = [...jobs].sort((a, b) => a.scheduledOn.localeCompare(b.scheduledOn) || a.jobId - b.jobId);
  const out: BookedJobShortfall[] = [];
  for (const job of ordered) {
    const short: BookedJobShortfall['short'] = [];
    for (const p of job.packs) {
      const key = vanProductKey(job.vanId, p.productId);
      const available = Math.max(0, left.get(key) ?? 0);
      if (available < p.packs)
        short.push({ productId: p.productId, packs: p.packs, available, shortBy: p.packs - available });
      left.set(key, available - Math.min(available, p.packs));
    }
    if (short.length) out.push({ jobId: job.jobId, vanId: job.vanId, scheduledOn: job.scheduledOn, short });
  }
  return out;
}
