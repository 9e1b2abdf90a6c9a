import { useCallback, useEffect, useRef, useState, type FormEvent } from 'react';
import type { z } from 'zod';
import { isApiError } from '@/lib/api-client';

export type FieldErrors = Partial<Record<string, string>>;

/**
 * The first message for each field, keyed by its dotted path ("radiators.0.widthMm"), from zod's
 * issues or the API's 422 details alike.
 */
export function firstErrorPerField(
  issues: ReadonlyArray<{ path: PropertyKey[] | string; message: string }>,
): FieldErrors {
  const errors: FieldErrors = {};
  for (const issue of issues) {
    const key = Array.isArray(issue.path) ? issue.path.map(String).join('.') : issue.path;
    errors[key] ??= issue.message;
  }
  return errors;
}

/**
 * One way for every form: the shared zod schema checks input before it is sent, and the API's own
 * 422 details land beside the same fields. Anything not tied to a field shows as the form's message.
 */
export function useSchemaForm<S extends z.ZodType>(
  schema: S,
  fields: readonly string[],
  /** Turns the form's strings into what the schema expects (ids to numbers, empty dates to null, checkboxes to booleans). */
  prepare?: (values: Record<string, string | undefined>) => Record<string, unknown>,
) {
  const formRef = useRef<HTMLFormElement>(null);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [focusToken, setFocusToken] = useState(0);

  useEffect(() => {
    if (focusToken === 0) return;
    formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus();
  }, [focusToken]);

  const clearErrors = useCallback(() => {
    setFieldErrors({});
    setFormError(null);
  }, []);

  const showError = useCallback(
    (error: unknown) => {
      if (isApiError(error) && error.details.length > 0) {
        const byField = firstErrorPerField(error.details);
        const known = Object.fromEntries(Object.entries(byField).filter(([path]) => fields.includes(path)));
        setFieldErrors(known);
        const unplaced = error.details.filter((detail) => !fields.includes(detail.path));
        setFormError(Object.keys(known).length === 0 || unplaced.length > 0 ? error.message : null);
        setFocusToken((n) => n + 1);
        return;
      }
      setFieldErrors({});
      setFormError(error instanceof Error ? error.message : 'Something went wrong. Please try again.');
    },
    [fields],
  );

  const handleSubmit = useCallback(
    (onValid: (data: z.output<S>) => void) => (event: FormEvent<HTMLFormElement>) => {
      event.preventDefault();
      const formData = new FormData(event.currentTarget);
      const values: Record<string, string | undefined> = {};
      for (const field of fields) {
        const value = formData.get(field);
        if (typeof value === 'string') values[field] = value;
      }
      const parsed = schema.safeParse(prepare ? prepare(values) : values);
      if (!parsed.success) {
        setFieldErrors(firstErrorPerField(parsed.error.issues));
        setFormError(null);
        setFocusToken((n) => n + 1);
        return;
      }
      clearErrors();
      onValid(parsed.data);
    },
    [schema, fields, clearErrors, prepare],
  );

  return { formRef, fieldErrors, formError, handleSubmit, showError, clearErrors };
}

/** For optional numeric selects: "" means none. */
export function idOrNull(value: string | undefined): number | null {
  return value ? Number(value) : null;
}

/** Optional text and date inputs: an empty box means "not set". */
export function textOrNull(value: string | undefined): string | null {
  return value && value.trim() !== '' ? value : null;
}
