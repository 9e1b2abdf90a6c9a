import { priceVisitKindLabels, visitPriceFor, type MoneyLineInput } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { AppDeps } from '../../app-deps.ts';
import { parseSurvey } from '../jobs/job-access.ts';
import type { JobRow } from '../jobs/job-dal.ts';
import { planJob } from '../jobs/job-plan.ts';
import { packsUsedByProduct } from './job-lines-dal.ts';
import { chemicalPrices, findVisitPrice } from './price-list-dal.ts';

/**
 * The lines the price list gives a job: its visit priced by the survey's radiators, and its chemicals at
 * their sell price (the packs taken off the van once completed, the planned packs before). A chemical
 * without a price is left out (the office adds it by hand); so is a visit kind without one.
 */
export async function priceListLinesForJob(
  db: Knex | Knex.Transaction,
  deps: AppDeps,
  firmId: number,
  row: JobRow,
): Promise<MoneyLineInput[]> {
  const lines: MoneyLineInput[] = [];
  const radiators = parseSurvey(row).radiators.length;
  const visit = await findVisitPrice(db, firmId, row.visit_kind);
  const visitPence = visit && visit.pricing ? visitPriceFor({ ...visit, pricing: visit.pricing }, radiators) : null;
  if (visit && visitPence !== null) {
    lines.push({
      kind: 'visit',
      priceItemId: visit.id,
      description: `${priceVisitKindLabels[row.visit_kind]}, ${radiators} radiator${radiators === 1 ? '' : 's'}`,
      quantity: 1,
      unitPence: visitPence,
    });
  }
  const prices = await chemicalPrices(db, firmId);
  const packs =
    row.status === 'completed'
      ? await packsUsedByProduct(db, firmId, row.id)
      : (await planJob(db, deps, firmId, row)).doses.map((d) => ({
          productId: d.product.id,
          name: d.product.name,
          packs: d.packs,
        }));
  for (const p of packs) {
    const price = prices.get(p.productId);
    if (!price || p.packs <= 0) continue;
    lines.push({
      kind: 'chemical',
      priceItemId: price.id,
      productId: p.productId,
      description: price.name || p.name,
      quantity: p.packs,
      unitPence: price.unitPence,
    });
  }
  return lines;
}
