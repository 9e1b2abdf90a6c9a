import { describe, expect, it } from 'vitest';
import { inspectionDue, type InspectionRule } from './inspection-due.ts';

// The rule of DEVELOPERS.md, Product rules (inspection due): next due = last inspection + interval, or after N uses,
// whichever comes first; a due-soon window; overdue. The intervals below are example rules
// (common practice (no source)), not figures from a standard.
const everyNinetyDays: InspectionRule = { intervalDays: 90, intervalUses: null, dueSoonDays: 14 };
const afterEachUse: InspectionRule = { intervalDays: null, intervalUses: 1, dueSoonDays: 7 };
const thirtyDaysOrTenUses: InspectionRule = { intervalDays: 30, intervalUses: 10, dueSoonDays: 5 };
// The default "Magnet set" kind (default-item-kinds.ts): cleaned and checked after every job.
const magnetSet: InspectionRule = { intervalDays: null, intervalUses: 1, dueSoonDays: 0 };
const everyThreeUses: InspectionRule = { intervalDays: null, intervalUses: 3, dueSoonDays: 0 };
const everyThirtyDaysNoWindow: InspectionRule = { intervalDays: 30, intervalUses: null, dueSoonDays: 0 };
const noRule: InspectionRule = { intervalDays: null, intervalUses: null, dueSoonDays: 7 };

