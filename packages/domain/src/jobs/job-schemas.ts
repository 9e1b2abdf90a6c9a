import { z } from 'zod';
import { calendarDateWithin, dateRanges } from '../lib/calendar-date.ts';
import { optionalPlainText, plainText, singleLineName } from '../lib/text.ts';
import { withThousands } from '../lib/thousands.ts';
import { boilerKinds, fuels, heatExchangerDefaultLitres, type HeatExchangerDefaults } from './heat-exchanger.ts';
import {
  copperTubes,
  pipeWaterContentLitresPerMetre,
  boreLitresPerMetre,
  quickEstimateLitres,
  radiatorLitres,
  systemVolumeLitres,
  type PanelType,
} from './system-volume.ts';

const text = optionalPlainText;
const name = (label: string, max = 120) => singleLineName(label, { max });

export const customerInputSchema = z.strictObject({
  name: name('Customer name'),
  email: z
    .union([z.literal(''), z.email({ error: 'That is not an e-mail address.' })])
    .transform((s) => (s === '' ? null : s.toLowerCase()))
    .nullable()
    .optional(),
  phone: text('Phone', 40),
  contact: text('Contact', 120),
});
export type CustomerInput = z.infer<typeof customerInputSchema>;

export const siteInputSchema = z.strictObject({
  // An address may run over several lines; it is still plain text.
  address: plainText('Address', 500).pipe(z.string().min(1, { error: 'Address is required.' })),
  postcode: text('Postcode', 12),
  accessNotes: text('Access notes', 1000),
  systemNotes: text('System notes', 1000),
});
export type SiteInput = z.infer<typeof siteInputSchema>;

export const panelTypes = ['single', 'single_fins', 'double', 'double_fins', 'column', 'towel_rail', 'other'] as const;
const tubeSizes = [...(Object.keys(copperTubes) as (keyof typeof copperTubes)[]), 'plastic'] as const;

/** A radiator's dimension in whole millimetres, in words a person reads (issue 14). */
const mm = (label: string, min: number, max: number) =>
  z
    .number({ error: `${label} must be a number of millimetres.` })
    .int({ error: `${label} must be a whole number of millimetres.` })
    .min(min, { error: `${label} must be at least ${min} millimetres.` })
    .max(max, { error: `${label} must be at most ${withThousands(max)} millimetres.` })
    .nullable()
    .optional();

export const surveyRadiatorSchema = z.strictObject({
  room: name('Room', 80),
  panel: z.enum(panelTypes, { error: 'Choose the panel type.' }),
  heightMm: mm('Height', 100, 2500),
  lengthMm: mm('Length', 100, 4000),
  /** Typed in from the maker's data instead of the dimensions. */
  litres: z
    .number({ error: 'Litres must be a number.' })
    .min(0, { error: 'Litres cannot be below 0.' })
    .max(200, { error: 'Litres must be at most 200 for one radiator.' })
    .nullable()
    .optional(),
  ratedWatts: z
    .number({ error: 'Rated output must be a number of watts.' })
    .int({ error: 'Rated output must be a whole number of watts.' })
    .min(0, { error: 'Rated output cannot be below 0 watts.' })
    .max(20_000, { error: 'Rated output must be at most 20,000 watts.' })
    .nullable()
    .optional(),
  coldSpotNote: text('Cold spot note', 300),
});

export const surveyPipeRunSchema = z
  .strictObject({
    tube: z.enum(tubeSizes),
    boreMm: z.number().min(5).max(60).nullable().optional(),
    lengthM: z.number().min(0).max(2000),
  })
  .refine((r) => r.tube !== 'plastic' || (r.boreMm ?? 0) > 0, {
    error: 'A plastic pipe needs its bore in mm.',
    path: ['boreMm'],
  });

/**
 * Heat exchanger water content of a gas boiler by kind, litres (from memory, not a standard). Other
 * fuels and a firm's own figures: `heatExchangerDefaultLitres` in heat-exchanger.ts.
 */
export const defaultHeatExchangerLitres: Record<(typeof boilerKinds)[number], number> = {
  combi: 1,
  system: 2,
  regular: 3,
};

/** A full clean (cleaner, hot circulation, agitation, flush, inhibitor, tests) or an inhibitor visit (dose, circulate, test). */
export const visitKinds = ['full_clean', 'inhibitor_only'] as const;
export type VisitKind = (typeof visitKinds)[number];
export const visitKindLabels: Record<VisitKind, string> = {
  full_clean: 'Full clean',
  inhibitor_only: 'Inhibitor only',
};

/** The state of an open-vented system's feed-and-expansion cistern, as found on the visit. */
export const cisternConditions = ['clean', 'dirty_cleaned', 'needs_attention'] as const;
export type CisternCondition = (typeof cisternConditions)[number];
export const cisternConditionLabels: Record<CisternCondition, string> = {
  clean: 'Clean',
  dirty_cleaned: 'Dirty: cleaned on the visit',
  needs_attention: 'Needs attention',
};

/** What the report says about the system; every field may wait until the visit. */
export const systemDetailsSchema = z.strictObject({
  boilerMake: text('Boiler make', 80),
  boilerModel: text('Boiler model', 80),
  boilerLocation: text('Boiler location', 120),
  magneticFilterFitted: z.boolean({ error: 'Say yes or no: is a magnetic filter fitted?' }).nullable().optional(),
  /** Open-vented systems only: a sealed system has no feed-and-expansion cistern. */
  cisternCondition: z
    .enum(cisternConditions, {
      error: () => ({ message: `The cistern's condition must be one of: ${cisternConditions.join(', ')}.` }),
    })
    .nullable()
    .optional(),
});
export type SystemDetails = z.infer<typeof systemDetailsSchema>;

