import { z } from 'zod';
import { calendarDateWithin, dateRanges } from '../lib/calendar-date.ts';
import { singleLineName } from '../lib/text.ts';

/*
 * The in-service inspection and test of a portable electrical item, as set out by the IET Code of
 * Practice for In-service Inspection and Testing of Electrical Equipment (5th edition, 2020): a
 * visual inspection, then for Class I the protective conductor (earth) continuity, the insulation
 * resistance at 500 V d.c., and the polarity of leads with a plug and a socket-outlet. Class II has no
 * protective conductor, so no earth continuity test. The limits below are recalled from that Code
 * (from memory); the firm's competent person and the maker's instructions decide.
 */

export const equipmentClasses = ['I', 'II'] as const;
export const passFail = ['pass', 'fail'] as const;
export const polarityResults = ['pass', 'fail', 'not_applicable'] as const;

/** 0.1 ohm for the item itself, plus its supply cord's protective conductor (IET Code of Practice, from memory). */
export const EARTH_CONTINUITY_BASE_OHMS = 0.1;
/** Insulation resistance minimum at 500 V d.c., Class I (IET Code of Practice, from memory). */
export const INSULATION_MIN_CLASS_I_MOHMS = 1;
/** Insulation resistance minimum at 500 V d.c., Class II (IET Code of Practice, from memory). */
export const INSULATION_MIN_CLASS_II_MOHMS = 2;

/**
 * Resistance of one copper conductor of a flexible cord, milliohms per metre at 20 °C, by its
 * cross-section in mm² (the IET Code of Practice's table of cord resistances, from memory).
 */
export const cordMilliohmsPerMetre: readonly (readonly [sizeMm2: number, milliohmsPerMetre: number])[] = [
  [0.5, 39],
  [0.75, 26],
  [1, 19.5],
  [1.25, 15.6],
  [1.5, 13.3],
  [2.5, 7.98],
];
export const cordSizesMm2 = cordMilliohmsPerMetre.map(([size]) => size);

const ohms = (label: string, max: number, unit: string) =>
  z
    .number({ error: `${label} must be a number of ${unit}.` })
    .min(0, { error: `${label} cannot be negative.` })
    .max(max, { error: `${label} must be at most ${max} ${unit}.` })
    .nullable()
    .optional();

export const electricalTestInputSchema = z
  .strictObject({
    equipmentClass: z.enum(equipmentClasses, { error: 'Choose Class I (earthed) or Class II (double insulated).' }),
    visual: z.enum(passFail, { error: 'Say whether the visual check passed or failed.' }),
    earthContinuityOhms: ohms('Earth continuity', 100, 'ohms'),
    cordLengthM: z
      .number({ error: 'Cord length must be a number of metres.' })
      .min(0, { error: 'Cord length cannot be negative.' })
      .max(100, { error: 'Cord length must be at most 100 metres.' })
      .nullable()
      .optional(),
    cordSizeMm2: z
      .number({ error: 'Choose the cord’s conductor size in mm².' })
      .refine((n) => cordSizesMm2.includes(n), {
        error: `Cord conductor size must be one of ${cordSizesMm2.join(', ')} mm².`,
      })
      .nullable()
      .optional(),
    insulationResistanceMohms: ohms('Insulation resistance', 10_000, 'megohms'),
    polarity: z.enum(polarityResults, { error: 'Say whether polarity passed, failed or does not apply.' }),
    testerUsed: singleLineName('The tester used', { max: 80 }),
    testerCalibratedOn: calendarDateWithin('The tester’s calibration date', dateRanges.done),
  })
  .superRefine((t, ctx) => {
    const tested = t.visual === 'pass';
    if (t.equipmentClass === 'II' && t.earthContinuityOhms != null)
      ctx.addIssue({
        code: 'custom',
        path: ['earthContinuityOhms'],
        message: 'Class II equipment has no earth: leave earth continuity empty.',
      });
    if (tested && t.equipmentClass === 'I' && t.earthContinuityOhms == null)
      ctx.addIssue({
        code: 'custom',
        path: ['earthContinuityOhms'],
        message: 'Enter the earth continuity reading in ohms (Class I).',
      });
    if (tested && t.insulationResistanceMohms == null)
      ctx.addIssue({
        code: 'custom',
        path: ['insulationResistanceMohms'],
        message: 'Enter the insulation resistance in megohms.',
      });
    if ((t.cordLengthM == null) !== (t.cordSizeMm2 == null))
      ctx.addIssue({
        code: 'custom',
        path: [t.cordLengthM == null ? 'cordLengthM' : 'cordSizeMm2'],
        message: 'Give both the cord’s length and its conductor size, or neither.',
      });
  });
