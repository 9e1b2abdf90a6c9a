import { z } from 'zod';
import { calendarDateWithin, dateRanges } from '../lib/calendar-date.ts';
import { optionalPlainText, singleLineName } from '../lib/text.ts';
import { locationRefSchema } from '../locations/location-schemas.ts';
import { electricalTestInputSchema, electricalTestSchema } from './electrical-test.ts';

// The electrical test's schemas and rules travel with the kit schemas (the domain's index exports this file).
export * from './electrical-test.ts';

export const itemConditions = ['in_service', 'needs_attention', 'out_of_service'] as const;
export const itemConditionSchema = z.enum(itemConditions, {
  error: () => ({ message: 'Choose the condition.' }),
});
export type ItemCondition = z.infer<typeof itemConditionSchema>;
export const itemConditionLabels: Record<ItemCondition, string> = {
  in_service: 'In service',
  needs_attention: 'Needs attention',
  out_of_service: 'Out of service',
};

export const overduePolicies = ['allow_with_reason', 'block'] as const;
export const overduePolicyLabels: Record<(typeof overduePolicies)[number], string> = {
  allow_with_reason: 'May go out with a reason',
  block: 'Stays in until inspected',
};

const text = optionalPlainText;
const name = (label: string, max = 80) => singleLineName(label, { max });
const id = (label: string) =>
  z
    .number({ error: `${label} is required.` })
    .int()
    .positive();
const interval = (label: string, max: number) =>
  z
    .number()
    .int({ error: `${label} must be a whole number.` })
    .min(1, { error: `${label} must be at least 1.` })
    .max(max, { error: `${label} must be at most ${max}.` })
    .nullable();

export const itemKindInputSchema = z.strictObject({
  name: name('Kind name'),
  intervalDays: interval('Days between inspections', 3650),
  intervalUses: interval('Uses between inspections', 1000),
  dueSoonDays: z
    .number()
    .int()
    .min(0, { error: 'Due-soon window cannot be negative.' })
    .max(365, { error: 'Due-soon window must be at most 365 days.' }),
  overduePolicy: z.enum(overduePolicies),
  electrical: z.boolean().default(false),
});
export type ItemKindInput = z.infer<typeof itemKindInputSchema>;

export const itemKindSchema = z.object({
  id: z.number(),
  name: z.string(),
  intervalDays: z.number().nullable(),
  intervalUses: z.number().nullable(),
  dueSoonDays: z.number(),
  overduePolicy: z.enum(overduePolicies),
  electrical: z.boolean(),
});
export type ItemKind = z.infer<typeof itemKindSchema>;

export const assetTagSchema = z
  .string({ error: 'Asset tag is required.' })
  .trim()
  .toUpperCase()
  .pipe(
    z.string().regex(/^[A-Z0-9][A-Z0-9-]{0,31}$/, {
      error: (iss) => `Asset tag "${String(iss.input)}" may use letters, digits and dashes, up to 32.`,
    }),
  );

export const createKitInputSchema = z.strictObject({ name: name('Kit name'), notes: text('Notes', 1000) });
export type CreateKitInput = z.infer<typeof createKitInputSchema>;
export const updateKitInputSchema = createKitInputSchema.partial();

export const vibrationMs2Schema = z
  .number({ error: 'Vibration magnitude must be a number of m/s².' })
  .min(0, { error: 'Vibration magnitude cannot be negative.' })
  .max(100, { error: 'Vibration magnitude must be at most 100 m/s².' });

export const createKitItemInputSchema = z.strictObject({
  assetTag: assetTagSchema,
  kindId: id('Kind'),
  kitId: id('Kit').nullable().optional(),
  serialNumber: text('Serial number', 80),
  notes: text('Notes', 1000),
  locationId: id('Location').optional(),
  inServiceSince: calendarDateWithin('In service since', dateRanges.inService).optional(),
});
export type CreateKitItemInput = z.infer<typeof createKitItemInputSchema>;
export const updateKitItemInputSchema = z.strictObject({
  kindId: id('Kind').optional(),
  kitId: id('Kit').nullable().optional(),
  serialNumber: text('Serial number', 80),
  notes: text('Notes', 1000),
  condition: itemConditionSchema.optional(),
  /** A vibrating tool's magnitude in m/s^2, from its maker or the firm's own measurement (for the HSE points). */
  vibrationMs2: vibrationMs2Schema.nullable().optional(),
});
export type UpdateKitItemInput = z.infer<typeof updateKitItemInputSchema>;

export const inspectionStates = ['no_rule', 'ok', 'due_soon', 'overdue'] as const;
export const inspectionStateLabels: Record<(typeof inspectionStates)[number], string> = {
  no_rule: 'No rule',
  ok: 'In date',
  due_soon: 'Due soon',
  overdue: 'Overdue',
};

export const inspectionDueSchema = z.object({
  state: z.enum(inspectionStates),
  dueOn: z.string().nullable(),
  usesLeft: z.number().nullable(),
  reason: z.enum(['days', 'uses']).nullable(),
  lastInspectedOn: z.string().nullable(),
  usesSinceInspection: z.number(),
});

export const kitItemSchema = z.object({
  id: z.number(),
  assetTag: z.string(),
  kind: z.object({ id: z.number(), name: z.string(), overduePolicy: z.enum(overduePolicies) }),
  kit: z.object({ id: z.number(), name: z.string() }).nullable(),
  serialNumber: z.string().nullable(),
  condition: itemConditionSchema,
  notes: z.string().nullable(),
  location: locationRefSchema.nullable(),
  inspection: inspectionDueSchema,
  vibrationMs2: z.number().nullable(),
});
export type KitItem = z.infer<typeof kitItemSchema>;

