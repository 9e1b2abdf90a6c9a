import { addDays, daysBetween, type CalendarDate } from '../lib/calendar-date.ts';

export interface InspectionRule {
  /** Inspect at least every N days; null when the kind has no time interval. */
  intervalDays: number | null;
  /** Inspect after N uses (check-ins count as uses); null when uses do not matter. */
  intervalUses: number | null;
  /** How many days before the due date an item counts as due soon. */
  dueSoonDays: number;
}

export type InspectionState = 'no_rule' | 'ok' | 'due_soon' | 'overdue';

export interface InspectionDue {
  state: InspectionState;
  /** The day the time interval runs out (null without a time interval). */
  dueOn: CalendarDate | null;
  /** Uses left before the use interval runs out (null without a use interval); 0 means due now. */
  usesLeft: number | null;
  /** What makes it due first. */
  reason: 'days' | 'uses' | null;
}

/**
 * When an item next needs inspecting: the last inspection (or, never inspected, the day it came
 * into service) plus the kind's days, or after its number of uses, whichever comes first.
 * Overdue means after the due day or with no uses left; due soon means within the window, or one use left
 * once the item has been used since its inspection. So a kind inspected after every use (a magnet set
 * cleaned after each job) reads "in date" straight after its inspection and overdue after one use; it is
 * never "due soon" for having its single use still ahead of it.
 */
export function inspectionDue(
  rule: InspectionRule,
  item: { lastInspectedOn: CalendarDate | null; inServiceSince: CalendarDate; usesSinceInspection: number },
  today: CalendarDate,
): InspectionDue {
  if (rule.intervalDays === null && rule.intervalUses === null) {
    return { state: 'no_rule', dueOn: null, usesLeft: null, reason: null };
  }
  const baseline = item.lastInspectedOn ?? item.inServiceSince;
  const dueOn = rule.intervalDays === null ? null : addDays(baseline, rule.intervalDays);
  const usesLeft = rule.intervalUses === null ? null : Math.max(0, rule.intervalUses - item.usesSinceInspection);

  const daysLeft = dueOn === null ? null : daysBetween(today, dueOn);
  const overdueByDays = daysLeft !== null && daysLeft < 0;
  const overdueByUses = usesLeft !== null && usesLeft === 0;
  const soonByDays = daysLeft !== null && daysLeft <= rule.dueSoonDays;
  const soonByUses = usesLeft !== null && usesLeft <= 1 && item.usesSinceInspection > 0;

  // Whichever comes first: uses when they have run out (or will on the next use), else days.
  const reason: InspectionDue['reason'] = overdueByUses
    ? 'uses'
    : overdueByDays
      ? 'days'
      : soonByUses
        ? 'uses'
        : soonByDays
          ? 'days'
          : dueOn
            ? 'days'
            : 'uses';
  const state: InspectionState =
    overdueByDays || overdueByUses ? 'overdue' : soonByDays || soonByUses ? 'due_soon' : 'ok';
  return { state, dueOn, usesLeft, reason };
}
