import { z } from 'zod';

export const boilerKinds = ['combi', 'system', 'regular'] as const;
export type BoilerKind = (typeof boilerKinds)[number];
export const fuels = ['gas', 'oil', 'other'] as const;
export type Fuel = (typeof fuels)[number];

const litres = (label: string) =>
  z
    .number({ error: `${label} must be a number of litres.` })
    .min(0, { error: `${label} must be between 0 and 100 litres.` })
    .max(100, { error: `${label} must be between 0 and 100 litres.` });

const byKind = (fuel: string) =>
  z.strictObject({
    combi: litres(`The ${fuel} combi default`),
    system: litres(`The ${fuel} system boiler default`),
    regular: litres(`The ${fuel} regular boiler default`),
  });

/** A firm's heat exchanger water content defaults, litres, by fuel and boiler kind. */
export const heatExchangerDefaultsSchema = z.strictObject({
  gas: byKind('gas'),
  oil: byKind('oil'),
  other: byKind('other-fuel'),
});
export type HeatExchangerDefaults = z.infer<typeof heatExchangerDefaultsSchema>;

/**
 * Built-in heat exchanger content, litres, used until a firm sets its own: from memory, not a
 * standard (a gas combi holds about 1 L; a floor-standing oil boiler often 10 to 25 L). The maker's
 * figure for the appliance, typed on the survey, always wins.
 */
export const builtInHeatExchangerLitres: HeatExchangerDefaults = {
  gas: { combi: 1, system: 2, regular: 3 },
  oil: { combi: 10, system: 12, regular: 15 },
  other: { combi: 2, system: 5, regular: 10 },
};

/** The default for a boiler kind and fuel: the firm's own, else the built-in one. */
export function heatExchangerDefaultLitres(
  boilerKind: BoilerKind,
  fuel: Fuel,
  firmDefaults: HeatExchangerDefaults | null = null,
): number {
  return (firmDefaults ?? builtInHeatExchangerLitres)[fuel][boilerKind];
}
