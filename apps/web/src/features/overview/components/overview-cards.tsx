import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatPacks, stockHealthLabels, type Overview, type OverviewVan } from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';
import { WindowedList } from '@/components/ui/windowed-list';
import { paths } from '@/config/paths';
import { formatCalendarDate, formatDateTime, formatMonth } from '@/lib/format';

/** A card whose heading is a link to the list it summarises: the whole heading is the touch target. */
export function LinkCard({
  title,
  to,
  linkLabel,
  children,
}: {
  title: string;
  to: string;
  linkLabel: string;
  children: ReactNode;
}) {
  return (
    <section className="flex flex-col rounded-xl border border-line bg-card p-4 shadow-sm sm:p-6">
      <h2 className="text-lg font-bold text-brand-900">{title}</h2>
      <div className="mt-3 flex-1">{children}</div>
      <Link
        to={to}
        className="mt-4 inline-flex min-h-12 items-center font-semibold text-brand-700 underline underline-offset-4"
      >
        {linkLabel}
      </Link>
    </section>
  );
}

function Figure({
  value,
  label,
  tone = 'neutral',
}: {
  value: number;
  label: string;
  tone?: 'neutral' | 'warn' | 'danger' | 'ok';
}) {
  const colour =
    tone === 'danger'
      ? 'text-danger-700'
      : tone === 'warn'
        ? 'text-ember-700'
        : tone === 'ok'
          ? 'text-ok-700'
          : 'text-brand-900';
  return (
    <div>
      <p className={`text-3xl font-bold tabular-nums ${colour}`}>{value}</p>
      <p className="text-sm text-ink-muted">{label}</p>
    </div>
  );
}

function vanConcern(v: OverviewVan) {
  return (
    v.stock.outOfStock * 100 +
    v.stock.belowMinimum * 10 +
    v.stock.belowTarget * 2 +
    (v.nextDue?.state === 'overdue' ? 5 : v.nextDue?.state === 'due_soon' ? 1 : 0)
  );
}

const healthTone = {
  empty: 'danger',
  short_for_jobs: 'danger',
  below_minimum: 'warn',
  below_target: 'warn',
  ok: 'ok',
  no_par: 'neutral',
} as const;

/**
 * A van's stock by the domain's one health rule (never packs added across products): the worst few products that
 * need something, as the answer lists them, and how many more (the van's page, this row's link, has them all).
 */
function VanStockHealth({ stock }: { stock: OverviewVan['stock'] }) {
  const more = stock.productsNotOk - stock.products.length;
  return (
    <span className="block space-y-1">
      <Badge tone={healthTone[stock.health]}>
        {stock.health === 'ok'
          ? 'Stock OK'
          : stock.health === 'no_par'
            ? 'No levels set'
            : stockHealthLabels[stock.health]}
      </Badge>
      {stock.products.length ? (
        <span className="block text-sm text-ink">
          {stock.products.map((p) => (
            <span key={p.productId} className="block [overflow-wrap:anywhere]">
              {p.name}: {formatPacks(p.usable, p.packSizeMl)}
              {p.target !== null ? ` of ${p.target}` : ''}
              {p.booked > 0 ? `, ${p.booked} booked` : ''} ({stockHealthLabels[p.health].toLowerCase()})
            </span>
          ))}
          {more > 0 ? (
            <span className="block text-ink-muted">
              and {more} more {more === 1 ? 'product' : 'products'} to restock
            </span>
          ) : null}
        </span>
      ) : null}
    </span>
  );
}

