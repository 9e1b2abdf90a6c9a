import type { Knex } from 'knex';
import {
  bookedJobPacks,
  DEFAULT_RESTOCK_DAYS,
  heatExchangerDefaultsSchema,
  simulateRestock,
  surveySchema,
  vanProductKey,
  type BookedJob,
  type HeatExchangerDefaults,
  type ParLevel,
  type RestockSimulationInput,
} from '@heatfleet/domain';

// The demo firm's year of jobs (seeded by apps/api/src/db/seed-demo-jobs.ts) replayed with the
// domain's simulateRestock: the weekly restock run (Mondays) with par levels alone, then with the
// booked jobs of the firm's restock days counted; the depot reorders by the reorder list, the
// delivery arriving two days later. Every job is taken as booked by the Monday before it.

export const DEMO_FIRM_NAME = 'Brackenford Heating Co.';
const MONDAY = 1;
const DELIVERY_LEAD_DAYS = 2;

type Year = Omit<RestockSimulationInput, 'policy'>;

/** Reads the firm's completed jobs (with their dose plans), vans and par levels. */
export async function loadDemoYear(db: Knex, firmName = DEMO_FIRM_NAME): Promise<Year | null> {
  const firm = (await db('firms').where({ name: firmName }).first('id', 'restock_days', 'heat_exchanger_defaults')) as
    { id: number; restock_days: number | null; heat_exchanger_defaults: unknown } | undefined;
  if (!firm) return null;
  const firmId = firm.id;
  const places = (await db('locations').where({ firm_id: firmId }).orderBy('id').select('id', 'kind')) as {
    id: number;
    kind: 'van' | 'depot';
  }[];
  const depotId = places.find((p) => p.kind === 'depot')?.id;
  const vanIds = places.filter((p) => p.kind === 'van').map((p) => p.id);
  const pars = (await db('par_levels')
    .where({ firm_id: firmId })
    .select('location_id', 'product_id', 'minimum', 'target')) as {
    location_id: number;
    product_id: number;
    minimum: number;
    target: number;
  }[];
  const rows = (await db('jobs')
    .where({ firm_id: firmId, status: 'completed' })
    .whereNotNull('van_location_id')
    .orderBy([{ column: 'scheduled_on' }, { column: 'id' }])
    .select('id', 'van_location_id', 'scheduled_on', 'visit_kind', 'survey')) as {
    id: number;
    van_location_id: number;
    scheduled_on: string;
    visit_kind: 'full_clean' | 'inhibitor_only';
    survey: unknown;
  }[];
  const rules = (await db('job_products as jp')
    .join('products as p', (on) => on.on('p.id', '=', 'jp.product_id').andOn('p.firm_id', '=', 'jp.firm_id'))
    .where('jp.firm_id', firmId)
    .select('jp.job_id', 'p.id', 'p.kind', 'p.pack_size_ml', 'p.dose_litres_per_100l', 'p.radiators_per_pack')) as {
    job_id: number;
    id: number;
    kind: string;
    pack_size_ml: number;
    dose_litres_per_100l: string | null;
    radiators_per_pack: number | null;
  }[];
  const rawDefaults =
    typeof firm.heat_exchanger_defaults === 'string'
      ? (JSON.parse(firm.heat_exchanger_defaults) as unknown)
      : firm.heat_exchanger_defaults;
  const own = heatExchangerDefaultsSchema.safeParse(rawDefaults);
  const defaults: HeatExchangerDefaults | null = own.success ? own.data : null;
  const byJob = new Map<number, typeof rules>();
  for (const r of rules) byJob.set(r.job_id, [...(byJob.get(r.job_id) ?? []), r]);
  const jobs: BookedJob[] = rows.map((r) => ({
    jobId: r.id,
    vanId: r.van_location_id,
    scheduledOn: r.scheduled_on,
    packs: bookedJobPacks(
      surveySchema.parse(typeof r.survey === 'string' ? JSON.parse(r.survey) : r.survey),
      r.visit_kind,
      (byJob.get(r.id) ?? []).map((p) => ({
        productId: p.id,
        kind: p.kind,
        packSizeMl: p.pack_size_ml,
        doseLitresPer100L: p.dose_litres_per_100l === null ? null : Number(p.dose_litres_per_100l),
        radiatorsPerPack: p.radiators_per_pack,
      })),
      defaults,
    ),
  }));
  if (jobs.length === 0) return null;
  const par = (p: { minimum: number; target: number }): ParLevel => ({ minimum: p.minimum, target: p.target });
  return {
    from: jobs[0]!.scheduledOn,
    to: jobs.at(-1)!.scheduledOn,
    jobs,
    vanIds,
    vanPar: new Map(
      pars
        .filter((p) => vanIds.includes(p.location_id))
        .map((p) => [vanProductKey(p.location_id, p.product_id), par(p)]),
    ),
    depotPar: new Map(pars.filter((p) => p.location_id === depotId).map((p) => [p.product_id, par(p)])),
    restockWeekday: MONDAY,
    restockDays: firm.restock_days ?? DEFAULT_RESTOCK_DAYS,
    deliveryLeadDays: DELIVERY_LEAD_DAYS,
  };
}

export interface RestockSimulationFigures {
  firm: string;
  from: string;
  to: string;
  jobs: number;
  restockDays: number;
  /** Jobs that would have started short of chemical on the van. */
  shortStartsParOnly: number;
  shortStartsBookedJobs: number;
  packsMovedParOnly: number;
  packsMovedBookedJobs: number;
}

/** The figure `npm run bench` reports (target 0 with booked-job restock), against par levels alone. */
export async function restockSimulationFigures(
  db: Knex,
  firmName = DEMO_FIRM_NAME,
): Promise<RestockSimulationFigures | null> {
  const year = await loadDemoYear(db, firmName);
  if (!year) return null;
  const parOnly = simulateRestock({ ...year, policy: 'par' });
  const booked = simulateRestock({ ...year, policy: 'booked' });
  return {
    firm: firmName,
    from: year.from,
    to: year.to,
    jobs: booked.jobs,
    restockDays: year.restockDays,
    shortStartsParOnly: parOnly.shortStarts,
    shortStartsBookedJobs: booked.shortStarts,
    packsMovedParOnly: parOnly.packsMoved,
    packsMovedBookedJobs: booked.packsMoved,
  };
}
