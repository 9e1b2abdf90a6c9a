import { z } from 'zod';
import { calendarDateWithin, dateRanges } from '../lib/calendar-date.ts';
import {
  coldBottom,
  flushComplete,
  HAV_ACTION_POINTS,
  HAV_LIMIT_POINTS,
  inhibitorCheck,
  meanWaterToRoomKelvin,
  radiatorOutputWatts,
  vibrationPoints,
} from './water-tests.ts';

/**
 * The on-site record of a cleaning visit (the job sheet): the steps ticked with a time, the
 * radiator log, agitation per radiator, the water tests and the kit used. The API stores what the
 * engineer enters and answers with the figures computed here; the sheet shows the same figures live.
 */

/**
 * Every step a visit may have. Which of them a visit has, in what order, with which label and
 * cautions, depends on the system, the fuel and the kind of visit: `visitSteps` in visit-steps.ts.
 */
export const jobSteps = [
  'isolate_connect',
  'dose_cleaner',
  'circulate_hot',
  'agitate',
  'flush',
  'dose_inhibitor',
  'reinstate',
  'depressurise',
  'check_expansion_vessel',
  'check_cistern',
  'latch_zone_valves',
  'circulate_inhibitor',
  'test_water',
] as const;
export type JobStep = (typeof jobSteps)[number];
export const jobStepLabels: Record<JobStep, string> = {
  isolate_connect: 'Isolate the boiler and connect the flushing rig',
  dose_cleaner: 'Dose the cleaner',
  circulate_hot: 'Circulate hot for the cleaner’s minimum time',
  agitate: 'Agitate each radiator',
  flush: 'Flush each radiator until clear',
  dose_inhibitor: 'Dose the inhibitor',
  reinstate: 'Reinstate: refill, vent, pressurise and check for leaks',
  depressurise: 'Release the system pressure before opening the system',
  check_expansion_vessel: 'Check the expansion vessel’s charge',
  check_cistern: 'Check and clean the feed-and-expansion cistern',
  latch_zone_valves: 'Latch open any motorised zone valve for the flush',
  circulate_inhibitor: 'Circulate to mix the inhibitor through the system',
  test_water: 'Test the system water',
};

/** Where a caution belongs on the sheet: shown beside the step it protects. */
export const stepCautions: Partial<Record<JobStep, readonly CautionKey[]>> = {
  isolate_connect: ['electrical', 'gas_oil', 'hot_water'],
  dose_cleaner: ['chemicals'],
  flush: ['drain', 'hot_water'],
  dose_inhibitor: ['chemicals'],
  reinstate: ['pressure'],
};

export const cautionKeys = [
  'hot_water',
  'electrical',
  'gas_oil',
  'chemicals',
  'drain',
  'pressure',
  'judgement',
] as const;
export type CautionKey = (typeof cautionKeys)[number];
/** The visit's safety cautions, in our own words; the web sheet and the PDF report both print these. */
export const cautionTexts: Record<CautionKey, string> = {
  hot_water: 'Hot water and surfaces scald: let the system cool before draining.',
  electrical: 'Isolate the boiler electrically and prove it dead before working on it.',
  gas_oil:
    'Work on gas appliances only by a business on the Gas Safe Register; oil appliances only by a competent, registered person.',
  chemicals: 'Read the product’s safety data sheet; wear gloves and eye protection; never mix cleaners.',
  drain: 'Flushing water and sludge go to a foul drain, never a surface-water drain.',
  pressure: 'Do not over-pressurise old open-vented pipework; sealed systems relieve at about 3 bar.',
  judgement:
    'These figures support your judgement; they do not replace it. Follow local codes, the manufacturers’ instructions and licensed practice.',
};

const celsius = (label: string) =>
  z
    .number({ error: `${label} must be a temperature in °C.` })
    .min(-10, { error: `${label} must be between -10 and 110 °C.` })
    .max(110, { error: `${label} must be between -10 and 110 °C.` });

