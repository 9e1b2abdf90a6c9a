import { ForbiddenError } from '@casl/ability';
import { inhibitorVisitOutcome, type InhibitorCheckVisitInput, type SiteCheckResponse } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { HttpError, notFound } from '../../lib/http-error.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { firmToday } from '../firms/firm-today.ts';
import { findLocation } from '../locations/location-dal.ts';
import { useStock } from '../stock/stock-service.ts';
import { findProduct, insertSiteCheck, setSiteCheckNoteEmail } from './site-check-dal.ts';
import { writeCheckNote } from './site-check-note.ts';
import { findSite, setSiteNextCheck, type SiteRecord } from './site-dal.ts';
import { getSite } from './site-service.ts';

const refuse = (message: string, path: string, why: string) =>
  new HttpError(422, message, undefined, [{ path, message: why }]);

/** The top-up comes off the van's stock through the ledger (first expiry first; never below zero). */
async function takeTopUp(
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  site: SiteRecord,
  product: { id: number; name: string },
  topUp: NonNullable<InhibitorCheckVisitInput['topUp']>,
): Promise<string> {
  const van = await findLocation(trx, actor.firmId, topUp.vanId);
  if (!van || van.kind !== 'van' || !van.active) throw notFound('That van');
  const place = site.address.replace(/\s*\n\s*/g, ', ').slice(0, 200);
  return useStock(trx, deps, actor, {
    locationId: van.id,
    productId: product.id,
    quantity: topUp.packs,
    reason: `Inhibitor top-up at a check visit, ${place}`,
  });
}

/** Writes the visit, its top-up and its note; answers the check's id and the e-mail to queue. */
async function writeSiteCheck(
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  siteId: number,
  input: InhibitorCheckVisitInput,
): Promise<{ id: number; emailId: number | null }> {
  const site = await findSite(trx, actor.firmId, siteId, true);
  if (!site) throw notFound('That site');
  const today = await firmToday(trx, actor.firmId, deps.clock.now());
  if (input.checkedOn > today)
    throw refuse(
      `A check cannot be dated after today (${input.checkedOn} is later than ${today}).`,
      'checkedOn',
      'After today',
    );
  const product = await findProduct(trx, actor.firmId, input.inhibitorProductId);
  if (!product) throw notFound('That product');
  if (product.kind !== 'inhibitor' || product.target_min === null || product.target_max === null)
    throw refuse(
      `${product.name} is not an inhibitor with a target range, so a check cannot be judged against it. Choose an inhibitor, or set its target range on the product.`,
      'inhibitorProductId',
      'Not an inhibitor with a target range',
    );
  const range = { min: Number(product.target_min), max: Number(product.target_max) };
  const outcome = inhibitorVisitOutcome(input.checkedOn, range, input.inhibitorReading, input.retestReading);
  const groupId = input.topUp ? await takeTopUp(trx, deps, actor, site, product, input.topUp) : null;
  const id = await insertSiteCheck(trx, {
    firmId: actor.firmId,
    siteId,
    checkedOn: input.checkedOn,
    productId: product.id,
    reading: input.inhibitorReading,
    ...range,
    unit: product.target_unit,
    tdsPpm: input.systemTdsPpm ?? null,
    result: outcome.result,
    notes: input.notes ?? null,
    byUserId: actor.userId,
    retestReading: input.retestReading ?? null,
    topUp: input.topUp && groupId ? { ...input.topUp, groupId } : null,
    nextCheckOn: outcome.nextCheckOn,
  });
  await setSiteNextCheck(trx, actor.firmId, siteId, outcome.nextCheckOn);
  if (!input.emailCustomer || !site.customer.email) return { id, emailId: null };
  const emailId = await writeCheckNote(trx, {
    firmId: actor.firmId,
    to: site.customer.email,
    customerName: site.customer.name,
    address: site.address,
    checkedOn: input.checkedOn,
    productName: product.name,
    range: { ...range, unit: product.target_unit },
    firstReading: input.inhibitorReading,
    topUpPacks: input.topUp?.packs ?? null,
    retestReading: input.retestReading ?? null,
    outcome,
  });
  await setSiteCheckNoteEmail(trx, actor.firmId, id, emailId);
  return { id, emailId };
}

/**
 * Records an inhibitor check visit: pass or fail against the product's target range, a top-up taken
 * off the van and a re-test deciding the visit when given; the site's next check a year on after a
 * pass, a month on after a fail (`inhibitorVisitOutcome`); the customer's note written in the same
 * transaction and queued after commit. At most once per Idempotency-Key, retried whole on a deadlock.
 */
export async function recordSiteCheck(
  deps: AppDeps,
  actor: Actor,
  siteId: number,
  input: InhibitorCheckVisitInput,
  idempotencyKey?: IdempotencyKey,
): Promise<{ status: number; body: SiteCheckResponse }> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Customer');
  let emailId: number | null = null;
  const out = await withTransactionRetry(() =>
    runIdempotent(deps, actor, idempotencyKey, `site check ${siteId}`, async (trx) => {
      emailId = null;
      const written = await writeSiteCheck(trx, deps, actor, siteId, input);
      emailId = written.emailId;
      const site = await getSite(deps, actor, siteId, trx);
      return { status: 201, body: { check: site.checks.find((c) => c.id === written.id)!, site } };
    }),
  );
  if (emailId !== null) await deps.mailQueue.notify([emailId]);
  return { status: out.status, body: out.body };
}
