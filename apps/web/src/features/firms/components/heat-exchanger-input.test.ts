import { describe, expect, it } from 'vitest';
import { builtInHeatExchangerLitres, firmSettingsInputSchema } from '@heatfleet/domain';
import { heatExchangerFieldNames, heatExchangerInput } from '@/features/firms/components/heat-exchanger-input';

const typed = (over: Record<string, string> = {}) => ({
  ...Object.fromEntries(
    heatExchangerFieldNames.map((name) => {
      const [, fuel, kind] = name.split('.') as [string, 'gas' | 'oil' | 'other', 'combi' | 'system' | 'regular'];
      return [name, String(builtInHeatExchangerLitres[fuel][kind])];
    }),
  ),
  ...over,
});
const base = { name: 'Example Heating', timeZone: 'Europe/London', volumeUnit: 'litres', coldBottomThresholdK: 10 };

describe('the heat exchanger defaults as typed in firm settings', () => {
  it('the built-in figures unchanged are sent as null, so the firm keeps following them (from memory)', () => {
    expect(heatExchangerInput(typed())).toBeNull();
  });

  it('a changed figure sends the whole grid; a comma is a decimal point', () => {
    const grid = heatExchangerInput(typed({ 'heatExchangerDefaults.oil.regular': '22,5' }));
    expect(grid).toMatchObject({ oil: { combi: 10, system: 12, regular: 22.5 }, gas: { combi: 1 } });
    expect(firmSettingsInputSchema.safeParse({ ...base, heatExchangerDefaults: grid }).success).toBe(true);
  });

  it('an empty or impossible figure is refused beside its own field', () => {
    const grid = heatExchangerInput(typed({ 'heatExchangerDefaults.gas.combi': '' }));
    const issue = firmSettingsInputSchema.safeParse({ ...base, heatExchangerDefaults: grid }).error?.issues[0];
    expect(issue?.path.join('.')).toBe('heatExchangerDefaults.gas.combi');
  });
});
