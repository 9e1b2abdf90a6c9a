import { ForbiddenError } from '@casl/ability';
import { bookedJobShortfalls, vanProductKey, type BookedJobsShort } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { firmToday } from '../firms/firm-today.ts';
import { firmBookedJobs } from './booked-need-service.ts';
import { listProductOrderRefs } from './product-dal.ts';
import { listActiveVanRefs } from './stock-level-dal.ts';
import { stockLevels } from './stock-query-service.ts';

/**
 * The booked jobs of the restock window whose van will not hold their packs, jobs taking from the
 * van in date order. `engineerMemberId` narrows it to one engineer's jobs (the engineer's home).
 */
export async function bookedJobsShort(
  deps: AppDeps,
  actor: Actor,
  filter: { engineerMemberId?: number | undefined },
): Promise<BookedJobsShort> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
  const [booked, vans, products] = await Promise.all([
    firmBookedJobs(deps.db, actor.firmId, today),
    listActiveVanRefs(deps.db, actor.firmId),
    listProductOrderRefs(deps.db, actor.firmId),
  ]);
  const levels = await stockLevels(deps.db, actor.firmId, today);
  const usable = new Map(levels.map((c) => [vanProductKey(c.locationId, c.productId), c.usable]));
  const short = bookedJobShortfalls(booked.jobs, usable);
  const jobById = new Map(booked.jobs.map((j) => [j.jobId, j]));
  const vanById = new Map(vans.map((v) => [v.id, v]));
  const productById = new Map(products.map((p) => [p.id, p]));
  return {
    today,
    days: booked.days,
    jobs: short
      .filter(
        (s) =>
          filter.engineerMemberId === undefined || jobById.get(s.jobId)?.engineerMemberId === filter.engineerMemberId,
      )
      .map((s) => ({
        jobId: s.jobId,
        scheduledOn: s.scheduledOn,
        address: jobById.get(s.jobId)?.address ?? '',
        van: { id: s.vanId, name: vanById.get(s.vanId)?.name ?? 'A van' },
        short: s.short.map((p) => ({
          product: {
            id: p.productId,
            name: productById.get(p.productId)?.name ?? '',
            packSizeMl: productById.get(p.productId)?.packSizeMl ?? 0,
          },
          packs: p.packs,
          available: p.available,
          shortBy: p.shortBy,
        })),
      })),
  };
}
