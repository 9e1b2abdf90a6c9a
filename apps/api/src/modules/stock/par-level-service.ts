import { ForbiddenError } from '@casl/ability';
import type { ParLevelInput, ParLevelRow } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { findProductRef } from './product-dal.ts';
import { listParLevelRows, locationExists, upsertParLevel } from './stock-level-dal.ts';

export async function listParLevels(deps: AppDeps, actor: Actor): Promise<ParLevelRow[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'ParLevel');
  const rows = await listParLevelRows(deps.db, actor.firmId);
  return rows.map((r) => ({
    locationId: r.location_id,
    productId: r.product_id,
    minimum: r.minimum,
    target: r.target,
  }));
}

/** Sets the minimum and target of a product at a place; answers with what was set. */
export async function setParLevel(deps: AppDeps, actor: Actor, input: ParLevelInput): Promise<ParLevelInput> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'ParLevel');
  const [place, product] = await Promise.all([
    locationExists(deps.db, actor.firmId, input.locationId),
    findProductRef(deps.db, actor.firmId, input.productId),
  ]);
  if (!place) throw notFound('That place');
  if (!product) throw notFound('That product');
  await upsertParLevel(deps.db, actor.firmId, input);
  return input;
}
