import { useId, type InputHTMLAttributes } from 'react';

interface SettingsFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: string;
  name: string;
  error?: string | undefined;
  hint?: string;
}

/** A settings input 48 px tall, its hint and error tied to it for screen readers. */
export function SettingsField({ label, name, error, hint, className = '', ...rest }: SettingsFieldProps) {
  const id = useId();
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ');
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
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy || undefined}
        className={`min-h-12 w-full rounded-md border-2 bg-card px-3 text-base ${error ? 'border-danger-700' : 'border-line-strong'}`}
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
