import { boilerKinds, builtInHeatExchangerLitres, fuels, type HeatExchangerDefaults } from '@heatfleet/domain';

/** The form's field names, one per fuel and boiler kind, named by the path the API reports errors on. */
export const heatExchangerFieldNames = fuels.flatMap((f) => boilerKinds.map((k) => `heatExchangerDefaults.${f}.${k}`));

/**
 * The nine figures as the API takes them; null (the built-in defaults) when they are exactly those,
 * so a firm that never changed them keeps following the built-in ones.
 */
export function heatExchangerInput(values: Record<string, string | undefined>): HeatExchangerDefaults | null {
  const grid = Object.fromEntries(
    fuels.map((f) => [
      f,
      Object.fromEntries(
        boilerKinds.map((k) => {
          const raw = values[`heatExchangerDefaults.${f}.${k}`]?.trim().replace(',', '.') ?? '';
          return [k, raw === '' ? Number.NaN : Number(raw)];
        }),
      ),
    ]),
  ) as HeatExchangerDefaults;
  const same = fuels.every((f) => boilerKinds.every((k) => grid[f][k] === builtInHeatExchangerLitres[f][k]));
  return same ? null : grid;
}
