import { useId, type TextareaHTMLAttributes } from 'react';

interface TextareaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> {
  label: string;
  name: string;
  error?: string | undefined;
  hint?: string;
}

export function TextareaField({ label, name, error, hint, className = '', rows = 2, ...rest }: TextareaFieldProps) {
  const id = useId();
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined;
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
      <textarea
        id={id}
        name={name}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`min-h-12 w-full rounded-md border bg-card px-3 py-2 text-base ${error ? 'border-danger-700' : 'border-line-strong'}`}
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
