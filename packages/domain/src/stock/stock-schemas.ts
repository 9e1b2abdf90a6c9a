import { z } from 'zod';
import { calendarDateWithin, dateRanges } from '../lib/calendar-date.ts';
import { optionalPlainText, plainText, singleLineName } from '../lib/text.ts';

export const productKinds = ['cleaner', 'inhibitor', 'descaler', 'leak_sealer', 'neutraliser', 'other'] as const;
export const productKindLabels: Record<(typeof productKinds)[number], string> = {
  cleaner: 'Cleaner',
  inhibitor: 'Inhibitor',
  descaler: 'Descaler',
  leak_sealer: 'Leak sealer',
  neutraliser: 'Neutraliser',
  other: 'Other',
};

const text = optionalPlainText;
const id = (label: string) =>
  z
    .number({ error: `${label} is required.` })
    .int()
    .positive();
const packs = (label: string) =>
  z
    .number({ error: `${label} is required.` })
    .int({ error: `${label} must be whole packs.` })
    .min(1, { error: `${label} must be at least 1 pack.` })
    .max(100_000, { error: `${label} must be at most 100000 packs.` });

/** What to call a product's kind on screen: the firm's own name for "other". */
export function productKindLabel(product: { kind: (typeof productKinds)[number]; ownKind?: string | null }): string {
  return product.kind === 'other' && product.ownKind ? product.ownKind : productKindLabels[product.kind];
}

export const productInputSchema = z
  .strictObject({
    name: singleLineName('Name', { max: 120 }),
    kind: z.enum(productKinds, { error: () => ({ message: `Kind must be one of: ${productKinds.join(', ')}.` }) }),
    /** The firm's own kind, named when the kind is "other". */
    ownKind: text('Your own kind', 40),
    packSize: z
      .number({ error: 'Pack size is required.' })
      .positive({ error: 'Pack size must be more than 0.' })
      .max(25_000, { error: 'Pack size must be at most 25000.' }),
    packUnit: z.enum(['ml', 'l'], { error: () => ({ message: 'Pack unit must be ml or l.' }) }),
    doseLitresPer100L: z
      .number()
      .min(0.001, { error: 'Dose must be more than 0.' })
      .max(100, { error: 'Dose must be at most 100 litres per 100 litres.' })
      .nullable()
      .optional(),
    radiatorsPerPack: z.number().int().min(1).max(100).nullable().optional(),
    targetMin: z.number().min(0).max(1_000_000).nullable().optional(),
    targetMax: z.number().min(0).max(1_000_000).nullable().optional(),
    targetUnit: text('Target unit', 20),
    testMethod: text('Test method', 300),
    shelfLifeMonths: z.number().int().min(1).max(240).nullable().optional(),
    hazardNotes: text('Hazard notes', 2000),
    /** A cleaner's minimum hot circulation time, from its label. */
    minCirculationMinutes: z
      .number({ error: 'Minimum circulation time must be a number of minutes.' })
      .int({ error: 'Minimum circulation time is whole minutes.' })
      .min(1, { error: 'Minimum circulation time must be at least 1 minute.' })
      .max(1440, { error: 'Minimum circulation time must be at most 1440 minutes (a day).' })
      .nullable()
      .optional(),
    /** Days of use a delivered lot must have left; less needs a confirm at receiving. Left out: 90. */
    minShelfLifeDays: z
      .number({ error: 'Minimum remaining life must be a number of days.' })
      .int({ error: 'Minimum remaining life is whole days.' })
      .min(0, { error: 'Minimum remaining life cannot be negative.' })
      .max(3650, { error: 'Minimum remaining life must be at most 3650 days (ten years).' })
      .optional(),
    /** The supplier's own code for the pack, printed on the reorder list. */
    supplierCode: text('Supplier code', 60),
    /** What one pack costs the firm, in whole pence. */
    costPricePence: z
      .number({ error: 'Cost price must be a number of pence.' })
      .int({ error: 'Cost price is whole pence.' })
      .min(0, { error: 'Cost price cannot be negative.' })
      .max(10_000_000, { error: 'Cost price must be at most £100,000 a pack.' })
      .nullable()
      .optional(),
  })
  .refine((p) => (p.packUnit === 'l' ? p.packSize <= 25 : p.packSize <= 25_000), {
    error: 'Pack size must be at most 25 litres.',
    path: ['packSize'],
  })
  // Packs are kept in whole millilitres: a size that rounds to 0 ml would make every dose "Infinity packs".
  .refine((p) => Math.round(p.packUnit === 'l' ? p.packSize * 1000 : p.packSize) >= 1, {
    error: 'Pack size must be at least 1 ml (0.001 litres).',
    path: ['packSize'],
  })
  .refine((p) => p.kind !== 'other' || !!p.ownKind, { error: 'Name your own kind of product.', path: ['ownKind'] })
  .refine((p) => p.targetMin == null || p.targetMax == null || p.targetMin <= p.targetMax, {
    error: 'The target range must run from low to high.',
    path: ['targetMax'],
  });