export const kitSchema = z.object({
  id: z.number(),
  name: z.string(),
  notes: z.string().nullable(),
  location: locationRefSchema.nullable(),
  itemCount: z.number(),
  /** The worst inspection state among its items. */
  inspectionState: z.enum(inspectionStates),
  needsAttention: z.number(),
});
export type Kit = z.infer<typeof kitSchema>;

export const custodyActions = ['check_out', 'check_in', 'move'] as const;
export const custodyActionLabels: Record<(typeof custodyActions)[number], string> = {
  check_out: 'Checked out',
  check_in: 'Checked in',
  move: 'Moved',
};

export const custodyEventSchema = z.object({
  id: z.number(),
  action: z.enum(custodyActions),
  item: z.object({ id: z.number(), assetTag: z.string() }),
  kitId: z.number().nullable(),
  from: locationRefSchema.nullable(),
  to: locationRefSchema.nullable(),
  byName: z.string(),
  condition: itemConditionSchema.nullable(),
  missingParts: z.string().nullable(),
  note: z.string().nullable(),
  overdueReason: z.string().nullable(),
  /** Ticked as cleaned at this check-in. */
  cleaned: z.boolean(),
  photoId: z.number().nullable(),
  /** When it reached the server. */
  createdAt: z.string(),
  /** When the engineer tapped (X-Tapped-At), if the phone said: earlier than createdAt for a write sent from its queue. */
  tappedAt: z.string().nullable(),
});
export type CustodyEvent = z.infer<typeof custodyEventSchema>;

export const checkOutInputSchema = z.strictObject({
  toLocationId: id('Van'),
  overdueReason: z
    .string()
    .trim()
    .min(3, { error: 'Say why it goes out before inspection (at least 3 characters).' })
    .max(500)
    .optional(),
  note: text('Note', 1000),
});
export type CheckOutInput = z.infer<typeof checkOutInputSchema>;

/** One item's own state at a kit's check-in: its condition, and whether it was cleaned after the job. */
export const checkInItemSchema = z.strictObject({
  itemId: id('Item'),
  condition: itemConditionSchema.optional(),
  /**
   * Cleaned (a magnet set after each job): recorded as a passed inspection at the check-in, so an
   * item inspected after every use is in date again. Only for kinds with a use rule.
   */
  cleaned: z.boolean({ error: 'Cleaned must be ticked or not.' }).optional(),
});
export type CheckInItem = z.infer<typeof checkInItemSchema>;

export const checkInInputSchema = z.strictObject({
  /** The depot it comes back to; the firm's first depot when left out. */
  toLocationId: id('Depot').optional(),
  /** The condition of every item not listed in `items` with its own; in service unless said otherwise. */
  condition: itemConditionSchema.default('in_service'),
  /** Each item's own condition and cleaning tick (a kit's check-in); an item not listed takes `condition`. */
  items: z
    .array(checkInItemSchema)
    .max(200, { error: 'A check-in can list at most 200 items.' })
    .refine((list) => new Set(list.map((i) => i.itemId)).size === list.length, {
      error: 'Each item may be listed once.',
    })
    .optional(),
  missingParts: text('Missing parts', 500),
  note: text('Note', 1000),
  photoId: id('Photo').optional(),
});
export type CheckInInput = z.infer<typeof checkInInputSchema>;

export const moveInputSchema = z.strictObject({ toLocationId: id('Van'), note: text('Note', 1000) });
export type MoveInput = z.infer<typeof moveInputSchema>;

export const inspectionResultSchema = z.enum(['passed', 'failed'], {
  error: () => ({ message: 'Result must be passed or failed.' }),
});
export const recordInspectionInputSchema = z.strictObject({
  result: inspectionResultSchema,
  notes: text('Notes', 1000),
  photoId: id('Photo').optional(),
  inspectedOn: calendarDateWithin('Inspection date', dateRanges.done).optional(),
  /** An electrical kind's in-service inspection and test; left out for a visual inspection only. */
  electrical: electricalTestInputSchema.optional(),
});
export type RecordInspectionInput = z.infer<typeof recordInspectionInputSchema>;

export const inspectionSchema = z.object({
  id: z.number(),
  itemId: z.number(),
  result: inspectionResultSchema,
  notes: z.string().nullable(),
  photoId: z.number().nullable(),
  byName: z.string(),
  inspectedOn: z.string(),
  createdAt: z.string(),
  /** Ticked as cleaned at a check-in rather than inspected on its own. */
  cleanedAtCheckIn: z.boolean(),
  electrical: electricalTestSchema.nullable(),
});
export type Inspection = z.infer<typeof inspectionSchema>;

export const kitItemListQuerySchema = z.strictObject({
  kindId: z.coerce.number().int().positive().optional(),
  locationId: z.coerce.number().int().positive().optional(),
  kitId: z.coerce.number().int().positive().optional(),
  inspectionState: z.enum(inspectionStates).optional(),
  q: z.string().trim().max(80).optional(),
  sort: z.enum(['assetTag', 'kind', 'kit', 'location', 'due']).default('assetTag'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type KitItemListQuery = z.infer<typeof kitItemListQuerySchema>;

export const labelsQuerySchema = z.strictObject({
  ids: z
    .string()
    .trim()
    .regex(/^\d+(,\d+){0,199}$/, { error: 'ids must be a comma-separated list of up to 200 item ids.' })
    .transform((s) => s.split(',').map(Number))
    .optional(),
  kitId: z.coerce.number().int().positive().optional(),
});

export const kitLabelSchema = z.object({
  itemId: z.number(),
  assetTag: z.string(),
  kindName: z.string(),
  kitName: z.string().nullable(),
  url: z.string(),
  qrSvgDataUrl: z.string(),
});
