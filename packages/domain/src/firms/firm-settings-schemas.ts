import { z } from 'zod';
import { heatExchangerDefaultsSchema } from '../jobs/heat-exchanger.ts';
import { optionalPlainText, singleLineName } from '../lib/text.ts';

export const volumeUnits = ['litres', 'imperial_gallons'] as const;
export type VolumeUnit = (typeof volumeUnits)[number];
export const volumeUnitLabels: Record<VolumeUnit, string> = {
  litres: 'Litres',
  imperial_gallons: 'Litres, with imperial gallons alongside',
};

/** The cold-bottom threshold a firm may set, kelvin top to bottom. */
export const COLD_BOTTOM_THRESHOLD_MIN_K = 2;
export const COLD_BOTTOM_THRESHOLD_MAX_K = 30;

/** Whether the runtime knows this IANA time zone (Intl throws a RangeError for one it does not). */
export function isKnownTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

/** The firm's own settings, changed by an Owner or an Admin. */
export const firmSettingsInputSchema = z.strictObject({
  name: singleLineName('The firm name', { max: 120 }),
  address: z
    .string()
    .trim()
    .max(500, { error: 'The address must be at most 500 characters.' })
    .transform((s) => (s === '' ? null : s))
    .nullable()
    .optional(),
  timeZone: z
    .string({ error: 'A time zone is required.' })
    .trim()
    .max(64)
    .refine(isKnownTimeZone, {
      error: (iss) => `"${String(iss.input)}" is not a time zone this system knows (use a name such as Europe/London).`,
    }),
  volumeUnit: z.enum(volumeUnits, { error: 'Volume unit must be litres or imperial gallons.' }),
  coldBottomThresholdK: z
    .number({ error: 'The cold-bottom threshold must be a number of kelvin.' })
    .min(COLD_BOTTOM_THRESHOLD_MIN_K, {
      error: `The cold-bottom threshold must be between ${COLD_BOTTOM_THRESHOLD_MIN_K} and ${COLD_BOTTOM_THRESHOLD_MAX_K} K.`,
    })
    .max(COLD_BOTTOM_THRESHOLD_MAX_K, {
      error: `The cold-bottom threshold must be between ${COLD_BOTTOM_THRESHOLD_MIN_K} and ${COLD_BOTTOM_THRESHOLD_MAX_K} K.`,
    }),
  // The contact details and registrations the customer's report prints. Left out: unchanged.
  phone: z
    .string()
    .trim()
    .max(40, { error: 'The phone number must be at most 40 characters.' })
    .regex(/^[0-9+() -]*$/, { error: 'A phone number has digits, spaces, +, ( ) and - only.' })
    .transform((s) => (s === '' ? null : s))
    .nullable()
    .optional(),
  email: z
    .union([z.literal(''), z.email({ error: 'That is not an e-mail address.' }).max(254)])
    .transform((s) => (s === '' ? null : s.toLowerCase()))
    .nullable()
    .optional(),
  /** Free text, for example a trade scheme's registration number; printed as typed. */
  registrationNumbers: optionalPlainText('Registration numbers', 300),
  /** Heat exchanger content by fuel and boiler kind; null goes back to the built-in defaults. */
  heatExchangerDefaults: heatExchangerDefaultsSchema.nullable().optional(),
  /** Days of booked jobs the restock run covers. Left out: unchanged (7 unless set). */
  restockDays: z
    .number({ error: 'Restock days must be a number of days.' })
    .int({ error: 'Restock days are whole days.' })
    .min(1, { error: 'Restock days must be at least 1.' })
    .max(60, { error: 'Restock days must be at most 60.' })
    .optional(),
});
export type FirmSettingsInput = z.infer<typeof firmSettingsInputSchema>;
