import type { ReactNode } from 'react';

/** The ids a field's hint and errors use, and its aria-describedby. */
export function helpIds(inputId: string, hint: ReactNode | undefined, errors: string[] | undefined) {
  const errorId = `${inputId}-error`;
  const hintId = `${inputId}-hint`;
  const invalid = Boolean(errors && errors.length > 0);
  const describedBy = [hint ? hintId : null, invalid ? errorId : null].filter(Boolean).join(' ') || undefined;
  return { errorId, hintId, invalid, describedBy };
}

/** A field's hint (while it is valid) or its errors, under it. */
export function FieldHelp({ inputId, hint, errors }: { inputId: string; hint?: ReactNode; errors?: string[] }) {
  const { errorId, hintId, invalid } = helpIds(inputId, hint, errors);
  if (invalid)
    return (
      <p id={errorId} className="text-caption font-semibold text-ember-700 dark:text-ember-100">
        {errors!.join(' ')}
      </p>
    );
  return hint ? (
    <p id={hintId} className="text-caption text-muted">
      {hint}
    </p>
  ) : null;
}

export const fieldClass = (invalid: boolean) =>
  `w-full min-w-0 rounded-lg border bg-raised px-3 py-2 text-body text-text ${invalid ? 'border-ember-500' : 'border-line focus:border-ink-500'}`;
