import { type ReactNode, useId } from 'react';

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

/** What a field's own control needs to be named and described by its frame. */
export interface FieldControl {
  id: string;
  'aria-invalid'?: true;
  'aria-describedby'?: string;
}

/**
 * The frame every labelled field shares: the label over the control, then its hint or errors
 * tied to it for screen readers. `children` draws the control with the ids given.
 */
export function Field({
  label,
  hideLabel,
  hint,
  errors,
  id,
  className = '',
  children,
}: {
  label: ReactNode;
  hideLabel?: boolean;
  hint?: ReactNode;
  errors?: string[];
  id?: string;
  className?: string;
  children: (control: FieldControl, invalid: boolean) => ReactNode;
}) {
  const auto = useId();
  const inputId = id ?? auto;
  const { invalid, describedBy } = helpIds(inputId, hint, errors);
  return (
    <div className={`grid min-w-0 gap-1 ${className}`}>
      <label htmlFor={inputId} className={hideLabel ? 'sr-only' : 'text-body font-semibold'}>
        {label}
      </label>
      {children({ id: inputId, 'aria-invalid': invalid || undefined, 'aria-describedby': describedBy }, invalid)}
      <FieldHelp inputId={inputId} hint={hint} errors={errors} />
    </div>
  );
}
