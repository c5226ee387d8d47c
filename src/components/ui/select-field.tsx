import { type SelectHTMLAttributes, useId } from 'react';

type Props = SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  options: ReadonlyArray<{ value: string; label: string }>;
  errors?: string[];
  /** the label is read out but not shown (a heading beside the select already says it) */
  hideLabel?: boolean;
};

/** A labelled select whose errors sit right under it (and are tied to it for screen readers). */
export function SelectField({ label, options, errors, hideLabel, id, className = '', ...props }: Props) {
  const auto = useId();
  const selectId = id ?? auto;
  const errorId = `${selectId}-error`;
  const invalid = Boolean(errors && errors.length > 0);
  return (
    <div className={`grid min-w-0 gap-1 ${className}`}>
      <label htmlFor={selectId} className={hideLabel ? 'sr-only' : 'text-body font-semibold'}>
        {label}
      </label>
      <select
        id={selectId}
        aria-invalid={invalid || undefined}
        aria-describedby={invalid ? errorId : undefined}
        className={`w-full min-w-0 rounded-lg border bg-raised px-3 py-2 text-body text-text ${invalid ? 'border-ember-500' : 'border-line focus:border-ink-500'}`}
        {...props}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {invalid ? (
        <p id={errorId} className="text-caption font-semibold text-ember-700 dark:text-ember-100">
          {errors!.join(' ')}
        </p>
      ) : null}
    </div>
  );
}
