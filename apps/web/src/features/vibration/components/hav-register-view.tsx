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

/** Every day with vibration recorded, newest first, with its points: what the record of exposure keeps per day. */
function DayPoints({ engineer, action, limit }: { engineer: HavRegisterEngineer; action: number; limit: number }) {
  const days = engineer.weeks.flatMap((w) => w.days).sort((a, b) => b.day.localeCompare(a.day));
  if (days.length === 0) return null;
  return (
    <details className="mt-1">
      <summary className="flex min-h-12 cursor-pointer items-center font-semibold text-brand-700">
        Points per day<span className="sr-only"> for {engineer.name}</span>
      </summary>
      <ul aria-label={`Points per day, ${engineer.name}`} className="grid grid-cols-2 gap-x-4 text-sm sm:grid-cols-4">
        {days.map((d) => (
          <li
            key={d.day}
            className={d.points > limit ? 'text-danger-700' : d.points >= action ? 'font-semibold text-ember-700' : ''}
          >
            {formatCalendarDate(d.day)}: {d.points} points
          </li>
        ))}
      </ul>
    </details>
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
            <DayPoints engineer={e} action={action} limit={limit} />
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
