import { subject } from '@casl/ability';
import type {
  CheckInInput,
  CheckOutInput,
  ItemCustodyResponse,
  KitDetailResponse,
  KitItem,
  MoveInput,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { conflict, HttpError, notAllowed, notFound } from '../../lib/http-error.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { findLocation, firstDepot, type LocationRow } from '../locations/location-dal.ts';
import { attachPhotoToItem, photoExists } from '../photos/photo-dal.ts';
import { insertCustodyEvents, listCustodyEvents } from './custody-dal.ts';
import { checkInPerItem } from './check-in-rules.ts';
import { recordCleanedAtCheckIn } from './inspection-service.ts';
import { findKit } from './kit-dal.ts';
import { lockItems, updateItems } from './kit-item-dal.ts';
import { getItem, loadItems } from './kit-item-service.ts';
import { getKitDetail } from './kit-service.ts';

type CustodyTarget = { kitId: number } | { itemId: number };
export type CustodyAction = 'check_out' | 'check_in' | 'move';
export type CustodyInput = CheckOutInput | CheckInInput | MoveInput;
/** An answer as runIdempotent gives it: the first answer's status and body, replayed for a retried key. */
export interface CustodyAnswer<T> {
  status: number;
  body: T;
}

function describeWhere(loc: NonNullable<KitItem['location']>): string {
  if (loc.kind === 'depot') return `at ${loc.name}`;
  return `out on van ${loc.registration ?? loc.name}${loc.engineerName ? ` with ${loc.engineerName}` : ''}`;
}

function labelOf(target: CustodyTarget, items: KitItem[]): string {
  return 'kitId' in target ? (items[0]?.kit?.name ?? 'That kit') : (items[0]?.assetTag ?? 'That item');
}

function custodySubject(firmId: number, loc: LocationRow) {
  return subject('Custody', { firmId, kind: loc.kind, engineerMemberId: loc.engineer_member_id });
}

async function destination(
  trx: Knex.Transaction,
  actor: Actor,
  action: CustodyAction,
  toLocationId: number | undefined,
): Promise<LocationRow> {
  if (action === 'check_in') {
    const depot = toLocationId
      ? await findLocation(trx, actor.firmId, toLocationId)
      : await firstDepot(trx, actor.firmId);
    if (!depot || depot.kind !== 'depot' || !depot.active)
      throw notFound(toLocationId ? 'That depot' : 'A depot to check in to');
    return depot;
  }
  const van = await findLocation(trx, actor.firmId, toLocationId!);
  if (!van || van.kind !== 'van' || !van.active) throw notFound('That van');
  return van;
}

async function checkPhoto(trx: Knex.Transaction, firmId: number, photoId: number | undefined) {
  if (photoId === undefined) return;
  if (!(await photoExists(trx, firmId, photoId))) throw notFound('That photo');
}

/**
 * Moves a kit (all its items) or one item, appending one custody event per item. The item rows
 * are locked first, so of two engineers checking out the same kit at once exactly one succeeds;
 * the other then sees where it went and gets 409 naming the holder.
 */
async function recordCustody(
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  target: CustodyTarget,
  action: CustodyAction,
  input: CustodyInput,
  tappedAt: Date | null,
): Promise<void> {
  const now = deps.clock.now();
  const ids = await lockItems(
    trx,
    actor.firmId,
    'kitId' in target ? { kitId: target.kitId } : { itemId: target.itemId },
  );
  if ('kitId' in target && !(await findKit(trx, actor.firmId, target.kitId))) throw notFound('That kit');
  if (ids.length === 0)
    throw 'kitId' in target
      ? new HttpError(400, 'That kit has no items to move yet.', 'RuleBroken')
      : notFound('That item');
  const items = await loadItems(trx, actor.firmId, now, { ids });
  const label = labelOf(target, items);
  const to = await destination(trx, actor, action, (input as { toLocationId?: number }).toLocationId);

  // Where the items are now (the kit moves as one; a split kit is refused rather than half-moved).
  const froms = new Set(items.map((i) => i.location?.id ?? null));
  const here = items[0]!.location;
  if (froms.size > 1) throw conflict(`${label} is split across places; move its items one at a time.`);

  if (action === 'check_out') {
    if (here?.kind === 'van') throw conflict(`${label} is already ${describeWhere(here)}.`);
  } else if (action === 'check_in') {
    if (!here || here.kind !== 'van')
      throw conflict(`${label} is already checked in${here ? ` ${describeWhere(here)}` : ''}.`);
  } else {
    if (!here || here.kind !== 'van') throw conflict(`${label} is not out on a van; check it out instead.`);
    if (here.id === to.id) throw conflict(`${label} is already on that van.`);
  }

  // Engineers act for their own van only: taking kit onto it (check-out, or a move to it), or
  // handing it in or on from it (check-in, or a move from it). Stores and above act for any van.
  const fromRow = here ? await findLocation(trx, actor.firmId, here.id) : undefined;
  const touching = action === 'check_out' ? [to] : action === 'check_in' ? [fromRow] : [fromRow, to];
  if (!touching.some((loc) => loc && actor.ability.can('create', custodySubject(actor.firmId, loc)))) {
    throw notAllowed('You can check kit out to, in from, or on from your own van only.');
  }

  let overdueReason: string | null = null;
  if (action !== 'check_in') {
    const broken = items.filter((i) => i.condition === 'out_of_service');
    if (broken.length) {
      throw new HttpError(
        409,
        `${broken.map((i) => i.assetTag).join(', ')} is out of service and cannot go out.`,
        'OutOfService',
        broken.map((i) => ({ path: i.assetTag, message: 'Out of service' })),
      );
    }
    const overdue = items.filter((i) => i.inspection.state === 'overdue');
    const blocked = overdue.filter((i) => i.kind.overduePolicy === 'block');
    const reason = (input as CheckOutInput).overdueReason;
    if (blocked.length || (overdue.length && !reason)) {
      const list = (blocked.length ? blocked : overdue).map((i) => ({
        path: i.assetTag,
        message:
          i.kind.overduePolicy === 'block'
            ? `${i.kind.name}: stays in until inspected`
            : `${i.kind.name}: overdue for inspection; give a reason to take it`,
      }));
      throw new HttpError(
        409,
        blocked.length
          ? `${blocked.map((i) => i.assetTag).join(', ')} must be inspected before it goes out.`
          : `${overdue.map((i) => i.assetTag).join(', ')} is overdue for inspection. Say why it goes out anyway, or inspect it first.`,
        'InspectionOverdue',
        list,
      );
    }
    if (overdue.length) overdueReason = reason ?? null;
  }

  const checkIn = action === 'check_in' ? (input as CheckInInput) : undefined;
  const own = checkIn ? checkInPerItem(items, checkIn) : undefined;
  await checkPhoto(trx, actor.firmId, checkIn?.photoId);
  await insertCustodyEvents(
    trx,
    items.map((i) => ({
      firm_id: actor.firmId,
      item_id: i.id,
      kit_id: i.kit?.id ?? null,
      action,
      from_location_id: here?.id ?? null,
      to_location_id: to.id,
      by_user_id: actor.userId,
      condition: own?.condition.get(i.id) ?? null,
      missing_parts: checkIn?.missingParts ?? null,
      note: input.note ?? null,
      overdue_reason: overdueReason,
      cleaned: own?.cleaned.includes(i.id) ?? false,
      photo_id: checkIn?.photoId ?? null,
      created_at: now,
      tapped_at: tappedAt,
    })),
  );
  // The cached whereabouts follow the event just written, in the same transaction.
  if (!own) {
    await updateItems(trx, actor.firmId, ids, { location_id: to.id });
  } else {
    for (const condition of new Set(own.condition.values())) {
      const same = ids.filter((id) => own.condition.get(id) === condition);
      await updateItems(trx, actor.firmId, same, { location_id: to.id, condition });
    }
    // Stamped with the check-in's own time: the use that just ended is before the cleaning, not after it.
    await recordCleanedAtCheckIn(trx, deps, actor, own.cleaned, now);
  }
  if (checkIn?.photoId) await attachPhotoToItem(trx, actor.firmId, checkIn.photoId, items[0]!.id);
}

/**
 * A check-out, check-in or move of a whole kit: idempotent by key, retried whole on a deadlock,
 * answering with the kit as it now stands (read in the same transaction).
 */
export function moveKit(
  deps: AppDeps,
  actor: Actor,
  kitId: number,
  action: CustodyAction,
  input: CustodyInput,
  idempotencyKey: IdempotencyKey | undefined,
  tappedAt: Date | null = null,
): Promise<CustodyAnswer<KitDetailResponse>> {
  return withTransactionRetry(() =>
    runIdempotent(deps, actor, idempotencyKey, `${action} kit ${kitId}`, async (trx) => {
      await recordCustody(trx, deps, actor, { kitId }, action, input, tappedAt);
      return { status: 200, body: await getKitDetail(deps, actor, kitId, trx) };
    }),
  );
}

/** The same for one item, answering with the item and its custody timeline. */
export function moveItem(
  deps: AppDeps,
  actor: Actor,
  itemId: number,
  action: CustodyAction,
  input: CustodyInput,
  idempotencyKey: IdempotencyKey | undefined,
  tappedAt: Date | null = null,
): Promise<CustodyAnswer<ItemCustodyResponse>> {
  return withTransactionRetry(() =>
    runIdempotent(deps, actor, idempotencyKey, `${action} item ${itemId}`, async (trx) => {
      await recordCustody(trx, deps, actor, { itemId }, action, input, tappedAt);
      return {
        status: 200,
        body: {
          item: await getItem(deps, actor, itemId, trx),
          events: await listCustodyEvents(trx, actor.firmId, { itemId }),
        },
      };
    }),
  );
}
