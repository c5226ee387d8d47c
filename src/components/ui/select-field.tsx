import type { SelectHTMLAttributes } from 'react';
import { Field, fieldClass } from './field-help';

type Props = SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  options: ReadonlyArray<{ value: string; label: string }>;
  errors?: string[];
  /** the label is read out but not shown (a heading beside the select already says it) */
  hideLabel?: boolean;
};

/** A labelled select whose errors sit right under it (and are tied to it for screen readers). */
export function SelectField({ label, options, errors, hideLabel, id, className, ...props }: Props) {
  return (
    <Field label={label} hideLabel={hideLabel} errors={errors} id={id} className={className}>
      {(control, invalid) => (
        <select {...control} className={fieldClass(invalid)} {...props}>
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      )}
    </Field>
  );
}