export type ProductInput = z.infer<typeof productInputSchema>;

export const productSchema = z.object({
  id: z.number(),
  name: z.string(),
  kind: z.enum(productKinds),
  ownKind: z.string().nullable(),
  packSizeMl: z.number(),
  doseLitresPer100L: z.number().nullable(),
  radiatorsPerPack: z.number().nullable(),
  targetMin: z.number().nullable(),
  targetMax: z.number().nullable(),
  targetUnit: z.string().nullable(),
  testMethod: z.string().nullable(),
  shelfLifeMonths: z.number().nullable(),
  hazardNotes: z.string().nullable(),
  minCirculationMinutes: z.number().nullable(),
  minShelfLifeDays: z.number(),
  supplierCode: z.string().nullable(),
  costPricePence: z.number().nullable(),
  safetyDataSheet: z.object({ url: z.string(), byteSize: z.number(), uploadedAt: z.string() }).nullable(),
  active: z.boolean(),
});
export type Product = z.infer<typeof productSchema>;

export const lotNumberSchema = singleLineName('Lot number', { max: 60 });

export const receiptInputSchema = z.strictObject({
  locationId: id('Depot'),
  reference: text('Delivery reference', 100),
  /** Receive lots with less than their product's minimum remaining life anyway (the person confirmed). */
  confirmShortLife: z.boolean({ error: 'Confirm short life is yes or no.' }).optional(),
  lines: z
    .array(
      z.strictObject({
        productId: id('Product'),
        lotNumber: lotNumberSchema,
        expiresOn: calendarDateWithin('Expiry date', dateRanges.planned),
        quantity: packs('Quantity'),
      }),
      { error: 'Add at least one line.' },
    )
    .min(1, { error: 'Add at least one line.' })
    .max(100),
});
export type ReceiptInput = z.infer<typeof receiptInputSchema>;

const transferLine = z.strictObject({
  productId: id('Product'),
  batchId: id('Batch').optional(),
  quantity: packs('Quantity'),
});
export const transferInputSchema = z
  .strictObject({
    fromLocationId: id('From'),
    toLocationId: id('To'),
    lines: z.array(transferLine).min(1, { error: 'Add at least one line.' }).max(200),
    note: text('Note', 300),
  })
  .refine((t) => t.fromLocationId !== t.toLocationId, {
    error: 'From and to must be different places.',
    path: ['toLocationId'],
  });
export type TransferInput = z.infer<typeof transferInputSchema>;

export const usageInputSchema = z.strictObject({
  locationId: id('Location'),
  productId: id('Product'),
  batchId: id('Batch').optional(),
  quantity: packs('Quantity'),
  reason: plainText('The reason', 300).pipe(z.string().min(3, { error: 'Say what it was used for.' })),
});
export type UsageInput = z.infer<typeof usageInputSchema>;

