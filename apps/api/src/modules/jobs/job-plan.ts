import {
  allocateFefo,
  dosePlan,
  surveyVolume,
  type JobDose,
  type Survey,
  type VolumeBreakdown,
  visitDosesProduct,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { AppDeps } from '../../app-deps.ts';
import { findHeatExchangerDefaults } from '../firms/firm-dal.ts';
import { firmToday } from '../firms/firm-today.ts';
import { balancesAt } from '../stock/stock-ledger.ts';
import { parseSurvey } from './job-access.ts';
import { listJobDoseProducts, type JobRow } from './job-dal.ts';

export interface JobPlan {
  survey: Survey;
  volume: VolumeBreakdown;
  doses: JobDose[];
  today: string;
}

/**
 * The plan for a job: the volume and how it was reached, each product's dose (the larger of the
 * volume rule and the radiators rule), and for the van the batches to take first and any shortfall.
 */
export async function planJob(
  db: Knex | Knex.Transaction,
  deps: AppDeps,
  firmId: number,
  row: JobRow,
): Promise<JobPlan> {
  const survey = parseSurvey(row);
  const volume = surveyVolume(survey, await findHeatExchangerDefaults(db, firmId));
  const today = await firmToday(db, firmId, deps.clock.now());
  const products = (await listJobDoseProducts(db, firmId, row.id)).filter((p) =>
    visitDosesProduct(row.visit_kind, p.kind),
  );
  const vanStock = row.van_location_id ? await balancesAt(db, firmId, row.van_location_id) : [];
  const doses = products.map((p) => {
    const plan = dosePlan(volume.totalLitres, survey.radiators.length, {
      packSizeMl: p.pack_size_ml,
      doseLitresPer100L: p.dose_litres_per_100l === null ? null : Number(p.dose_litres_per_100l),
      radiatorsPerPack: p.radiators_per_pack,
    });
    const batches = vanStock
      .filter((b) => b.product_id === p.id)
      .map((b) => ({ batchId: b.batch_id, lotNumber: b.lot_number, expiresOn: b.expires_on, quantity: b.quantity }));
    const fromVan = allocateFefo(batches, plan.packs, today);
    return {
      product: { id: p.id, name: p.name, kind: p.kind, packSizeMl: p.pack_size_ml },
      ...plan,
      takeFromVan: fromVan.allocations,
      shortfall: fromVan.shortfall,
    };
  });
  return { survey, volume, doses, today };
}