/** Stock health and MOT or service per van, the vans that need something first. */
/** Most concerning first; windowed, so 200 vans put only the rows on screen into the page (issue 16). */
export function VanHealthList({ vans }: { vans: OverviewVan[] }) {
  if (vans.length === 0) return <p className="text-ink-muted">No vans yet.</p>;
  const sorted = [...vans].sort((a, b) => vanConcern(b) - vanConcern(a) || a.name.localeCompare(b.name));
  return (
    <WindowedList
      items={sorted}
      itemKey={(v) => v.id}
      estimateRowPx={76}
      label="Vans, most concerning first"
      renderItem={(v) => (
        <Link
          to={paths.van.getHref(v.id)}
          className="flex min-h-12 flex-col gap-1 py-3 hover:bg-brand-50 sm:flex-row sm:items-center sm:justify-between"
        >
          <span>
            <span className="font-semibold text-brand-700 underline underline-offset-4">{v.name}</span>
            <span className="block text-sm text-ink-muted">
              {[v.registration, v.engineerName ?? 'No engineer'].filter(Boolean).join(' · ')}
            </span>
          </span>
          <span className="flex flex-wrap gap-1">
            <VanStockHealth stock={v.stock} />
            {v.nextDue && v.nextDue.state !== 'ok' ? (
              <Badge tone={v.nextDue.state === 'overdue' ? 'danger' : 'warn'}>
                {v.nextDue.what} {v.nextDue.state === 'overdue' ? 'overdue' : 'due'} {formatCalendarDate(v.nextDue.on)}
              </Badge>
            ) : null}
          </span>
        </Link>
      )}
    />
  );
}

export function KitDueSummary({ kit }: { kit: Overview['kit'] }) {
  const items = [...kit.overdue, ...kit.dueSoon].slice(0, 10);
  return (
    <>
      <div className="grid grid-cols-2 gap-3">
        <Figure value={kit.overdueCount} label="overdue for inspection" tone={kit.overdueCount ? 'danger' : 'ok'} />
        <Figure value={kit.dueSoonCount} label="due soon" tone={kit.dueSoonCount ? 'warn' : 'ok'} />
      </div>
      {items.length > 0 ? (
        <ul className="mt-3 space-y-1 text-sm">
          {items.map((i) => (
            <li key={i.id}>
              <Link
                to={paths.kitItem.getHref(i.id)}
                className="font-semibold text-brand-700 underline underline-offset-4"
              >
                {i.assetTag}
              </Link>{' '}
              {i.kindName}
              {i.locationName ? `, ${i.locationName}` : ''}:{' '}
              <span className={i.state === 'overdue' ? 'font-semibold text-danger-700' : 'text-ember-700'}>
                {i.state === 'overdue' ? 'overdue' : 'due soon'}
                {i.reason === 'uses' ? ' (uses)' : i.dueOn ? ` (${formatCalendarDate(i.dueOn)})` : ''}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
    </>
  );
}

export function ExpiringBatchesSummary({ expiring }: { expiring: Overview['expiringBatches'] }) {
  return (
    <>
      <Figure
        value={expiring.count}
        label={`batch${expiring.count === 1 ? '' : 'es'} expired or expiring within ${expiring.withinDays} days (${expiring.packs} packs)`}
        tone={expiring.count ? 'warn' : 'ok'}
      />
      {expiring.batches.length > 0 ? (
        <ul className="mt-3 space-y-1 text-sm">
          {expiring.batches.map((b) => (
            <li key={b.batchId}>
              <span className="font-semibold">{b.productName}</span> lot {b.lotNumber}:{' '}
              <span className={b.expired ? 'font-semibold text-danger-700' : 'text-ember-700'}>
                {b.expired ? 'expired' : 'expires'} {formatCalendarDate(b.expiresOn)}
              </span>
              <span className="block text-ink-muted">
                {b.places.map((p) => `${p.quantity} at ${p.name}`).join(', ')}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
    </>
  );
}

export function JobsThisMonthSummary({ jobs }: { jobs: Overview['jobsThisMonth'] }) {
  const month = formatMonth(jobs.month, 'long');
  return (
    <>
      <p className="mb-2 text-sm text-ink-muted">{month}</p>
      <div className="grid grid-cols-2 gap-3">
        <Figure value={jobs.planned} label="booked" />
        <Figure value={jobs.completed} label="completed" tone="ok" />
      </div>
    </>
  );
}

export function RecentReminders({
  reminders,
  timeZone,
}: {
  reminders: NonNullable<Overview['reminders']>;
  timeZone: string;
}) {
  if (reminders.length === 0) return <p className="text-ink-muted">No reminders yet.</p>;
  return (
    <ul className="space-y-2 text-sm">
      {reminders.map((r) => (
        <li key={r.id}>
          <span className="block">{r.summary}</span>
          <span className="text-ink-muted">{formatDateTime(r.createdAt, timeZone)}</span>
        </li>
      ))}
    </ul>
  );
}
