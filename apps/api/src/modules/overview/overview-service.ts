import { ForbiddenError } from '@casl/ability';
import {
  addDays,
  addMonths,
  calendarDateIn,
  daysBetween,
  DEFAULT_TIME_ZONE,
  havDay,
  inspectionDue,
  VAN_DUE_WINDOW_DAYS,
  type CalendarDate,
  type Overview,
  type OverviewDueItem,
  type OverviewVan,
} from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { findFirm } from '../firms/firm-dal.ts';
import { listBatchTotalsExpiringBy, listPlacesHoldingBatches } from '../reminders/reminder-stock-dal.ts';
import { firmBookedJobs } from '../stock/booked-need-service.ts';
import { stockLevels } from '../stock/stock-query-service.ts';
import { vanStockHealth } from './overview-stock.ts';
import {
  countJobsScheduled,
  listActiveVans,
  listAgitationsOn,
  listEngineers,
  listItemDueInputs,
  listLatestReminders,
  listProductsForUsage,
  packsUsedByMonth,
} from './overview-dal.ts';

export const EXPIRY_WINDOW_DAYS = 60;
const USAGE_MONTHS = 12;
const FIRST_FEW = 10;

type MonthUsage = { monthIndex: number; productId: number; packs: number }[];

/**
 * Packs used in months already over, per firm, zone and month. A 'used' movement is written at the
 * moment of use and the ledger is never edited, so a closed month's figure cannot change: only the
 * current month is read each time (the year is read once per process). Bounded, as a cache must be.
 */
const closedMonths = new Map<string, { productId: number; packs: number }[]>();
const CLOSED_MONTHS_MAX = 50_000;

async function usageByMonth(
  deps: AppDeps,
  firmId: number,
  timeZone: string,
  monthStarts: CalendarDate[],
): Promise<MonthUsage> {
  const key = (i: number) => `${firmId}|${timeZone}|${monthStarts[i]}`;
  const closed = monthStarts.length - 2;
  let from = 0;
  while (from < closed && closedMonths.has(key(from))) from += 1;
  const fresh = (
    await packsUsedByMonth(
      deps.db,
      firmId,
      monthStarts.slice(from).map((d) => startOfDayIn(d, timeZone)),
    )
  ).map((u) => ({ ...u, monthIndex: u.monthIndex + from }));
  if (closedMonths.size > CLOSED_MONTHS_MAX) closedMonths.clear();
  for (let i = from; i < closed; i += 1)
    closedMonths.set(
      key(i),
      fresh.filter((u) => u.monthIndex === i).map(({ productId, packs }) => ({ productId, packs })),
    );
  const remembered = Array.from({ length: from }, (_, i) =>
    (closedMonths.get(key(i)) ?? []).map((u) => ({ ...u, monthIndex: i })),
  );
  return [...remembered.flat(), ...fresh];
}

/** The instant a calendar day starts in a time zone (two passes settle the offset across a clock change). */
export function startOfDayIn(day: CalendarDate, timeZone: string): Date {
  const fmt = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    hourCycle: 'h23',
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    second: '2-digit',
  });
  const offsetAt = (t: number) => {
    const p = Object.fromEntries(fmt.formatToParts(new Date(t)).map((x) => [x.type, x.value]));
    return (
      Date.UTC(Number(p.year), Number(p.month) - 1, Number(p.day), Number(p.hour), Number(p.minute), Number(p.second)) -
      t
    );
  };
  const wall = Date.parse(`${day}T00:00:00Z`);
  let t = wall - offsetAt(wall);
  t = wall - offsetAt(t);
  return new Date(t);
}

/** Every lot held somewhere that is out of date within the window, and the places of the first few shown. */
async function expiringBatches(deps: AppDeps, firmId: number, today: CalendarDate) {
  const all = await listBatchTotalsExpiringBy(deps.db, firmId, addDays(today, EXPIRY_WINDOW_DAYS));
  const placesOf = await listPlacesHoldingBatches(
    deps.db,
    firmId,
    all.slice(0, FIRST_FEW).map((b) => b.batchId),
  );
  return { all, placesOf };
}

function nextDueOf(
  van: { mot_due_on: string | null; service_due_on: string | null },
  today: CalendarDate,
): OverviewVan['nextDue'] {
  const dues = [
    { what: 'MOT' as const, on: van.mot_due_on },
    { what: 'service' as const, on: van.service_due_on },
  ].filter((d): d is { what: 'MOT' | 'service'; on: string } => d.on !== null);
  dues.sort((a, b) => a.on.localeCompare(b.on));
  const first = dues[0];
  if (!first) return null;
  const daysLeft = daysBetween(today, first.on);
  return {
    ...first,
    daysLeft,
    state:
      daysLeft < 0 ? ('overdue' as const) : daysLeft <= VAN_DUE_WINDOW_DAYS ? ('due_soon' as const) : ('ok' as const),
  };
}

/**
 * The owner's overview of the firm in one answer. Each part is one aggregate query for the whole
 * firm (none per van or per item), run side by side; on-hand comes from the balances, never the ledger.
 */
