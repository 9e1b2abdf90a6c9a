import { useId, type InputHTMLAttributes, type KeyboardEvent } from 'react';
import { focusNextField } from '@/components/ui/focus-next';

interface NumberFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'onChange' | 'value'> {
  label: string;
  name: string;
  value: string;
  onValueChange: (value: string) => void;
  /** Called on Enter before the focus moves on, e.g. to save what is typed at once. */
  onEnter?: () => void;
  error?: string | undefined;
  hint?: string;
  /** Whole numbers bring up the plain keypad; anything else the decimal one. */
  whole?: boolean;
}

/**
 * A figure typed on a phone's number keypad, 48 px tall for gloved fingers. Enter never submits: it
 * moves to the next field (see focusNextField), so a half-filled reading is never sent.
 */
export function NumberField({
  label,
  name,
  value,
  onValueChange,
  onEnter,
  error,
  hint,
  whole = false,
  className = '',
  onKeyDown,
  ...rest
}: NumberFieldProps) {
  const id = useId();
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ');
  const keyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    onKeyDown?.(event);
    if (event.key !== 'Enter' || event.defaultPrevented) return;
    event.preventDefault();
    onEnter?.();
    focusNextField(event.currentTarget);
  };
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      <input
        id={id}
        name={name}
        type="text"
        inputMode={whole ? 'numeric' : 'decimal'}
        enterKeyHint="next"
        autoComplete="off"
        data-field=""
        value={value}
        onChange={(event) => onValueChange(event.target.value)}
        onKeyDown={keyDown}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy || undefined}
        className={`min-h-12 w-full rounded-md border-2 bg-card px-3 text-lg tabular-nums ${error ? 'border-danger-700' : 'border-line-strong'}`}
        {...rest}
      />
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-danger-700">
          {error}
        </p>
      ) : null}
    </div>
  );
}
