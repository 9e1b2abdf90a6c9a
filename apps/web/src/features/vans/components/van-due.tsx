import { calendarDateIn, daysBetween, VAN_DUE_WINDOW_DAYS } from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';
import { formatCalendarDate } from '@/lib/format';

/** Days from today (in the firm's zone) to a due date: negative once it has passed. */
export function daysUntil(date: string, timeZone: string): number {
  return daysBetween(calendarDateIn(new Date(), timeZone), date);
}

/** An MOT or service date, marked once it is within the reminder window or past. */
export function VanDueDate({ label, date, timeZone }: { label: string; date: string | null; timeZone: string }) {
  if (!date) return <span className="text-ink-muted">No {label} date</span>;
  const days = daysUntil(date, timeZone);
  const text = `${label} ${formatCalendarDate(date)}`;
  if (days < 0) return <Badge tone="danger">{text} · overdue</Badge>;
  if (days <= VAN_DUE_WINDOW_DAYS)
    return (
      <Badge tone="warn">
        {text} · in {days === 0 ? 'today' : `${days} d`}
      </Badge>
    );
  return <span className="whitespace-nowrap">{text}</span>;
}
