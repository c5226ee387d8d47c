import type { InputHTMLAttributes } from 'react';
import { Field, fieldClass } from './field-help';

type Props = InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  /** messages for this field, shown under it and read out with it */
  errors?: string[];
  hint?: string;
};

/** A labelled input whose errors sit right under it (and are tied to it for screen readers). */
export function TextField({ label, errors, hint, id, className, ...props }: Props) {
  return (
    <Field label={label} hint={hint} errors={errors} id={id} className={className}>
      {(control, invalid) => <input {...control} className={fieldClass(invalid)} {...props} />}
    </Field>
  );
}
