import { z } from 'zod';
import { addMonths, calendarDateWithin, dateRanges, type CalendarDate } from '../lib/calendar-date.ts';
import { inhibitorCheck } from '../jobs/water-tests.ts';
import { plainText } from '../lib/text.ts';

/** A year between inhibitor checks when the system is protected, as after a clean (DEVELOPERS.md, Product rules). */
export const CHECK_INTERVAL_MONTHS = 12;
/**
 * A visit that still fails (no top-up, or the re-test still out of range) is followed up within a month
 * rather than a year: unprotected water corrodes the system meanwhile (common practice (no source)).
 */
export const FAILED_CHECK_REVISIT_MONTHS = 1;
/** At most this many packs are topped up in one visit (a bound against a slip of the thumb). */
export const MAX_TOP_UP_PACKS = 10;

const reading = (label: string) =>
  z
    .number({ error: `${label} must be a number.` })
    .min(0, { error: `${label} cannot be negative.` })
    .max(100_000, { error: `${label} must be at most 100,000.` });

export const inhibitorCheckVisitInputSchema = z.strictObject({
  checkedOn: calendarDateWithin('The check date', dateRanges.done),
  inhibitorProductId: z.number({ error: 'Choose the inhibitor.' }).int().positive({ error: 'Choose the inhibitor.' }),
  inhibitorReading: reading('The inhibitor reading'),
  systemTdsPpm: z
    .number({ error: 'TDS must be a number of ppm.' })
    .min(0, { error: 'TDS cannot be negative.' })
    .max(5000, { error: 'TDS must be at most 5,000 ppm.' })
    .nullable()
    .optional(),
  notes: plainText('Notes', 1000).nullable().optional(),
  /** Inhibitor added in the same visit, taken off the van's stock (first expiry first). */
  topUp: z
    .strictObject({
      vanId: z.number({ error: 'Choose the van the top-up came from.' }).int().positive(),
      packs: z
        .number({ error: 'Packs must be a whole number.' })
        .int({ error: 'Packs must be a whole number.' })
        .min(1, { error: 'Top up at least 1 pack.' })
        .max(MAX_TOP_UP_PACKS, { error: `Top up at most ${MAX_TOP_UP_PACKS} packs in one visit.` }),
    })
    .optional(),
  /** The reading taken again after the top-up has circulated. */
  retestReading: reading('The re-test reading').nullable().optional(),
  /** Send the customer a short note of the result (when they have an e-mail address). */
  emailCustomer: z.boolean({ error: 'Say whether to e-mail the customer.' }).default(true),
});
export type InhibitorCheckVisitInput = z.infer<typeof inhibitorCheckVisitInputSchema>;

export interface InhibitorVisitOutcome {
  firstResult: 'pass' | 'fail';
  retestResult: 'pass' | 'fail' | null;
  /** The visit's result: the re-test's when there was one. */
  result: 'pass' | 'fail';
  nextCheckOn: CalendarDate;
}

/**
 * A check visit's outcome: each reading against the product's target range, the re-test deciding when
 * there was one, and the next check a year on when it passed, a month on when it still fails.
 */
export function inhibitorVisitOutcome(
  checkedOn: CalendarDate,
  range: { min: number; max: number },
  firstReading: number,
  retestReading: number | null | undefined,
): InhibitorVisitOutcome {
  const judge = (r: number) => (inhibitorCheck(r, range) === 'pass' ? 'pass' : 'fail');
  const firstResult = judge(firstReading);
  const retestResult = retestReading == null ? null : judge(retestReading);
  const result = retestResult ?? firstResult;
  const nextCheckOn = addMonths(checkedOn, result === 'pass' ? CHECK_INTERVAL_MONTHS : FAILED_CHECK_REVISIT_MONTHS);
  return { firstResult, retestResult, result, nextCheckOn };
}
