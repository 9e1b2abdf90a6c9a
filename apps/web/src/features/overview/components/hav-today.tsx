import type { HavEngineer } from '@heatfleet/domain';
import { Badge, type BadgeTone } from '@/components/ui/badge';

const levelTone: Record<HavEngineer['level'], BadgeTone> = {
  low: 'ok',
  nearing_action: 'warn',
  above_action: 'danger',
  nearing_limit: 'danger',
  above_limit: 'danger',
};

const levelLabel: Record<HavEngineer['level'], string> = {
  low: 'Below action value',
  nearing_action: 'Nearing action value',
  above_action: 'Over action value',
  nearing_limit: 'Nearing limit value',
  above_limit: 'Over limit value',
};

/** Hand-arm vibration points today (HSE points system: 100 is the exposure action value, 400 the limit value). */
export function HavToday({ engineers, showNames = true }: { engineers: HavEngineer[]; showNames?: boolean }) {
  if (engineers.length === 0) return <p className="text-ink-muted">No engineers in this firm yet.</p>;
  return (
    <ul className="divide-y divide-line">
      {engineers.map((e) => (
        <li key={e.memberId} className="flex flex-col gap-1 py-3 first:pt-0 last:pb-0">
          <div className="flex flex-wrap items-center justify-between gap-2">
            {showNames ? <span className="font-semibold">{e.name}</span> : null}
            <span className="flex items-center gap-2">
              <span className="text-lg font-bold tabular-nums">{e.points}</span>
              <span className="text-sm text-ink-muted">points</span>
              <Badge tone={levelTone[e.level]}>{levelLabel[e.level]}</Badge>
            </span>
          </div>
          {e.level !== 'low' ? <p className="text-sm">{e.message}</p> : null}
        </li>
      ))}
    </ul>
  );
}
