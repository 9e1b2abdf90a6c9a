import { useRef } from 'react';
import {
  boilerKinds,
  builtInHeatExchangerLitres,
  fuels,
  type BoilerKind,
  type Fuel,
  type HeatExchangerDefaults,
} from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import type { FieldErrors } from '@/lib/form';
import { TextField } from '@/components/ui/text-field';

const fuelLabels: Record<Fuel, string> = { gas: 'Gas', oil: 'Oil', other: 'Other fuels' };
const kindLabels: Record<BoilerKind, string> = { combi: 'Combi', system: 'System', regular: 'Regular' };

/** Heat exchanger water content by fuel and boiler kind, litres: typed on a decimal keypad, 48 px targets. */
export function HeatExchangerFields({
  defaults,
  own,
  errors,
}: {
  defaults: HeatExchangerDefaults;
  own: boolean;
  errors: FieldErrors;
}) {
  const box = useRef<HTMLFieldSetElement>(null);
  const useBuiltIn = () => {
    for (const f of fuels)
      for (const k of boilerKinds) {
        const input = box.current?.querySelector<HTMLInputElement>(`input[name="heatExchangerDefaults.${f}.${k}"]`);
        if (input) input.value = String(builtInHeatExchangerLitres[f][k]);
      }
  };
  return (
    <fieldset ref={box} className="space-y-3 rounded-md border border-line p-4">
      <legend className="px-1 font-semibold">Heat exchanger content (litres)</legend>
      <p className="text-sm text-ink-muted">
        {own
          ? 'Your firm\u2019s own figures, used when a survey does not give the boiler\u2019s. '
          : 'Built-in defaults from memory, not a standard: change them to your own. '}
        A gas combi holds about 1 L; a floor-standing oil boiler often 10 to 25 L. The maker\u2019s figure typed on a
        survey always wins.
      </p>
      {fuels.map((f) => (
        <div key={f} role="group" aria-label={fuelLabels[f]} className="grid grid-cols-3 gap-3">
          {boilerKinds.map((k) => {
            const name = `heatExchangerDefaults.${f}.${k}`;
            return (
              <TextField
                key={k}
                label={`${fuelLabels[f]} ${kindLabels[k].toLowerCase()}`}
                name={name}
                inputMode="decimal"
                enterKeyHint="next"
                autoComplete="off"
                defaultValue={String(defaults[f][k])}
                error={errors[name]}
              />
            );
          })}
        </div>
      ))}
      <Button variant="secondary" className="min-h-12 w-full sm:w-auto" onClick={useBuiltIn}>
        Use the built-in defaults
      </Button>
    </fieldset>
  );
}