/** One set of surface readings on a radiator, before or after the clean. */
export const radiatorReadingInputSchema = z.strictObject({
  topC: celsius('Top temperature'),
  bottomC: celsius('Bottom temperature'),
  flowC: celsius('Flow temperature').nullable().optional(),
  returnC: celsius('Return temperature').nullable().optional(),
  /** Room air temperature; 20 °C (the EN 442 rating room) when not taken. */
  roomC: celsius('Room temperature').nullable().optional(),
});
export type RadiatorReadingInput = z.infer<typeof radiatorReadingInputSchema>;
export const readingPhases = ['before', 'after'] as const;
export type ReadingPhase = (typeof readingPhases)[number];

export const agitationInputSchema = z.strictObject({
  minutes: z
    .number({ error: 'Agitation time must be a number of minutes.' })
    .int({ error: 'Agitation time is whole minutes.' })
    .min(0)
    .max(240, { error: 'Agitation time must be at most 240 minutes per radiator.' }),
  /** The vibrating tool used (a kit item whose vibration magnitude is set on the kit). */
  kitItemId: z.number().int().positive().nullable().optional(),
});
export type AgitationInput = z.infer<typeof agitationInputSchema>;

export const waterTestsInputSchema = z.strictObject({
  mainsTdsPpm: z.number().min(0).max(5000).nullable().optional(),
  systemTdsPpm: z.number().min(0).max(5000).nullable().optional(),
  waterClear: z.boolean().nullable().optional(),
  /** The inhibitor reading, in the inhibitor product's own target unit. */
  inhibitorReading: z.number().min(0).max(100_000).nullable().optional(),
  inhibitorProductId: z.number().int().positive().nullable().optional(),
  ph: z.number().min(0).max(14, { error: 'pH is between 0 and 14.' }).nullable().optional(),
});
export type WaterTestsInput = z.infer<typeof waterTestsInputSchema>;

export const jobKitInputSchema = z.strictObject({ kitItemIds: z.array(z.number().int().positive()).max(60) });
export const jobNotesInputSchema = z.strictObject({
  notes: z.string().trim().max(4000, { error: 'Notes must be at most 4,000 characters.' }),
  /** The notesVersion the notes were edited from: another person's save since then is a 409, not overwritten. */
  notesVersion: z.number().int().min(0).optional(),
});
export const jobPhotoTags = [
  'magnet_before',
  'magnet_after',
  'system',
  'test_result',
  'thermal_image',
  'other',
] as const;
export const jobPhotoTagLabels: Record<(typeof jobPhotoTags)[number], string> = {
  magnet_before: 'Filter magnet before',
  magnet_after: 'Filter magnet after',
  system: 'The system',
  test_result: 'Test result',
  thermal_image: 'Thermal image',
  other: 'Other',
};

/** An inhibitor check visit, recorded against a site after the clean. */
export const siteCheckInputSchema = z.strictObject({
  checkedOn: calendarDateWithin('The check date', dateRanges.done),
  inhibitorProductId: z.number().int().positive(),
  inhibitorReading: z.number().min(0).max(100_000),
  systemTdsPpm: z.number().min(0).max(5000).nullable().optional(),
  notes: z.string().trim().max(1000).nullable().optional(),
});
export type SiteCheckInput = z.infer<typeof siteCheckInputSchema>;

/** The firm's cold-bottom threshold when it has not set one: 10 K top to bottom (common practice (no source)). */
export const DEFAULT_COLD_BOTTOM_THRESHOLD_K = 10;
/** The EN 442 rating room temperature, used when the room was not measured. */
export const RATING_ROOM_C = 20;

export interface ReadingFigures {
  differenceK: number;
  coldBottom: boolean;
  /** Mean water to room, from flow and return where taken, else from the top and bottom surface readings. */
  deltaTK: number;
  deltaTFrom: 'flow_return' | 'surfaces';
  /** The room temperature the dT was reckoned from: the one taken, or the 20 °C rating room; kept apart from the reading's own roomC so "not taken" stays visible. */
  roomUsedC: number;
  /** EN 442 output at this dT from the radiator's rated output at dT 50, when the survey has it. */
  outputWatts: number | null;
}

