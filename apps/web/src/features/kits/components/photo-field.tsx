import { useId, useState } from 'react';
import { photoProblem } from '@/features/kits/api/upload-photo';

/**
 * An optional photo, taken with the phone's back camera where there is one. The file is checked
 * here against the server's limits; the form uploads it on submit.
 */
export function PhotoField({
  label,
  file,
  onChange,
  error,
}: {
  label: string;
  file: File | null;
  onChange: (file: File | null) => void;
  error?: string | undefined;
}) {
  const id = useId();
  const [problem, setProblem] = useState<string | null>(null);
  const shown = problem ?? error;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <input
        id={id}
        type="file"
        accept="image/jpeg,image/png,image/webp"
        capture="environment"
        aria-invalid={shown ? true : undefined}
        aria-describedby={shown ? `${id}-error` : undefined}
        onChange={(event) => {
          const picked = event.target.files?.[0] ?? null;
          const why = picked ? photoProblem(picked) : null;
          setProblem(why);
          onChange(why ? null : picked);
          if (why) event.target.value = '';
        }}
        className="min-h-12 w-full rounded-md border border-line-strong bg-card p-2 text-base file:mr-3 file:min-h-9 file:rounded-md file:border-0 file:bg-brand-50 file:px-3 file:font-semibold file:text-brand-800"
      />
      {file ? <p className="text-sm text-ink-muted">{file.name} will be sent with this.</p> : null}
      {shown ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-danger-700">
          {shown}
        </p>
      ) : null}
    </div>
  );
}
