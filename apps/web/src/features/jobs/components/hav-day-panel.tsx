import { HAV_ACTION_POINTS, HAV_LIMIT_POINTS, type HavLevel, type JobSheet } from '@heatfleet/domain';
import { formatCalendarDate } from '@/lib/format';

// Past the action value the colour is strong enough to read across a loft; nearing it is amber.
const looks: Record<HavLevel, { box: string; word: string }> = {
  low: { box: 'border-ok-700 bg-ok-50 text-ink', word: 'Below the action value' },
  nearing_action: { box: 'border-ember-500 bg-ember-100 text-ink', word: 'Nearing the action value' },
  above_action: { box: 'border-danger-700 bg-danger-50 text-danger-700', word: 'Over the action value' },
  nearing_limit: { box: 'border-danger-700 bg-danger-700 text-white', word: 'Nearing the limit value' },
  above_limit: { box: 'border-danger-700 bg-danger-700 text-white', word: 'Over the limit value' },
};

/** The engineer's hand-arm vibration for the whole day, across all their jobs (HSE points system). */
export function HavDayPanel({ hav }: { hav: JobSheet['hav'] }) {
  const look = looks[hav.level];
  const warn = hav.level !== 'low';
  const share = Math.min(100, (hav.points / HAV_LIMIT_POINTS) * 100);
  return (
    <div className="space-y-3">
      <div
        role={warn ? 'alert' : 'status'}
        aria-label="Vibration today"
        className={`space-y-1 rounded-lg border-2 p-3 ${look.box}`}
      >
        <p className="flex flex-wrap items-baseline gap-x-2">
          <span className="text-3xl font-bold tabular-nums">{hav.points}</span>
          <span className="font-semibold">points · {look.word}</span>
        </p>
        <p>{hav.message}</p>
      </div>
      <div aria-hidden="true" className="relative h-4 overflow-hidden rounded-full bg-line">
        <div className={`h-full ${warn ? 'bg-danger-700' : 'bg-ok-700'}`} style={{ width: `${share}%` }} />
        <div
          className="absolute inset-y-0 w-0.5 bg-ink"
          style={{ left: `${(HAV_ACTION_POINTS / HAV_LIMIT_POINTS) * 100}%` }}
        />
      </div>
      <p className="text-sm text-ink-muted">
        {hav.engineerName ?? 'The engineer'}, {formatCalendarDate(hav.day)}. Points = 2 × vibration² × hours per tool;{' '}
        {HAV_ACTION_POINTS} is the exposure action value, {HAV_LIMIT_POINTS} the limit value (Control of Vibration at
        Work Regulations 2005).
      </p>
    </div>
  );
}

export function havSummary(hav: JobSheet['hav']): string {
  return `${hav.points} points today`;
}