export function readingFigures(
  r: RadiatorReadingInput,
  ratedWatts: number | null | undefined,
  thresholdK: number,
  exponent = 1.3,
): ReadingFigures {
  const roomC = r.roomC ?? RATING_ROOM_C;
  const fromFlow = r.flowC != null && r.returnC != null;
  const deltaTK = fromFlow
    ? meanWaterToRoomKelvin(r.flowC!, r.returnC!, roomC)
    : meanWaterToRoomKelvin(r.topC, r.bottomC, roomC);
  return {
    differenceK: round1(r.topC - r.bottomC),
    coldBottom: coldBottom(r.topC, r.bottomC, thresholdK),
    deltaTK: round1(deltaTK),
    deltaTFrom: fromFlow ? 'flow_return' : 'surfaces',
    roomUsedC: roomC,
    outputWatts: ratedWatts ? Math.round(radiatorOutputWatts(ratedWatts, deltaTK, exponent)) : null,
  };
}

/** Within this share of a HAV value the sheet warns that the day is approaching it. */
export const HAV_APPROACH_SHARE = 0.8;
export type HavLevel = 'low' | 'nearing_action' | 'above_action' | 'nearing_limit' | 'above_limit';

/** An engineer's hand-arm vibration points for a day, from each agitation's magnitude and minutes. */
export function havDay(agitations: { magnitudeMs2: number | null; minutes: number }[]): {
  points: number;
  level: HavLevel;
  message: string;
} {
  const points =
    Math.round(
      agitations.reduce((n, a) => n + (a.magnitudeMs2 ? vibrationPoints(a.magnitudeMs2, a.minutes / 60) : 0), 0) * 10,
    ) / 10;
  const level: HavLevel =
    points > HAV_LIMIT_POINTS
      ? 'above_limit'
      : points >= HAV_LIMIT_POINTS * HAV_APPROACH_SHARE
        ? 'nearing_limit'
        : points >= HAV_ACTION_POINTS
          ? 'above_action'
          : points >= HAV_ACTION_POINTS * HAV_APPROACH_SHARE
            ? 'nearing_action'
            : 'low';
  const messages: Record<HavLevel, string> = {
    low: `${points} vibration points today, below the exposure action value of ${HAV_ACTION_POINTS}.`,
    nearing_action: `${points} vibration points today: nearing the exposure action value of ${HAV_ACTION_POINTS}. Plan breaks and share the agitation.`,
    above_action: `${points} vibration points today: over the exposure action value of ${HAV_ACTION_POINTS}. Reduce exposure; the firm must act on it.`,
    nearing_limit: `${points} vibration points today: nearing the limit value of ${HAV_LIMIT_POINTS}. Stop agitating soon.`,
    above_limit: `${points} vibration points today: over the limit value of ${HAV_LIMIT_POINTS}. Stop using vibrating tools today.`,
  };
  return { points, level, message: messages[level] };
}

export interface WaterTestFigures {
  flush: { complete: boolean; withinPercent: number } | null;
  inhibitor: { result: 'pass' | 'low' | 'high'; min: number; max: number; unit: string | null } | null;
}

export function waterTestFigures(
  t: WaterTestsInput,
  inhibitorRange: { min: number; max: number; unit: string | null } | null,
): WaterTestFigures {
  const flush =
    t.mainsTdsPpm != null && t.systemTdsPpm != null
      ? flushComplete(t.mainsTdsPpm, t.systemTdsPpm, t.waterClear === true)
      : null;
  const inhibitor =
    t.inhibitorReading != null && inhibitorRange
      ? { result: inhibitorCheck(t.inhibitorReading, inhibitorRange), ...inhibitorRange }
      : null;
  return {
    flush: flush && { complete: flush.complete, withinPercent: Math.round(flush.withinPercent * 10) / 10 },
    inhibitor,
  };
}

function round1(n: number) {
  return Math.round(n * 10) / 10;
}
