import { z } from 'zod';
import { addDays, calendarDateSchema, daysBetween, type CalendarDate } from '../lib/calendar-date.ts';
import { havDay } from '../jobs/job-sheet.ts';
import { HAV_ACTION_POINTS, HAV_LIMIT_POINTS } from '../jobs/water-tests.ts';

/*
 * The hand-arm vibration register: each engineer's daily exposure points over whole weeks, from the
 * agitations recorded on their jobs (HSE's points system: points = 2 x a^2 x hours, so 100 points a day is
 * the exposure action value of 2.5 m/s² A(8) and 400 the exposure limit value of 5 m/s² A(8): Control of
 * Vibration at Work Regulations 2005, regulation 4; HSE L140 "Hand-arm vibration" and INDG175).
 *
 * Health surveillance (regulation 7): an employer must provide it where a worker is likely to be exposed
 * at or above the exposure action value (or the risk assessment shows a risk to health). A day at or over
 * 100 points in the period is taken here as "likely to be exposed", and a day over 400 as the limit value
 * broken (regulation 6(4): act at once). The register only shows what Heatfleet recorded (agitation); the
 * firm's own assessment counts every other tool.
 */

export const HAV_REGISTER_MAX_WEEKS = 52;

export const havRegisterQuerySchema = z.strictObject({
  weeks: z.coerce
    .number({ error: 'Weeks must be a whole number.' })
    .int({ error: 'Weeks must be a whole number.' })
    .min(1, { error: 'Show at least 1 week.' })
    .max(HAV_REGISTER_MAX_WEEKS, { error: `Show at most ${HAV_REGISTER_MAX_WEEKS} weeks.` })
    .default(12),
  /** A day in the last week shown; the firm's today when left out. */
  to: calendarDateSchema.optional(),
});
export type HavRegisterQuery = z.infer<typeof havRegisterQuerySchema>;

export const surveillanceStates = ['not_indicated', 'needed', 'over_limit'] as const;
export type SurveillanceState = (typeof surveillanceStates)[number];
export const surveillanceLabels: Record<SurveillanceState, string> = {
  not_indicated: 'Not indicated',
  needed: 'Health surveillance needed',
  over_limit: 'Over the limit value',
};

const weekSchema = z.object({
  weekStart: z.string(),
  days: z.array(z.object({ day: z.string(), points: z.number() })),
  highestDayPoints: z.number(),
  daysOverAction: z.number(),
  daysOverLimit: z.number(),
});

export const havRegisterEngineerSchema = z.object({
  memberId: z.number(),
  name: z.string(),
  weeks: z.array(weekSchema),
  daysRecorded: z.number(),
  daysOverAction: z.number(),
  daysOverLimit: z.number(),
  highestDayPoints: z.number(),
  surveillance: z.enum(surveillanceStates),
  reason: z.string(),
});
export type HavRegisterEngineer = z.infer<typeof havRegisterEngineerSchema>;

export const havRegisterResponseSchema = z.object({
  from: z.string(),
  to: z.string(),
  weekStarts: z.array(z.string()),
  actionPoints: z.number(),
  limitPoints: z.number(),
  engineers: z.array(havRegisterEngineerSchema),
});
export type HavRegisterResponse = z.infer<typeof havRegisterResponseSchema>;

/** The Monday on or before a day (weeks run Monday to Sunday, as ISO 8601 counts them). */
export function weekStartOf(day: CalendarDate): CalendarDate {
  const weekday = new Date(`${day}T00:00:00Z`).getUTCDay(); // 0 = Sunday
  return addDays(day, -((weekday + 6) % 7));
}

export interface HavAgitation {
  memberId: number;
  day: CalendarDate;
  magnitudeMs2: number | null;
  minutes: number;
}

/**
 * The register over `weeks` whole weeks ending with the week of `to`: each engineer's points per day
 * (the day's agitations through `havDay`, the sheet's own sum), days at or over the action value and
 * over the limit value, and whether health surveillance is indicated. Engineers with nothing recorded
 * are listed too (the owner sees who is clear), those needing action first.
 */
export function havRegister(input: {
  to: CalendarDate;
  weeks: number;
  engineers: { memberId: number; name: string }[];
  agitations: HavAgitation[];
}): HavRegisterResponse {
  const from = addDays(weekStartOf(input.to), -7 * (input.weeks - 1));
  const to = addDays(weekStartOf(input.to), 6);
  const weekStarts = Array.from({ length: input.weeks }, (_, i) => addDays(from, 7 * i));
  const byMember = new Map<number, Map<CalendarDate, HavAgitation[]>>();
  for (const a of input.agitations) {
    if (a.day < from || a.day > to) continue;
    const days = byMember.get(a.memberId) ?? new Map<CalendarDate, HavAgitation[]>();
    days.set(a.day, [...(days.get(a.day) ?? []), a]);
    byMember.set(a.memberId, days);
  }
  const engineers = input.engineers.map(({ memberId, name }) => {
    const days = [...(byMember.get(memberId) ?? new Map<CalendarDate, HavAgitation[]>()).entries()]
      .map(([day, list]) => ({ day, points: havDay(list).points }))
      .filter((d) => d.points > 0)
      .sort((a, b) => a.day.localeCompare(b.day));
    const weeks = weekStarts.map((weekStart) => {
      const inWeek = days.filter((d) => d.day >= weekStart && daysBetween(weekStart, d.day) < 7);
      return {
        weekStart,
        days: inWeek,
        highestDayPoints: Math.max(0, ...inWeek.map((d) => d.points)),
        daysOverAction: inWeek.filter((d) => d.points >= HAV_ACTION_POINTS).length,
        daysOverLimit: inWeek.filter((d) => d.points > HAV_LIMIT_POINTS).length,
      };
    });
    const daysOverAction = days.filter((d) => d.points >= HAV_ACTION_POINTS).length;
    const daysOverLimit = days.filter((d) => d.points > HAV_LIMIT_POINTS).length;
    const highestDayPoints = Math.max(0, ...days.map((d) => d.points));
    const surveillance: SurveillanceState = daysOverLimit ? 'over_limit' : daysOverAction ? 'needed' : 'not_indicated';
    const plural = (n: number) => `${n} day${n === 1 ? '' : 's'}`;
    const reason =
      surveillance === 'over_limit'
        ? `${plural(daysOverLimit)} over the limit value of ${HAV_LIMIT_POINTS} points: stop the exposure and review at once (regulation 6); health surveillance needed (regulation 7).`
        : surveillance === 'needed'
          ? `${plural(daysOverAction)} at or over the exposure action value of ${HAV_ACTION_POINTS} points: health surveillance needed (regulation 7) and exposure reduced (regulation 6).`
          : days.length
            ? `Every day under ${HAV_ACTION_POINTS} points (highest ${highestDayPoints}).`
            : 'No vibration recorded in these weeks.';
    return {
      memberId,
      name,
      weeks,
      daysRecorded: days.length,
      daysOverAction,
      daysOverLimit,
      highestDayPoints,
      surveillance,
      reason,
    };
  });
  const rank: Record<SurveillanceState, number> = { over_limit: 0, needed: 1, not_indicated: 2 };
  engineers.sort(
    (a, b) =>
      rank[a.surveillance] - rank[b.surveillance] ||
      b.highestDayPoints - a.highestDayPoints ||
      a.name.localeCompare(b.name),
  );
  return { from, to, weekStarts, actionPoints: HAV_ACTION_POINTS, limitPoints: HAV_LIMIT_POINTS, engineers };
}
