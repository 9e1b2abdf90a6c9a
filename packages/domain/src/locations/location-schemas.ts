import { z } from 'zod';
import { calendarDateWithin, dateRanges } from '../lib/calendar-date.ts';
import { optionalPlainText, singleLineName } from '../lib/text.ts';

const optionalText = optionalPlainText;

/**
 * UK registrations, loosely: letters and digits with one optional space, 2 to 8 characters, at
 * least one letter and one digit (covers current, prefix, suffix and dateless styles).
 */
export const registrationSchema = z
  .string({ error: 'Registration is required.' })
  .trim()
  .toUpperCase()
  .transform((s) => s.replace(/\s+/g, ' '))
  .pipe(
    z
      .string()
      .regex(/^(?=.*[A-Z])(?=.*\d)[A-Z0-9]{1,7} ?[A-Z0-9]{0,7}$/, {
        error: (iss) => `"${String(iss.input)}" does not look like a UK registration.`,
      })
      .refine((s) => s.replace(' ', '').length >= 2 && s.replace(' ', '').length <= 8, {
        error: 'A registration has 2 to 8 letters and digits.',
      }),
  );

export const locationNameSchema = singleLineName('Name', { max: 80 });

const idSchema = z.number().int().positive();

export const createVanInputSchema = z.strictObject({
  name: locationNameSchema,
  registration: registrationSchema,
  engineerMemberId: idSchema.nullable().optional(),
  motDueOn: calendarDateWithin('MOT due date', dateRanges.planned).nullable().optional(),
  serviceDueOn: calendarDateWithin('Service due date', dateRanges.planned).nullable().optional(),
  notes: optionalText('Notes', 1000),
});
export type CreateVanInput = z.infer<typeof createVanInputSchema>;
export const updateVanInputSchema = createVanInputSchema.partial().extend({ active: z.boolean().optional() });
export type UpdateVanInput = z.infer<typeof updateVanInputSchema>;

export const createDepotInputSchema = z.strictObject({ name: locationNameSchema, notes: optionalText('Notes', 1000) });
export type CreateDepotInput = z.infer<typeof createDepotInputSchema>;

export const locationRefSchema = z.object({
  id: z.number(),
  kind: z.enum(['depot', 'van']),
  name: z.string(),
  registration: z.string().nullable(),
  engineerName: z.string().nullable(),
});
export type LocationRef = z.infer<typeof locationRefSchema>;

export const vanSchema = z.object({
  id: z.number(),
  kind: z.literal('van'),
  name: z.string(),
  registration: z.string(),
  engineer: z.object({ memberId: z.number(), name: z.string() }).nullable(),
  motDueOn: z.string().nullable(),
  serviceDueOn: z.string().nullable(),
  notes: z.string().nullable(),
  active: z.boolean(),
  kitsOnBoard: z.array(z.object({ id: z.number(), name: z.string() })),
  itemsOnBoard: z.number(),
  /** The sooner of MOT and service, with which it is. */
  nextDue: z.object({ what: z.enum(['MOT', 'service']), on: z.string() }).nullable(),
});
export type Van = z.infer<typeof vanSchema>;

export const depotSchema = z.object({
  id: z.number(),
  kind: z.literal('depot'),
  name: z.string(),
  notes: z.string().nullable(),
});
export type Depot = z.infer<typeof depotSchema>;
