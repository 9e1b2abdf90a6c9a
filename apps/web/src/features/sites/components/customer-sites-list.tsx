import { Link } from 'react-router-dom';
import { daysBetween, type Customer, type SiteListRow } from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';
import { paths } from '@/config/paths';
import { formatCalendarDate } from '@/lib/format';

function NextCheck({ on, today }: { on: string | null; today: string }) {
  if (!on) return <span className="text-sm text-ink-muted">No check date yet</span>;
  const days = daysBetween(today, on);
  if (days < 0) return <Badge tone="danger">Check overdue ({formatCalendarDate(on)})</Badge>;
  if (days <= 30) return <Badge tone="warn">Check due {formatCalendarDate(on)}</Badge>;
  return <span className="text-sm text-ink-muted">Next check {formatCalendarDate(on)}</span>;
}

/** Customers with their sites; each site links to its page of jobs and checks. */
export function CustomerSitesList({
  customers,
  sites,
  today,
  filter,
}: {
  customers: Customer[];
  sites: SiteListRow[];
  today: string;
  filter: string;
}) {
  const q = filter.trim().toLowerCase();
  const byCustomer = new Map<number, SiteListRow[]>();
  for (const s of sites) byCustomer.set(s.customer.id, [...(byCustomer.get(s.customer.id) ?? []), s]);
  const shown = customers.filter(
    (c) =>
      !q ||
      c.name.toLowerCase().includes(q) ||
      (byCustomer.get(c.id) ?? []).some((s) => `${s.address} ${s.postcode ?? ''}`.toLowerCase().includes(q)),
  );
  if (shown.length === 0)
    return (
      <p className="text-ink-muted">
        {customers.length === 0 ? 'No customers yet. Add one when booking a job.' : 'No customer or site matches.'}
      </p>
    );
  return (
    <ul className="divide-y divide-line">
      {shown.map((c) => (
        <li key={c.id} className="py-3 first:pt-0">
          <p className="font-semibold">{c.name}</p>
          <p className="text-sm text-ink-muted">
            {[c.contact, c.phone, c.email].filter(Boolean).join(' · ') || 'No contact details'}
          </p>
          <ul className="mt-2 space-y-1">
            {(byCustomer.get(c.id) ?? []).map((s) => (
              <li key={s.id}>
                <Link
                  to={paths.site.getHref(s.id)}
                  className="flex min-h-12 flex-wrap items-center justify-between gap-2 rounded-md px-2 hover:bg-brand-50"
                >
                  <span className="font-semibold text-brand-700 underline underline-offset-4">
                    {s.address}
                    {s.postcode ? `, ${s.postcode}` : ''}
                  </span>
                  <NextCheck on={s.nextCheckOn} today={today} />
                </Link>
              </li>
            ))}
            {(byCustomer.get(c.id) ?? []).length === 0 ? (
              <li className="text-sm text-ink-muted">No sites yet.</li>
            ) : null}
          </ul>
        </li>
      ))}
    </ul>
  );
}
