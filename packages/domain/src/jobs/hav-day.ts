import type { HavLevel } from './job-sheet.ts';
import { vibrationPoints } from './water-tests.ts';

/** The levels of an engineer's vibration day, lowest first (see `havDay`). */
export const havLevels = [
  'low',
  'nearing_action',
  'above_action',
  'nearing_limit',
  'above_limit',
] as const satisfies readonly HavLevel[];

const round1 = (n: number) => Math.round(n * 10) / 10;

/**
 * One agitation's hand-arm vibration points (HSE points system: 2 x a^2 x hours), to one decimal
 * place as the sheet shows them; none without the tool's vibration magnitude or with no time.
 */
export function agitationPoints(magnitudeMs2: number | null, minutes: number): number {
  return magnitudeMs2 && minutes > 0 ? round1(vibrationPoints(magnitudeMs2, minutes / 60)) : 0;
}

/** The day's points once one radiator's agitation is saved in place of what it had, to one decimal place. */
export function havDayPointsIfSaved(dayPoints: number, savedPoints: number, newPoints: number): number {
  return round1(dayPoints - savedPoints + newPoints);
}
