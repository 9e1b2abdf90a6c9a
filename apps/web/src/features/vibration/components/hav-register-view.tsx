import { surveillanceLabels, type HavRegisterEngineer, type HavRegisterResponse } from '@heatfleet/domain';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { formatCalendarDate } from '@/lib/format';

const tone: Record<HavRegisterEngineer['surveillance'], BadgeTone> = {
  over_limit: 'danger',
  needed: 'warn',
  not_indicated: 'ok',
};

/** "23 Nov": a week's Monday, short, for the column heads. */
const shortDay = (day: string) =>
  new Date(`${day}T00:00:00Z`).toLocaleDateString('en-GB', { timeZone: 'UTC', day: 'numeric', month: 'short' });

function WeekCell({
  week,
  action,
  limit,
}: {
  week: HavRegisterEngineer['weeks'][number];
  action: number;
  limit: number;
}) {
  if (week.days.length === 0) return <span className="text-ink-muted">–</span>;
  const over = week.daysOverLimit ? 'text-danger-700' : week.daysOverAction ? 'text-ember-700' : '';
  return (
    <span className={over}>
      <span className="font-semibold">{week.highestDayPoints}</span>
      <span className="block text-xs">
        {week.days.length} day{week.days.length === 1 ? '' : 's'}
        {week.daysOverAction ? `, ${week.daysOverAction} ≥ ${action}` : ''}
        {week.daysOverLimit ? `, ${week.daysOverLimit} > ${limit}` : ''}
      </span>
    </span>
  );
}

/** Each engineer's weeks: the highest day's points, the days recorded and the days over each value. */
export function HavRegisterView({ register }: { register: HavRegisterResponse }) {
  const { actionPoints: action, limitPoints: limit } = register;
  if (register.engineers.length === 0) return <p className="text-ink-muted">No engineers in the firm yet.</p>;
  return (
    <div className="space-y-4">
      <ul aria-label="Who needs action" className="space-y-2">
        {register.engineers.map((e) => (
          <li key={e.memberId} className="rounded-lg border border-line p-3">
            <div className="flex flex-wrap items-center justify-between gap-2">
              <span className="font-semibold">{e.name}</span>
              <Badge tone={tone[e.surveillance]}>{surveillanceLabels[e.surveillance]}</Badge>
            </div>
            <p className="text-sm">{e.reason}</p>
            <p className="text-sm text-ink-muted">
              {e.daysRecorded} day{e.daysRecorded === 1 ? '' : 's'} with vibration recorded; highest{' '}
              {e.highestDayPoints} points; {e.daysOverAction} at or over {action}; {e.daysOverLimit} over {limit}.
            </p>
          </li>
        ))}
      </ul>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Weeks per engineer, scrolls sideways">
        <table className="min-w-full text-sm">
          <caption className="sr-only">
            Highest day&apos;s points per week, {formatCalendarDate(register.from)} to {formatCalendarDate(register.to)}
          </caption>
          <thead>
            <tr>
              <th scope="col" className="px-2 py-1 text-left">
                Engineer
              </th>
              {register.weekStarts.map((w) => (
                <th key={w} scope="col" className="px-2 py-1 text-left whitespace-nowrap">
                  w/c {shortDay(w)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {register.engineers.map((e) => (
              <tr key={e.memberId} className="border-t border-line">
                <th scope="row" className="px-2 py-2 text-left font-semibold whitespace-nowrap">
                  {e.name}
                </th>
                {e.weeks.map((w) => (
                  <td key={w.weekStart} className="px-2 py-2 align-top">
                    <WeekCell week={w} action={action} limit={limit} />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
