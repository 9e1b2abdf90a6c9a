import type { Fuel } from './heat-exchanger.ts';
import type { Survey, VisitKind } from './job-schemas.ts';
import type { JobStep } from './job-sheet.ts';

/**
 * The steps of a visit fitted to the system, the fuel and the kind of visit, each with the cautions
 * that belong beside it. Sources, as commonly quoted (the tests name them again):
 * - gas: only a business on the Gas Safe Register may work on a gas appliance (Gas Safety
 *   (Installation and Use) Regulations 1998, regulation 3);
 * - oil and other fuels: a competent person registered for that fuel, as the competent person
 *   schemes under the Building Regulations 2010 (Schedule 3) provide; never the gas caution;
 * - cleaning, flushing and inhibitor: BS 7593;
 * - open-vented systems are filled and vented from the feed-and-expansion cistern and never
 *   pressurised; sealed systems are refilled through the filling loop to the cold fill pressure the
 *   boiler's instructions give (about 1 to 1.5 bar); zone valves latched open for the flush:
 *   common practice (no source).
 */

export const visitCautionKeys = [
  'hot_water',
  'electrical',
  'gas_safe',
  'oil_competent',
  'other_fuel_competent',
  'chemicals',
  'drain',
  'open_vented_no_pressure',
  'sealed_pressure',
  'judgement',
] as const;
export type VisitCautionKey = (typeof visitCautionKeys)[number];

export const visitCautionTexts: Record<VisitCautionKey, string> = {
  hot_water: 'Hot water and surfaces scald: let the system cool before draining.',
  electrical: 'Isolate the boiler electrically and prove it dead before working on it.',
  gas_safe: 'Gas appliance: any work on it or its gas supply is for a business on the Gas Safe Register only.',
  oil_competent:
    'Oil appliance: any work on it or its oil supply is for a competent person registered for oil work only.',
  other_fuel_competent: 'Any work on the appliance is for a competent person registered for its fuel only.',
  chemicals: 'Read the product\u2019s safety data sheet; wear gloves and eye protection; never mix cleaners.',
  drain: 'Flushing water and sludge go to a foul drain, never a surface-water drain.',
  open_vented_no_pressure:
    'Open-vented system: never pressurise it. It fills and vents from its feed-and-expansion cistern; old pipework and joints may not take pressure.',
  sealed_pressure:
    'Sealed system: refill through the filling loop to the cold fill pressure only (about 1 to 1.5 bar, from the boiler\u2019s instructions); its relief valve opens at about 3 bar.',
  judgement:
    'These figures support your judgement; they do not replace it. Follow local codes, the manufacturers\u2019 instructions and licensed practice.',
};

export interface VisitCaution {
  key: VisitCautionKey;
  text: string;
}
export interface VisitStep {
  step: JobStep;
  label: string;
  cautions: VisitCaution[];
}
export interface VisitShape {
  systemType: Survey['systemType'];
  fuel: Fuel;
  visitKind: VisitKind;
}

const fuelCaution: Record<Fuel, VisitCautionKey> = {
  gas: 'gas_safe',
  oil: 'oil_competent',
  other: 'other_fuel_competent',
};

const caution = (key: VisitCautionKey): VisitCaution => ({ key, text: visitCautionTexts[key] });
const step = (s: JobStep, label: string, cautions: VisitCautionKey[] = []): VisitStep => ({
  step: s,
  label,
  cautions: cautions.map(caution),
});

export function visitSteps({ systemType, fuel, visitKind }: VisitShape): VisitStep[] {
  const openVented = systemType === 'open_vented';
  const fuelKey = fuelCaution[fuel];
  if (visitKind === 'inhibitor_only') {
    return [
      openVented
        ? step('dose_inhibitor', 'Dose the inhibitor through the feed-and-expansion cistern or a radiator', [
            'chemicals',
          ])
        : step(
            'dose_inhibitor',
            'Dose the inhibitor through the filter\u2019s dosing point or a radiator, then top up through the filling loop to the cold fill pressure',
            ['chemicals', 'sealed_pressure'],
          ),
      step('circulate_inhibitor', 'Circulate to mix the inhibitor through the system', ['hot_water']),
      step('test_water', 'Test the inhibitor level once it has mixed'),
    ];
  }
  const cleanAndFlush = [
    step('latch_zone_valves', 'Latch open any motorised zone valve so every circuit is flushed'),
    step('dose_cleaner', 'Dose the cleaner', ['chemicals']),
    step('circulate_hot', 'Circulate hot for the cleaner\u2019s minimum time', ['hot_water']),
    step('agitate', 'Agitate each radiator'),
  ];
  if (openVented) {
    return [
      step('isolate_connect', 'Isolate the boiler and connect the flushing rig', ['electrical', fuelKey, 'hot_water']),
      step(
        'check_cistern',
        'Check and clean the feed-and-expansion cistern before the flush (dirty cistern water would foul the cleaned system)',
      ),
      ...cleanAndFlush,
      step(
        'flush',
        'Flush each radiator until clear, drawing water down from the cistern, the furthest from the rig first',
        ['drain', 'hot_water'],
      ),
      step('dose_inhibitor', 'Dose the inhibitor', ['chemicals']),
      step(
        'reinstate',
        'Reinstate: refill from the feed-and-expansion cistern, vent every radiator, release the zone valves and check for leaks',
        ['open_vented_no_pressure'],
      ),
    ];
  }
  return [
    step(
      'depressurise',
      'Isolate the boiler, let the system cool and release its pressure to 0 bar before opening it',
      ['electrical', fuelKey, 'hot_water'],
    ),
    step(
      'check_expansion_vessel',
      'Check the expansion vessel\u2019s charge at 0 bar against the boiler\u2019s instructions; recharge it if low',
    ),
    step('isolate_connect', 'Connect the flushing rig (the boiler still isolated)'),
    ...cleanAndFlush,
    step('flush', 'Flush each radiator until clear, the furthest from the rig first', ['drain', 'hot_water']),
    step('dose_inhibitor', 'Dose the inhibitor', ['chemicals']),
    step(
      'reinstate',
      'Reinstate: refill through the filling loop to the cold fill pressure (about 1 to 1.5 bar, from the boiler\u2019s instructions), vent, release the zone valves and check for leaks',
      ['sealed_pressure'],
    ),
  ];
}

/** The visit's cautions in one list (the sheet's box and the report): only those that fit the system, fuel and visit. */
export function visitCautions({ systemType, fuel, visitKind }: VisitShape): VisitCaution[] {
  const full = visitKind === 'full_clean';
  const keys: VisitCautionKey[] = [
    'hot_water',
    ...(full ? (['electrical'] as const) : []),
    fuelCaution[fuel],
    'chemicals',
    ...(full ? (['drain'] as const) : []),
    systemType === 'open_vented' ? 'open_vented_no_pressure' : 'sealed_pressure',
    'judgement',
  ];
  return keys.map(caution);
}

/**
 * Which products a visit doses: a full clean uses every product booked on it; an inhibitor visit
 * doses, circulates and tests the inhibitor only, so a cleaner booked on it is neither planned nor
 * taken off the van (DEVELOPERS.md, Product rules: the visit fitted to the system).
 */
export function visitDosesProduct(visitKind: VisitShape['visitKind'], productKind: string): boolean {
  return visitKind === 'full_clean' || productKind === 'inhibitor';
}