const cases: [
  string,
  InspectionRule,
  { lastInspectedOn: string | null; usesSinceInspection: number },
  string,
  { state: string; dueOn: string | null; usesLeft: number | null; reason: string | null },
][] = [
  [
    'days: well inside the interval',
    everyNinetyDays,
    { lastInspectedOn: '2026-09-01', usesSinceInspection: 40 },
    '2026-10-01',
    { state: 'ok', dueOn: '2026-11-30', usesLeft: null, reason: 'days' },
  ],
  [
    'days: 14 days before due is due soon',
    everyNinetyDays,
    { lastInspectedOn: '2026-09-01', usesSinceInspection: 0 },
    '2026-11-16',
    { state: 'due_soon', dueOn: '2026-11-30', usesLeft: null, reason: 'days' },
  ],
  [
    'days: 15 days before due is still ok',
    everyNinetyDays,
    { lastInspectedOn: '2026-09-01', usesSinceInspection: 0 },
    '2026-11-15',
    { state: 'ok', dueOn: '2026-11-30', usesLeft: null, reason: 'days' },
  ],
  [
    'days: the due day itself is due soon, not overdue',
    everyNinetyDays,
    { lastInspectedOn: '2026-09-01', usesSinceInspection: 0 },
    '2026-11-30',
    { state: 'due_soon', dueOn: '2026-11-30', usesLeft: null, reason: 'days' },
  ],
  [
    'days: the day after is overdue',
    everyNinetyDays,
    { lastInspectedOn: '2026-09-01', usesSinceInspection: 0 },
    '2026-12-01',
    { state: 'overdue', dueOn: '2026-11-30', usesLeft: null, reason: 'days' },
  ],
  [
    'days: across a leap day (2028-02-29)',
    everyNinetyDays,
    { lastInspectedOn: '2028-01-01', usesSinceInspection: 0 },
    '2028-03-01',
    { state: 'ok', dueOn: '2028-03-31', usesLeft: null, reason: 'days' },
  ],
  // 2026-12-01 + 90 days: 30 to 31 Dec, 31 in Jan, 28 in Feb, 1 in Mar = 2027-03-01 (worked by hand).
  [
    'never inspected: counts from the day in service',
    everyNinetyDays,
    { lastInspectedOn: null, usesSinceInspection: 0 },
    '2026-12-01',
    { state: 'ok', dueOn: '2027-03-01', usesLeft: null, reason: 'days' },
  ],
  [
    // Issue 14: "after 1 use, due soon 0 days" read due soon for ever, even straight after an inspection.
    'uses: after each job, unused since inspection is in date',
    afterEachUse,
    { lastInspectedOn: '2026-11-01', usesSinceInspection: 0 },
    '2026-12-01',
    { state: 'ok', dueOn: null, usesLeft: 1, reason: 'uses' },
  ],
  [
    'uses: the magnet set (after 1 use, due soon 0 days) is in date right after its inspection',
    magnetSet,
    { lastInspectedOn: '2026-12-01', usesSinceInspection: 0 },
    '2026-12-01',
    { state: 'ok', dueOn: null, usesLeft: 1, reason: 'uses' },
  ],
  [
    'uses: the magnet set is overdue after its one use',
    magnetSet,
    { lastInspectedOn: '2026-12-01', usesSinceInspection: 1 },
    '2026-12-01',
    { state: 'overdue', dueOn: null, usesLeft: 0, reason: 'uses' },
  ],
  [
    'uses: every 3 uses, unused is in date',
    everyThreeUses,
    { lastInspectedOn: '2026-11-01', usesSinceInspection: 0 },
    '2026-12-01',
    { state: 'ok', dueOn: null, usesLeft: 3, reason: 'uses' },
  ],
  [
    'uses: every 3 uses, one use made is in date',
    everyThreeUses,
    { lastInspectedOn: '2026-11-01', usesSinceInspection: 1 },
    '2026-12-01',
    { state: 'ok', dueOn: null, usesLeft: 2, reason: 'uses' },
  ],
  [
    'uses: every 3 uses, one left is due soon',
    everyThreeUses,
    { lastInspectedOn: '2026-11-01', usesSinceInspection: 2 },
    '2026-12-01',
    { state: 'due_soon', dueOn: null, usesLeft: 1, reason: 'uses' },
  ],
  [
    'days with no window (due soon 0 days): the day before the due day is in date',
    everyThirtyDaysNoWindow,
    { lastInspectedOn: '2026-11-01', usesSinceInspection: 0 },
    '2026-11-30',
    { state: 'ok', dueOn: '2026-12-01', usesLeft: null, reason: 'days' },
  ],
  [
    'days with no window: the due day itself is due (due soon), the day after overdue',
    everyThirtyDaysNoWindow,
    { lastInspectedOn: '2026-11-01', usesSinceInspection: 0 },
    '2026-12-01',
    { state: 'due_soon', dueOn: '2026-12-01', usesLeft: null, reason: 'days' },
  ],
  [
    'days with no window: the day after the due day is overdue',
    everyThirtyDaysNoWindow,
    { lastInspectedOn: '2026-11-01', usesSinceInspection: 0 },
    '2026-12-02',
    { state: 'overdue', dueOn: '2026-12-01', usesLeft: null, reason: 'days' },
  ],
  [
    'uses: after each job, one use makes it overdue',
    afterEachUse,
    { lastInspectedOn: '2026-11-01', usesSinceInspection: 1 },
    '2026-12-01',
    { state: 'overdue', dueOn: null, usesLeft: 0, reason: 'uses' },
  ],
  [
    'both: uses run out first',
    thirtyDaysOrTenUses,
    { lastInspectedOn: '2026-11-20', usesSinceInspection: 10 },
    '2026-11-25',
    { state: 'overdue', dueOn: '2026-12-20', usesLeft: 0, reason: 'uses' },
  ],
  [
    'both: days run out first',
    thirtyDaysOrTenUses,
    { lastInspectedOn: '2026-10-01', usesSinceInspection: 3 },
    '2026-11-05',
    { state: 'overdue', dueOn: '2026-10-31', usesLeft: 7, reason: 'days' },
  ],
  [
    'both: one use left is due soon even with days to spare',
    thirtyDaysOrTenUses,
    { lastInspectedOn: '2026-11-20', usesSinceInspection: 9 },
    '2026-11-21',
    { state: 'due_soon', dueOn: '2026-12-20', usesLeft: 1, reason: 'uses' },
  ],
  [
    'both: neither close',
    thirtyDaysOrTenUses,
    { lastInspectedOn: '2026-11-20', usesSinceInspection: 2 },
    '2026-11-21',
    { state: 'ok', dueOn: '2026-12-20', usesLeft: 8, reason: 'days' },
  ],
  [
    'more uses than the interval still reads 0 left',
    thirtyDaysOrTenUses,
    { lastInspectedOn: '2026-11-20', usesSinceInspection: 14 },
    '2026-11-21',
    { state: 'overdue', dueOn: '2026-12-20', usesLeft: 0, reason: 'uses' },
  ],
  [
    'no rule: never due',
    noRule,
    { lastInspectedOn: null, usesSinceInspection: 99 },
    '2026-12-01',
    { state: 'no_rule', dueOn: null, usesLeft: null, reason: null },
  ],
];

describe('inspectionDue', () => {
  it.each(cases)('%s', (_name, rule, item, today, expected) => {
    expect(inspectionDue(rule, { ...item, inServiceSince: '2026-12-01' }, today)).toEqual(expected);
  });
});
