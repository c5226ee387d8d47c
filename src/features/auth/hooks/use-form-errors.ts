import { useState } from 'react';
import type { z } from 'zod';
import { ApiError } from '@/lib/api-client';

export type FieldErrors = Record<string, string[]>;

/**
 * Field errors for a form, from the same zod schema the server uses (checked before sending)
 * and from a 400's `fields` (after). `formError` is for what belongs to no one field.
 */
export function useFormErrors<S extends z.ZodType>(schema: S) {
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  /** Parses the values; on failure shows each field's message and returns null. */
  function check(values: unknown): z.infer<S> | null {
    const parsed = schema.safeParse(values);
    setFormError(null);
    if (parsed.success) {
      setFields({});
      return parsed.data;
    }
    const next: FieldErrors = {};
    for (const issue of parsed.error.issues) {
      const key = issue.path.map(String).join('.') || '_';
      next[key] = [...(next[key] ?? []), issue.message];
    }
    setFields(next);
    return null;
  }

  /** Shows a failed request: its fields inline, anything else above the form. */
  function fromError(err: unknown) {
    if (err instanceof ApiError && err.fields && Object.keys(err.fields).length > 0) {
      setFields(err.fields);
      setFormError(null);
      return;
    }
    setFields({});
    setFormError(err instanceof Error ? err.message : 'Something went wrong; try again');
  }

  function clear() {
    setFields({});
    setFormError(null);
  }

  return { fields, formError, check, fromError, clear };
}
