import { ForbiddenError } from '@casl/ability';
import type { NewSite, SiteDetail, SiteInput, SiteListRow } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { findCustomer } from '../jobs/customer-dal.ts';
import { listCheckableInhibitors, listSiteChecks } from './site-check-dal.ts';
import { findSite, insertSite, listSiteJobs, listSites } from './site-dal.ts';

type Db = Knex | Knex.Transaction;

export async function listAllSites(deps: AppDeps, actor: Actor): Promise<SiteListRow[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Customer');
  return listSites(deps.db, actor.firmId);
}

/** A site's history; `db` is the caller's transaction when the site was just written. */
export async function getSite(deps: AppDeps, actor: Actor, siteId: number, db: Db = deps.db): Promise<SiteDetail> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Customer');
  const site = await findSite(db, actor.firmId, siteId);
  if (!site) throw notFound('That site');
  // One after another: a transaction's connection runs one query at a time anyway.
  const jobs = await listSiteJobs(db, actor.firmId, siteId);
  const checks = await listSiteChecks(db, actor.firmId, siteId);
  const inhibitors = await listCheckableInhibitors(db, actor.firmId);
  const { customer, ...rest } = site;
  return { site: rest, customer, jobs, checks, nextCheckOn: site.nextCheckOn, inhibitors };
}

/** A new site of a customer; the answer is its id and what was sent. */
export async function createSite(deps: AppDeps, actor: Actor, customerId: number, input: SiteInput): Promise<NewSite> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Customer');
  if (!(await findCustomer(deps.db, actor.firmId, customerId))) throw notFound('That customer');
  const id = await insertSite(deps.db, actor.firmId, customerId, input);
  return { id, ...input };
}
