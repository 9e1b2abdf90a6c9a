import { ForbiddenError } from '@casl/ability';
import { addMonths, inhibitorCheck, type SiteCheckInput, type SiteCheckResponse } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { HttpError, notFound } from '../../lib/http-error.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { firmToday } from '../firms/firm-today.ts';
import { findProduct, insertSiteCheck } from './site-check-dal.ts';
import { findSite, setSiteNextCheck } from './site-dal.ts';
import { getSite } from './site-service.ts';

/** A year between inhibitor checks, as after a clean (DEVELOPERS.md, "Decisions worth knowing"). */
const CHECK_INTERVAL_MONTHS = 12;

/**
 * Records an inhibitor check visit: pass when the reading is within the product's target range,
 * and the site's next check a year on from the visit, in one transaction; at most once per Idempotency-Key.
 */
export async function recordSiteCheck(
  deps: AppDeps,
  actor: Actor,
  siteId: number,
  input: SiteCheckInput,
  idempotencyKey?: IdempotencyKey,
): Promise<SiteCheckResponse> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Customer');
  const out = await runIdempotent(deps, actor, idempotencyKey, `site check ${siteId}`, async (trx) => {
    const site = await findSite(trx, actor.firmId, siteId, true);
    if (!site) throw notFound('That site');
    const today = await firmToday(trx, actor.firmId, deps.clock.now());
    if (input.checkedOn > today) {
      throw new HttpError(
        422,
        `A check cannot be dated after today (${input.checkedOn} is later than ${today}).`,
        undefined,
        [{ path: 'checkedOn', message: 'After today' }],
      );
    }
    const product = await findProduct(trx, actor.firmId, input.inhibitorProductId);
    if (!product) throw notFound('That product');
    if (product.kind !== 'inhibitor' || product.target_min === null || product.target_max === null) {
      throw new HttpError(
        422,
        `${product.name} is not an inhibitor with a target range, so a check cannot be judged against it. Choose an inhibitor, or set its target range on the product.`,
        undefined,
        [{ path: 'inhibitorProductId', message: 'Not an inhibitor with a target range' }],
      );
    }
    const range = { min: Number(product.target_min), max: Number(product.target_max) };
    const id = await insertSiteCheck(trx, {
      firmId: actor.firmId,
      siteId,
      checkedOn: input.checkedOn,
      productId: product.id,
      reading: input.inhibitorReading,
      ...range,
      unit: product.target_unit,
      tdsPpm: input.systemTdsPpm ?? null,
      result: inhibitorCheck(input.inhibitorReading, range) === 'pass' ? 'pass' : 'fail',
      notes: input.notes ?? null,
      byUserId: actor.userId,
    });
    await setSiteNextCheck(trx, actor.firmId, siteId, addMonths(input.checkedOn, CHECK_INTERVAL_MONTHS));
    return { status: 201, body: id };
  });
  const checkId = out.body;
  const detail = await getSite(deps, actor, siteId);
  return { check: detail.checks.find((c) => c.id === checkId)!, site: detail };
}
