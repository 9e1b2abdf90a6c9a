import { useId } from 'react';

interface ChoiceGroupProps {
  legend: string;
  name: string;
  options: ReadonlyArray<{ value: string; label: string; hint?: string }>;
  defaultValue?: string;
  value?: string;
  onChange?: (value: string) => void;
  error?: string | undefined;
  /** Side by side from this many options up on wider screens; stacked on a phone. */
  columns?: 2 | 3;
}

/** Radio buttons as large tiles: easy to hit with a gloved thumb, clear which one is chosen. */
export function ChoiceGroup({
  legend,
  name,
  options,
  defaultValue,
  value,
  onChange,
  error,
  columns = 3,
}: ChoiceGroupProps) {
  const id = useId();
  return (
    <fieldset
      aria-describedby={error ? `${id}-error` : undefined}
      aria-invalid={error ? true : undefined}
      tabIndex={error ? -1 : undefined}
    >
      <legend className="mb-1 font-semibold">{legend}</legend>
      <div className={`grid gap-2 ${columns === 3 ? 'sm:grid-cols-3' : 'sm:grid-cols-2'}`}>
        {options.map((option) => (
          <label
            key={option.value}
            className={`flex min-h-14 cursor-pointer items-center gap-3 rounded-lg border-2 bg-card px-4 py-2 has-[:checked]:border-brand-700 has-[:checked]:bg-brand-50 has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-ember-700 ${
              error ? 'border-danger-700' : 'border-line-strong'
            }`}
          >
            <input
              type="radio"
              name={name}
              value={option.value}
              className="size-5 shrink-0 accent-brand-700 focus-visible:outline-none"
              {...(value === undefined
                ? { defaultChecked: option.value === defaultValue }
                : { checked: option.value === value })}
              onChange={(event) => event.target.checked && onChange?.(option.value)}
            />
            <span>
              <span className="block font-semibold">{option.label}</span>
              {option.hint ? <span className="block text-sm text-ink-muted">{option.hint}</span> : null}
            </span>
          </label>
        ))}
      </div>
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-sm font-semibold text-danger-700">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
