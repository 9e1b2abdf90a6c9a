import { ForbiddenError, subject } from '@casl/ability';
import {
  addMonths,
  allocateFefo,
  dosePlan,
  surveySchema,
  surveyVolume,
  type CreateJobInput,
  type CustomerInput,
  type SiteInput,
  type Survey,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, notFound } from '../../lib/http-error.ts';
import { findVanOfMember } from '../locations/location-dal.ts';
import { findMember } from '../members/member-dal.ts';
import { firmToday } from '../firms/firm-today.ts';
import { applyMovements, balancesAt } from '../stock/stock-ledger.ts';
import { buildSheet } from './job-sheet-service.ts';

type Db = Knex | Knex.Transaction;

export async function createCustomer(deps: AppDeps, actor: Actor, input: CustomerInput) {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Customer');
  const [id] = await deps.db('customers').insert({ firm_id: actor.firmId, name: input.name, email: input.email ?? null, phone: input.phone ?? null, contact: input.contact ?? null });
  return getCustomer(deps, actor, id as number);
}

export async function listCustomers(deps: AppDeps, actor: Actor) {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Customer');
  return deps.db('customers').where({ firm_id: actor.firmId }).orderBy('name').select('id', 'name', 'email', 'phone', 'contact');
}

export async function getCustomer(deps: AppDeps, actor: Actor, id: number) {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Customer');
  const customer = await deps.db('customers').where({ firm_id: actor.firmId, id }).first('id', 'name', 'email', 'phone', 'contact');
  if (!customer) throw notFound('That customer');
  const sites = await deps.db('sites').where({ firm_id: actor.firmId, customer_id: id }).orderBy('id').select('id', 'address', 'postcode', 'access_notes as accessNotes', 'system_notes as systemNotes', 'next_check_on as nextCheckOn');
  return { ...customer, sites };
}

export async function createSite(deps: AppDeps, actor: Actor, customerId: number, input: SiteInput) {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Customer');
  if (!(await deps.db('customers').where({ firm_id: actor.firmId, id: customerId }).first('id'))) throw notFound('That customer');
  const [id] = await deps.db('sites').insert({
    firm_id: actor.firmId, customer_id: customerId, address: input.address, postcode: input.postcode ?? null, access_notes: input.accessNotes ?? null, system_notes: input.systemNotes ?? null,
  });
  return { id: id as number, ...input };
}

export interface JobRow {
  id: number;
  site_id: number;
  engineer_member_id: number | null;
  van_location_id: number | null;
  scheduled_on: string;
  status: 'planned' | 'completed';
  survey: string | Survey;
  completed_at: Date | null;
  next_check_on: string | null;
  notes: string | null;
}

export async function jobRow(db: Db, firmId: number, id: number, forUpdate = false): Promise<JobRow> {
  const q = db('jobs').where({ firm_id: firmId, id }).first();
  if (forUpdate) q.forUpdate();
  const row = (await q) as JobRow | undefined;
  if (!row) throw notFound('That job');
  return row;
}

/**
 * The plan for a job: the volume and how it was reached, each product's dose (the larger of the
 * volume rule and the radiators rule), and for the van the batches to take first and any shortfall.
 */
export async function planJob(db: Db, deps: AppDeps, firmId: number, row: JobRow) {
  const survey = surveySchema.parse(typeof row.survey === 'string' ? JSON.parse(row.survey) : row.survey);
  const volume = surveyVolume(survey);
  const today = await firmToday(db, firmId, deps.clock.now());
  const products = (await db('job_products as jp')
    .join('products as p', (j) => j.on('p.id', '=', 'jp.product_id').andOn('p.firm_id', '=', 'jp.firm_id'))
    .where({ 'jp.firm_id': firmId, 'jp.job_id': row.id })
    .orderBy('p.kind')
    .select('p.id', 'p.name', 'p.kind', 'p.pack_size_ml', 'p.dose_litres_per_100l', 'p.radiators_per_pack')) as {
    id: number; name: string; kind: string; pack_size_ml: number; dose_litres_per_100l: string | null; radiators_per_pack: number | null;
  }[];
  const vanStock = row.van_location_id ? await balancesAt(db, firmId, row.van_location_id) : [];
  const doses = products.map((p) => {
    const plan = dosePlan(volume.totalLitres, survey.radiators.length, {
      packSizeMl: p.pack_size_ml,
      doseLitresPer100L: p.dose_litres_per_100l === null ? null : Number(p.dose_litres_per_100l),
      radiatorsPerPack: p.radiators_per_pack,
    });
    const batches = vanStock.filter((b) => b.product_id === p.id).map((b) => ({ batchId: b.batch_id, lotNumber: b.lot_number, expiresOn: b.expires_on, quantity: b.quantity }));
    const fromVan = allocateFefo(batches, plan.packs, today);
    return { product: { id: p.id, name: p.name, kind: p.kind, packSizeMl: p.pack_size_ml }, ...plan, takeFromVan: fromVan.allocations, shortfall: fromVan.shortfall };
  });
  return { survey, volume, doses, today };
}