export async function getOverview(deps: AppDeps, actor: Actor): Promise<Overview> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  const firm = await findFirm(deps.db, actor.firmId);
  const timeZone = firm?.time_zone ?? DEFAULT_TIME_ZONE;
  const today = calendarDateIn(deps.clock.now(), timeZone);
  const monthStart = `${today.slice(0, 7)}-01`;
  const firstUsageMonth = addMonths(monthStart, -(USAGE_MONTHS - 1));
  const monthStarts = Array.from({ length: USAGE_MONTHS + 1 }, (_, i) => addMonths(firstUsageMonth, i));
  const canSeeReminders = actor.ability.can('read', 'Reminder');
  // An engineer sees their own vibration points; the office sees every engineer's.
  const havOf = actor.role === 'engineer' ? actor.memberId : undefined;

  const [vans, levels, items, batches, jobs, usage, products, reminders, engineers, agitations] = await Promise.all([
    listActiveVans(deps.db, actor.firmId),
    stockLevels(
      deps.db,
      actor.firmId,
      today,
      {},
      firmBookedJobs(deps.db, actor.firmId, today).then((booked) => booked.packs),
    ),
    listItemDueInputs(deps.db, actor.firmId),
    expiringBatches(deps, actor.firmId, today),
    countJobsScheduled(deps.db, actor.firmId, monthStart, addMonths(monthStart, 1)),
    usageByMonth(deps, actor.firmId, timeZone, monthStarts),
    listProductsForUsage(deps.db, actor.firmId),
    canSeeReminders ? listLatestReminders(deps.db, actor.firmId, FIRST_FEW) : Promise.resolve(null),
    listEngineers(deps.db, actor.firmId),
    listAgitationsOn(deps.db, actor.firmId, today, havOf),
  ]);

  const stockByVan = vanStockHealth(levels, products);
  const vanRows = vans.map((v): OverviewVan => ({
    id: v.id,
    name: v.name,
    registration: v.registration,
    engineerName: v.engineer_name,
    stock: stockByVan(v.id),
    motDueOn: v.mot_due_on,
    serviceDueOn: v.service_due_on,
    nextDue: nextDueOf(v, today),
  }));

  const dueItems = items
    .map((i) => {
      const due = inspectionDue(
        { intervalDays: i.interval_days, intervalUses: i.interval_uses, dueSoonDays: i.due_soon_days },
        {
          lastInspectedOn: i.last_inspected_on,
          inServiceSince: i.in_service_since,
          usesSinceInspection: Number(i.uses_since_inspection ?? 0),
        },
        today,
      );
      return {
        id: i.id,
        assetTag: i.asset_tag,
        kindName: i.kind_name,
        locationName: i.location_name,
        state: due.state,
        dueOn: due.dueOn,
        usesLeft: due.usesLeft,
        reason: due.reason,
      };
    })
    .filter((i): i is OverviewDueItem => i.state === 'overdue' || i.state === 'due_soon')
    .sort((a, b) => (a.dueOn ?? '9999').localeCompare(b.dueOn ?? '9999') || a.assetTag.localeCompare(b.assetTag));
  const overdue = dueItems.filter((i) => i.state === 'overdue');
  const dueSoon = dueItems.filter((i) => i.state === 'due_soon');

  const productById = new Map(products.map((p) => [p.id, p]));
  const litres = monthStarts.slice(0, USAGE_MONTHS).map(() => new Map<string, number>());
  for (const u of usage) {
    const product = productById.get(u.productId);
    const month = litres[u.monthIndex];
    if (!month || !product) continue;
    month.set(product.kind, (month.get(product.kind) ?? 0) + (u.packs * product.pack_size_ml) / 1000);
  }
  // Kinds as a list, in a fixed order, so every month reads the same way.
  const months = monthStarts.slice(0, USAGE_MONTHS).map((start, i) => {
    const byKind = [...(litres[i] ?? new Map<string, number>())]
      .map(([kind, l]) => ({ kind, litres: round2(l) }))
      .sort((a, b) => a.kind.localeCompare(b.kind));
    return { month: start.slice(0, 7), byKind, totalLitres: round2(byKind.reduce((n, k) => n + k.litres, 0)) };
  });

  const byEngineer = new Map<number, { magnitudeMs2: number | null; minutes: number }[]>();
  for (const a of agitations ?? []) byEngineer.set(a.memberId, [...(byEngineer.get(a.memberId) ?? []), a]);
  const hav =
    agitations === null
      ? null
      : engineers
          .filter((e) => havOf === undefined || e.member_id === havOf)
          .map((e) => ({ memberId: e.member_id, name: e.name, ...havDay(byEngineer.get(e.member_id) ?? []) }))
          .sort((a, b) => b.points - a.points || a.name.localeCompare(b.name));

  return {
    today,
    timeZone,
    vans: vanRows,
    vansDue: vanRows.filter((v) => v.nextDue && v.nextDue.state !== 'ok').length,
    kit: {
      overdueCount: overdue.length,
      dueSoonCount: dueSoon.length,
      overdue: overdue.slice(0, FIRST_FEW),
      dueSoon: dueSoon.slice(0, FIRST_FEW),
    },
    expiringBatches: {
      withinDays: EXPIRY_WINDOW_DAYS,
      count: batches.all.length,
      packs: batches.all.reduce((n, b) => n + b.packs, 0),
      batches: batches.all
        .slice(0, FIRST_FEW)
        .map((b) => ({ ...b, expired: b.expiresOn < today, places: batches.placesOf.get(b.batchId) ?? [] })),
    },
    jobsThisMonth: { month: today.slice(0, 7), ...jobs },
    usageByMonth: months,
    reminders,
    hav: hav && { day: today, engineers: hav },
  };
}

function round2(n: number) {
  return Math.round(n * 100) / 100;
}
