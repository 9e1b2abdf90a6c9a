import {
  addDays,
  bookedJobPacks,
  bookedPacksByVan,
  DEFAULT_RESTOCK_DAYS,
  surveySchema,
  type BookedJob,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import { findHeatExchangerDefaults } from '../firms/firm-dal.ts';
import { findRestockDays, listBookedJobRows, listJobProductRules } from './booked-need-dal.ts';

type Db = Knex | Knex.Transaction;

export interface FirmBookedJobs {
  days: number;
  jobs: (BookedJob & { address: string; engineerMemberId: number | null })[];
  /** Packs per van and product, keyed by `vanProductKey`. */
  packs: Map<string, number>;
}

/**
 * The booked jobs of the firm's restock window (today and the next days) with the packs each one's
 * dose plan needs: the same plan as the job page. A survey that no longer reads is skipped.
 * `vanId` narrows it to one van's jobs (My van).
 */
export async function firmBookedJobs(
  db: Db,
  firmId: number,
  today: string,
  where: { vanId?: number } = {},
): Promise<FirmBookedJobs> {
  const days = (await findRestockDays(db, firmId)) ?? DEFAULT_RESTOCK_DAYS;
  const rows = await listBookedJobRows(db, firmId, today, addDays(today, days), where.vanId);
  const [rules, heatExchanger] = await Promise.all([
    listJobProductRules(
      db,
      firmId,
      rows.map((r) => r.id),
    ),
    rows.length ? findHeatExchangerDefaults(db, firmId) : Promise.resolve(null),
  ]);
  // Each job's products by its id: filtered from the whole list per job, the rules were read jobs x rules times.
  const rulesOf = new Map<number, typeof rules>();
  for (const rule of rules) {
    const list = rulesOf.get(rule.job_id);
    if (list) list.push(rule);
    else rulesOf.set(rule.job_id, [rule]);
  }
  const jobs: FirmBookedJobs['jobs'] = [];
  for (const r of rows) {
    const chosen = rulesOf.get(r.id) ?? [];
    const survey = surveySchema.safeParse(typeof r.survey === 'string' ? JSON.parse(r.survey) : r.survey);
    if (!survey.success) continue;
    const products = chosen.map((p) => ({
      productId: p.product_id,
      kind: p.kind,
      packSizeMl: p.pack_size_ml,
      doseLitresPer100L: p.dose_litres_per_100l === null ? null : Number(p.dose_litres_per_100l),
      radiatorsPerPack: p.radiators_per_pack,
    }));
    jobs.push({
      jobId: r.id,
      vanId: r.van_location_id,
      scheduledOn: r.scheduled_on,
      packs: bookedJobPacks(survey.data, r.visit_kind, products, heatExchanger),
      address: r.site_address,
      engineerMemberId: r.engineer_member_id,
    });
  }
  return { days, jobs, packs: bookedPacksByVan(jobs) };
}