export async function createJob(deps: AppDeps, actor: Actor, input: CreateJobInput) {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Job');
  const id = await deps.db.transaction(async (trx) => {
    if (!(await trx('sites').where({ firm_id: actor.firmId, id: input.siteId }).first('id'))) throw notFound('That site');
    // An engineer books jobs for themself; the office may name any engineer.
    const engineerMemberId = input.engineerMemberId ?? (actor.role === 'engineer' ? actor.memberId : null);
    if (engineerMemberId && !(await findMember(trx, actor.firmId, engineerMemberId))?.active) throw notFound('That engineer');
    const van = engineerMemberId ? await findVanOfMember(trx, actor.firmId, engineerMemberId) : undefined;
    for (const productId of input.productIds) {
      if (!(await trx('products').where({ firm_id: actor.firmId, id: productId }).first('id'))) throw notFound('That product');
    }
    const [jobId] = await trx('jobs').insert({
      firm_id: actor.firmId, site_id: input.siteId, engineer_member_id: engineerMemberId, van_location_id: van?.id ?? null, scheduled_on: input.scheduledOn, survey: JSON.stringify(input.survey),
    });
    if (input.productIds.length) await trx('job_products').insert([...new Set(input.productIds)].map((productId) => ({ firm_id: actor.firmId, job_id: jobId, product_id: productId })));
    return jobId as number;
  });
  return getJob(deps, actor, id);
}

export async function getJob(deps: AppDeps, actor: Actor, id: number, db: Db = deps.db) {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Job');
  const row = await jobRow(db, actor.firmId, id);
  const site = await db('sites as s').join('customers as c', (j) => j.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .where({ 's.firm_id': actor.firmId, 's.id': row.site_id }).first('s.id', 's.address', 's.postcode', 'c.id as customerId', 'c.name as customerName');
  const used = await db('stock_movements as m').join('product_batches as b', 'b.id', 'm.batch_id').join('products as p', 'p.id', 'm.product_id')
    .where({ 'm.firm_id': actor.firmId, 'm.job_id': id, 'm.kind': 'used' }).select('p.name as product', 'b.lot_number as lotNumber', 'b.expires_on as expiresOn', db.raw('-m.quantity_delta AS packs'));
  const plan = await planJob(db, deps, actor.firmId, row);
  const sheet = await buildSheet(db, deps, actor, row, plan.survey);
  return {
    job: { id: row.id, status: row.status, scheduledOn: row.scheduled_on, engineerMemberId: row.engineer_member_id, vanLocationId: row.van_location_id, completedAt: row.completed_at?.toISOString() ?? null, nextCheckOn: row.next_check_on, site },
    ...plan,
    chemicalsUsed: used as { product: string; lotNumber: string; expiresOn: string; packs: number }[],
    sheet,
  };
}

export async function listJobs(deps: AppDeps, actor: Actor) {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Job');
  return deps.db('jobs as j').join('sites as s', (j) => j.on('s.id', '=', 'j.site_id').andOn('s.firm_id', '=', 'j.firm_id'))
    .join('customers as c', (j) => j.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .where('j.firm_id', actor.firmId).orderBy('j.scheduled_on', 'desc').limit(500)
    .select('j.id', 'j.status', 'j.scheduled_on as scheduledOn', 's.address', 'c.name as customerName', 'j.next_check_on as nextCheckOn');
}

/**
 * Completes a job: the planned chemicals come off the engineer's van by batch, first expiry first,
 * in the same transaction as the completion. The job row is locked first, so a retried or doubled
 * completion finds it completed and changes nothing.
 */
export async function completeJob(trx: Knex.Transaction, deps: AppDeps, actor: Actor, id: number) {
  const row = await jobRow(trx, actor.firmId, id, true);
  ForbiddenError.from(actor.ability).throwUnlessCan('update', subject('Job', { firmId: actor.firmId, engineerMemberId: row.engineer_member_id }));
  if (row.status === 'completed') throw conflict('This job is already completed; its chemicals were taken off the van then.');
  const plan = await planJob(trx, deps, actor.firmId, row);
  const short = plan.doses.filter((d) => d.shortfall > 0);
  if (short.length || (plan.doses.length && !row.van_location_id)) {
    throw conflict(
      row.van_location_id
        ? `The van is short of ${short.map((d) => `${d.shortfall} pack(s) of ${d.product.name}`).join(', ')}. Restock it, or change the plan, then complete.`
        : 'This job has no van to take its chemicals from: assign an engineer with a van.',
    );
  }
  await applyMovements(
    trx,
    actor.firmId,
    actor.userId,
    plan.doses.flatMap((d) => d.takeFromVan.map((a) => ({ kind: 'used' as const, locationId: row.van_location_id!, productId: d.product.id, batchId: a.batchId, quantityDelta: -a.quantity, jobId: id, reason: `Job ${id}` }))),
    deps.clock.now(),
  );
  // The annual inhibitor check falls due 12 calendar months on (PRODUCT.md, computation 7).
  const nextCheckOn = addMonths(plan.today, 12);
  await trx('jobs').where({ firm_id: actor.firmId, id }).update({ status: 'completed', completed_at: deps.clock.now(), completed_by_user_id: actor.userId, next_check_on: nextCheckOn });
  await trx('sites').where({ firm_id: actor.firmId, id: row.site_id }).update({ next_check_on: nextCheckOn });
}