export type ElectricalTestInput = z.infer<typeof electricalTestInputSchema>;

export interface ElectricalTestOutcome {
  result: 'pass' | 'fail';
  /** The highest earth continuity that passes (Class I), ohms to three decimal places. */
  earthLimitOhms: number | null;
  insulationMinMohms: number;
  /** Why it failed, in words, one line each; empty when it passed. */
  failures: string[];
}

/** The earth continuity limit: 0.1 ohm plus the cord's protective conductor (length x resistance per metre). */
export function earthContinuityLimitOhms(cordLengthM?: number | null, cordSizeMm2?: number | null): number {
  const perMetre = cordMilliohmsPerMetre.find(([size]) => size === cordSizeMm2)?.[1];
  const cord = cordLengthM != null && perMetre !== undefined ? (cordLengthM * perMetre) / 1000 : 0;
  return Math.round((EARTH_CONTINUITY_BASE_OHMS + cord) * 1000) / 1000;
}

/** Whether the item passed its inspection and test, and why not. Any single failure fails the item. */
export function electricalTestOutcome(t: ElectricalTestInput): ElectricalTestOutcome {
  const failures: string[] = [];
  const earthLimitOhms = t.equipmentClass === 'I' ? earthContinuityLimitOhms(t.cordLengthM, t.cordSizeMm2) : null;
  const insulationMinMohms = t.equipmentClass === 'I' ? INSULATION_MIN_CLASS_I_MOHMS : INSULATION_MIN_CLASS_II_MOHMS;
  if (t.visual === 'fail') failures.push('Visual check failed.');
  if (earthLimitOhms !== null && t.earthContinuityOhms != null && t.earthContinuityOhms > earthLimitOhms)
    failures.push(`Earth continuity ${t.earthContinuityOhms} Ω is over the ${earthLimitOhms} Ω limit.`);
  if (t.insulationResistanceMohms != null && t.insulationResistanceMohms < insulationMinMohms)
    failures.push(
      `Insulation resistance ${t.insulationResistanceMohms} MΩ is under the Class ${t.equipmentClass} minimum of ${insulationMinMohms} MΩ.`,
    );
  if (t.polarity === 'fail') failures.push('Polarity is wrong.');
  return { result: failures.length ? 'fail' : 'pass', earthLimitOhms, insulationMinMohms, failures };
}

/** A recorded test: what was entered, with the outcome worked out from it. */
export const electricalTestSchema = z.object({
  equipmentClass: z.enum(equipmentClasses),
  visual: z.enum(passFail),
  earthContinuityOhms: z.number().nullable(),
  cordLengthM: z.number().nullable(),
  cordSizeMm2: z.number().nullable(),
  insulationResistanceMohms: z.number().nullable(),
  polarity: z.enum(polarityResults),
  testerUsed: z.string(),
  testerCalibratedOn: z.string(),
  result: z.enum(passFail),
  earthLimitOhms: z.number().nullable(),
  insulationMinMohms: z.number(),
  failures: z.array(z.string()),
});
export type ElectricalTest = z.infer<typeof electricalTestSchema>;
