import { ForbiddenError } from '@casl/ability';
import type {
  CreateDepotInput,
  CreateVanInput,
  Depot,
  MyVanResponse,
  UpdateVanInput,
  Van,
  VanDetailResponse,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, notFound, ruleBroken } from '../../lib/http-error.ts';
import { listKits } from '../kits/kit-service.ts';
import { loadItems } from '../kits/kit-item-service.ts';
import { syncVanCountAfterChange } from '../billing/billing-subscription.ts';
import { findMember } from '../members/member-dal.ts';
import {
  contentsByLocation,
  findLocation,
  findLocationByRegistration,
  findVanOfMember,
  insertLocation,
  listLocations,
  locationNameTaken,
  toDepot,
  toVan,
  updateLocation,
  type LocationRow,
} from './location-dal.ts';

async function vansWithContents(db: Knex, firmId: number, rows: LocationRow[]): Promise<Van[]> {
  const contents = await contentsByLocation(
    db,
    firmId,
    rows.map((r) => r.id),
  );
  return rows.map((r) => toVan(r, contents.get(r.id)));
}

export async function listVans(deps: AppDeps, actor: Actor): Promise<Van[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Location');
  return vansWithContents(deps.db, actor.firmId, await listLocations(deps.db, actor.firmId, 'van'));
}

export async function getVan(deps: AppDeps, actor: Actor, id: number): Promise<Van> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Location');
  const row = await findLocation(deps.db, actor.firmId, id);
  if (!row || row.kind !== 'van') throw notFound('That van');
  const [van] = await vansWithContents(deps.db, actor.firmId, [row]);
  return van!;
}

async function getMyVan(deps: AppDeps, actor: Actor): Promise<Van | null> {
  const row = await findVanOfMember(deps.db, actor.firmId, actor.memberId);
  if (!row) return null;
  const [van] = await vansWithContents(deps.db, actor.firmId, [row]);
  return van!;
}

/** The kits (placed where most of their items are) and the items on a van. */
async function contentsOf(deps: AppDeps, actor: Actor, vanId: number) {
  const [kits, items] = await Promise.all([
    listKits(deps, actor),
    loadItems(deps.db, actor.firmId, deps.clock.now(), { locationId: vanId }),
  ]);
  return { kits: kits.filter((k) => k.location?.id === vanId), items };
}

/** A van with its kits and items. */
export async function getVanDetail(deps: AppDeps, actor: Actor, id: number): Promise<VanDetailResponse> {
  const van = await getVan(deps, actor, id);
  return { van, ...(await contentsOf(deps, actor, van.id)) };
}

/** The signed-in engineer's own van with its kits and items; van is null without one. */
export async function getMyVanDetail(deps: AppDeps, actor: Actor): Promise<MyVanResponse> {
  const van = await getMyVan(deps, actor);
  return van ? { van, ...(await contentsOf(deps, actor, van.id)) } : { van: null, kits: [], items: [] };
}

async function checkEngineer(
  trx: Knex.Transaction,
  firmId: number,
  memberId: number | null | undefined,
): Promise<void> {
  if (memberId === undefined || memberId === null) return;
  const member = await findMember(trx, firmId, memberId);
  if (!member || !member.active)
    throw ruleBroken('The engineer given is not an active member of this firm.', [
      { path: 'engineerMemberId', message: 'Choose an active member of this firm.' },
    ]);
}

async function checkRegistrationFree(trx: Knex.Transaction, firmId: number, registration: string, exceptId?: number) {
  const clash = await findLocationByRegistration(trx, firmId, registration, exceptId);
  if (clash) throw conflict(`Registration ${registration} is already on ${clash.name}.`);
}

async function checkNameFree(trx: Knex.Transaction, firmId: number, name: string, exceptId?: number) {
  if (await locationNameTaken(trx, firmId, name, exceptId))
    throw conflict(`There is already a van or depot called "${name}".`);
}

export async function createVan(deps: AppDeps, actor: Actor, input: CreateVanInput): Promise<Van> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Location');
  const id = await deps.db.transaction(async (trx) => {
    await checkEngineer(trx, actor.firmId, input.engineerMemberId);
    await checkRegistrationFree(trx, actor.firmId, input.registration);
    await checkNameFree(trx, actor.firmId, input.name);
    return insertLocation(trx, actor.firmId, {
      kind: 'van',
      name: input.name,
      registration: input.registration,
      engineer_member_id: input.engineerMemberId ?? null,
      mot_due_on: input.motDueOn ?? null,
      service_due_on: input.serviceDueOn ?? null,
      notes: input.notes ?? null,
    });
  });
  // The firm's subscription is per active van (README, Payments), prorated from today.
  await syncVanCountAfterChange(deps, actor.firmId);
  return getVan(deps, actor, id);
}

export async function updateVan(deps: AppDeps, actor: Actor, id: number, input: UpdateVanInput): Promise<Van> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Location');
  await deps.db.transaction(async (trx) => {
    const row = await findLocation(trx, actor.firmId, id, { forUpdate: true });
    if (!row || row.kind !== 'van') throw notFound('That van');
    await checkEngineer(trx, actor.firmId, input.engineerMemberId);
    if (input.registration) await checkRegistrationFree(trx, actor.firmId, input.registration, id);
    if (input.name) await checkNameFree(trx, actor.firmId, input.name, id);
    await updateLocation(trx, actor.firmId, id, {
      ...(input.name !== undefined && { name: input.name }),
      ...(input.registration !== undefined && { registration: input.registration }),
      ...(input.engineerMemberId !== undefined && { engineer_member_id: input.engineerMemberId }),
      ...(input.motDueOn !== undefined && { mot_due_on: input.motDueOn }),
      ...(input.serviceDueOn !== undefined && { service_due_on: input.serviceDueOn }),
      ...(input.notes !== undefined && { notes: input.notes }),
      ...(input.active !== undefined && { active: input.active ? 1 : 0 }),
    });
  });
  if (input.active !== undefined) await syncVanCountAfterChange(deps, actor.firmId);
  return getVan(deps, actor, id);
}

export async function listDepots(deps: AppDeps, actor: Actor): Promise<Depot[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Location');
  return (await listLocations(deps.db, actor.firmId, 'depot')).map(toDepot);
}

export async function createDepot(deps: AppDeps, actor: Actor, input: CreateDepotInput): Promise<Depot> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Location');
  const id = await deps.db.transaction(async (trx) => {
    await checkNameFree(trx, actor.firmId, input.name);
    return insertLocation(trx, actor.firmId, { kind: 'depot', name: input.name, notes: input.notes ?? null });
  });
  return toDepot((await findLocation(deps.db, actor.firmId, id))!);
}