export const stocktakeInputSchema = z
  .strictObject({
    locationId: id('Location'),
    counts: z
      .array(
        z.strictObject({
          batchId: id('Batch'),
          counted: z
            .number({ error: 'Enter the count as a number of packs.' })
            .int({ error: 'A count is whole packs.' })
            .min(0, { error: 'A count cannot be negative.' })
            .max(100_000, { error: 'A count must be at most 100000 packs.' }),
        }),
      )
      .max(500)
      .default([]),
    /** Stock found on the shelf that is not on record here: its product, lot and expiry, and how many. */
    found: z
      .array(
        z.strictObject({
          productId: id('Product'),
          lotNumber: lotNumberSchema,
          expiresOn: calendarDateWithin('Expiry date', dateRanges.planned),
          counted: packs('Packs found'),
        }),
      )
      .max(100)
      .default([]),
    /** Counting every batch at a place with stock down to nothing happens only when the person confirmed it. */
    confirmZeroing: z.boolean({ error: 'Confirm zeroing is yes or no.' }).optional(),
    note: text('Note', 300),
  })
  .refine((t) => t.counts.length + t.found.length > 0, { error: 'Count at least one batch.', path: ['counts'] });
export type StocktakeInput = z.infer<typeof stocktakeInputSchema>;

export const writeOffReasons = ['expired', 'damaged', 'spilled'] as const;
export const writeOffInputSchema = z.strictObject({
  locationId: id('Location'),
  batchId: id('Batch'),
  quantity: packs('Quantity'),
  reason: z.enum(writeOffReasons, { error: () => ({ message: 'Reason must be expired, damaged or spilled.' }) }),
  note: text('Note', 300),
});
export type WriteOffInput = z.infer<typeof writeOffInputSchema>;

export const reversalInputSchema = z.strictObject({
  reason: z.string().trim().min(3, { error: 'Say why it is being reversed.' }).max(300),
});

export const parLevelInputSchema = z
  .strictObject({
    locationId: id('Location'),
    productId: id('Product'),
    minimum: z.number().int().min(0).max(100_000),
    target: z.number().int().min(0).max(100_000),
  })
  .refine((p) => p.target >= p.minimum, { error: 'The target must be at least the minimum.', path: ['target'] });
export type ParLevelInput = z.infer<typeof parLevelInputSchema>;

export const movementKinds = [
  'received',
  'transfer_out',
  'transfer_in',
  'used',
  'counted',
  'written_off',
  'reversal',
] as const;
export const movementKindLabels: Record<(typeof movementKinds)[number], string> = {
  received: 'Received',
  transfer_out: 'Sent',
  transfer_in: 'Arrived',
  used: 'Used',
  counted: 'Stocktake adjustment',
  written_off: 'Written off',
  reversal: 'Reversal',
};

export const ledgerQuerySchema = z.strictObject({
  locationId: z.coerce.number().int().positive().optional(),
  productId: z.coerce.number().int().positive().optional(),
  kind: z.enum(movementKinds).optional(),
  from: calendarDateWithin('From', dateRanges.planned).optional(),
  to: calendarDateWithin('To', dateRanges.planned).optional(),
  /** Keyset cursor: the id of the last movement of the previous page. */
  before: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(500).default(50),
});
export type LedgerQuery = z.infer<typeof ledgerQuerySchema>;

export const movementSchema = z.object({
  id: z.number(),
  groupId: z.string(),
  kind: z.enum(movementKinds),
  location: z.object({ id: z.number(), name: z.string() }),
  product: z.object({ id: z.number(), name: z.string() }),
  batch: z.object({ id: z.number(), lotNumber: z.string(), expiresOn: z.string() }),
  quantityDelta: z.number(),
  reason: z.string().nullable(),
  reference: z.string().nullable(),
  reversesMovementId: z.number().nullable(),
  byName: z.string(),
  /** When it reached the server. */
  createdAt: z.string(),
  /** When the engineer tapped (X-Tapped-At), for stock used by hand from the phone; null otherwise. */
  tappedAt: z.string().nullable(),
});
export type Movement = z.infer<typeof movementSchema>;

export const restockApplyInputSchema = z.strictObject({
  lines: z
    .array(
      z.strictObject({
        toLocationId: id('Van'),
        productId: id('Product'),
        /** Left out: taken from the depot first expiry first when the run is applied. */
        batchId: id('Batch').optional(),
        quantity: packs('Quantity'),
      }),
    )
    .min(1, { error: 'Nothing to apply.' })
    .max(5000),
});
export type RestockApplyInput = z.infer<typeof restockApplyInputSchema>;
