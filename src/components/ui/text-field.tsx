import { type InputHTMLAttributes, useId } from 'react';

type Props = InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  /** messages for this field, shown under it and read out with it */
  errors?: string[];
  hint?: string;
};

/** A labelled input whose errors sit right under it (and are tied to it for screen readers). */
export function TextField({ label, errors, hint, id, className = '', ...props }: Props) {
  const auto = useId();
  const inputId = id ?? auto;
  const errorId = `${inputId}-error`;
  const hintId = `${inputId}-hint`;
  const invalid = Boolean(errors && errors.length > 0);
  const describedBy = [hint ? hintId : null, invalid ? errorId : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`grid min-w-0 gap-1 ${className}`}>
      <label htmlFor={inputId} className="text-body font-semibold">
        {label}
      </label>
      <input
        id={inputId}
        aria-invalid={invalid || undefined}
        aria-describedby={describedBy}
        className={`w-full min-w-0 rounded-lg border bg-raised px-3 py-2 text-body text-text ${invalid ? 'border-ember-500' : 'border-line focus:border-ink-500'}`}
        {...props}
      />
      {hint && !invalid ? (
        <p id={hintId} className="text-caption text-muted">
          {hint}
        </p>
      ) : null}
      {invalid ? (
        <p id={errorId} className="text-caption font-semibold text-ember-700 dark:text-ember-100">
          {errors!.join(' ')}
        </p>
      ) : null}
    </div>
  );
}