export const surveySchema = z.strictObject({
  systemType: z.enum(['open_vented', 'sealed']),
  boilerKind: z.enum(boilerKinds),
  fuel: z.enum(fuels),
  heatExchangerLitres: z.number().min(0).max(100).nullable().optional(),
  cylinderCoilLitres: z.number().min(0).max(100).nullable().optional(),
  otherLitres: z.number().min(0).max(2000).nullable().optional(),
  radiators: z.array(surveyRadiatorSchema).max(80),
  pipeRuns: z.array(surveyPipeRunSchema).max(100),
});
export type Survey = z.infer<typeof surveySchema>;

export interface VolumeBreakdown {
  radiatorsLitres: number;
  pipeworkLitres: number;
  heatExchangerLitres: number;
  cylinderCoilLitres: number;
  otherLitres: number;
  totalLitres: number;
  /** True when the survey was too short and the quick estimate was used. */
  estimate: boolean;
  /** Never "measured": a volume from a survey is calculated, or estimated when the survey is short. */
  label: 'Calculated from the survey' | 'Estimated';
  /** Where the heat exchanger figure came from: typed on the survey, or a default for the boiler kind and fuel. */
  heatExchangerFrom: 'survey' | 'default';
  howReached: string;
}

/**
 * The system volume from a survey, each part shown; when radiators lack sizes or litres and no pipe
 * runs were measured, the quick estimate stands in (and says so).
 */
export function surveyVolume(
  survey: Survey,
  heatExchangerDefaults: HeatExchangerDefaults | null = null,
): VolumeBreakdown {
  const sized = survey.radiators.filter((r) => r.litres != null || (r.heightMm && r.lengthMm));
  const heatExchangerFrom = survey.heatExchangerLitres == null ? 'default' : 'survey';
  const heatExchangerLitres =
    survey.heatExchangerLitres ?? heatExchangerDefaultLitres(survey.boilerKind, survey.fuel, heatExchangerDefaults);
  const cylinderCoilLitres = survey.cylinderCoilLitres ?? 0;
  const otherLitres = survey.otherLitres ?? 0;
  if (survey.radiators.length > 0 && (sized.length < survey.radiators.length || survey.pipeRuns.length === 0)) {
    const estimate = quickEstimateLitres(survey.radiators.map((r) => r.panel as PanelType));
    const totalLitres = estimate + heatExchangerLitres + cylinderCoilLitres + otherLitres;
    return {
      radiatorsLitres: estimate,
      pipeworkLitres: 0,
      heatExchangerLitres,
      cylinderCoilLitres,
      otherLitres,
      totalLitres,
      estimate: true,
      label: 'Estimated',
      heatExchangerFrom,
      howReached: `Estimated: about 10 L per single-panel equivalent, pipework included (${survey.radiators.length} radiators), plus the boiler and other parts.`,
    };
  }
  const radiatorsLitres = survey.radiators.reduce(
    (n, r) => n + (r.litres ?? radiatorLitres(r.panel as PanelType, r.heightMm!, r.lengthMm!)),
    0,
  );
  const pipeworkLitres = survey.pipeRuns.reduce(
    (n, p) =>
      n + p.lengthM * (p.tube === 'plastic' ? boreLitresPerMetre(p.boreMm!) : pipeWaterContentLitresPerMetre(p.tube)),
    0,
  );
  const parts = { radiatorsLitres, pipeworkLitres, heatExchangerLitres, cylinderCoilLitres, otherLitres };
  return {
    ...parts,
    totalLitres: systemVolumeLitres(parts),
    estimate: false,
    label: 'Calculated from the survey',
    heatExchangerFrom,
    howReached:
      'Calculated from the survey: radiators by size or stated litres, pipework by tube size and length, plus the boiler, cylinder coil and other parts.',
  };
}

/** A visit's time of day, 'HH:MM' on the 24-hour clock in the firm's zone. */
export const timeOfDaySchema = z
  .string({ error: 'The time must be text like 08:30.' })
  .trim()
  .regex(/^([01]\d|2[0-3]):[0-5]\d$/, {
    error: (iss) => `"${String(iss.input)}" is not a time of day (use 24-hour HH:MM, e.g. 08:30).`,
  });

export const createJobInputSchema = z.strictObject({
  siteId: z.number().int().positive(),
  scheduledOn: calendarDateWithin('The visit date', dateRanges.planned),
  /** The time of day, when the visit has one. */
  scheduledTime: timeOfDaySchema.nullable().optional(),
  engineerMemberId: z.number().int().positive().nullable().optional(),
  survey: surveySchema,
  /** The products to dose (a cleaner, an inhibitor). */
  productIds: z.array(z.number().int().positive()).max(6).default([]),
  /** A full clean when left out. */
  visitKind: z
    .enum(visitKinds, { error: () => ({ message: 'The visit must be a full clean or inhibitor only.' }) })
    .optional(),
  systemDetails: systemDetailsSchema.optional(),
});
export type CreateJobInput = z.infer<typeof createJobInputSchema>;
