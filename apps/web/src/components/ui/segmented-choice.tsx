import { useId } from 'react';

interface SegmentedChoiceProps<V extends string> {
  legend: string;
  options: ReadonlyArray<{ value: V; label: string }>;
  value: V | '';
  onChange: (value: V) => void;
  /** Side by side on a phone too: keep the labels short. */
  columns?: 2 | 3 | 4;
  hideLegend?: boolean;
  disabled?: boolean;
}

const grid = { 2: 'grid-cols-2', 3: 'grid-cols-3', 4: 'grid-cols-4' } as const;

/**
 * A few short choices side by side, one tap each (radio buttons drawn as 48 px segments): for the
 * choices a form asks every time, where a drop-down would cost two taps and hide the options.
 */
export function SegmentedChoice<V extends string>({
  legend,
  options,
  value,
  onChange,
  columns = 3,
  hideLegend = false,
  disabled = false,
}: SegmentedChoiceProps<V>) {
  const name = useId();
  return (
    <fieldset disabled={disabled}>
      <legend className={hideLegend ? 'sr-only' : 'mb-1 font-semibold'}>{legend}</legend>
      <div className={`grid gap-1 ${grid[columns]}`}>
        {options.map((option) => (
          <label
            key={option.value}
            className="relative flex min-h-12 cursor-pointer items-center justify-center rounded-md border-2 border-line-strong bg-card px-1 text-center font-semibold leading-tight has-[:checked]:border-brand-700 has-[:checked]:bg-brand-700 has-[:checked]:text-white has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-ember-700"
          >
            <input
              type="radio"
              name={name}
              value={option.value}
              // Over the whole segment, unseen: the tap lands on the radio itself wherever it falls.
              className="absolute inset-0 size-full cursor-pointer opacity-0"
              checked={option.value === value}
              onChange={(event) => event.target.checked && onChange(option.value)}
            />
            {option.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
