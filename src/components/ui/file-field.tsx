import type { InputHTMLAttributes } from 'react';
import { Field } from './field-help';

type Props = Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & {
  label: string;
  errors?: string[];
  hint?: string;
};

/** A labelled file picker whose errors sit right under it. */
export function FileField({ label, errors, hint, id, className, ...props }: Props) {
  return (
    <Field label={label} hint={hint} errors={errors} id={id} className={className}>
      {(control) => (
        <input
          {...control}
          type="file"
          className="text-body file:mr-3 file:rounded-lg file:border file:border-line file:bg-raised file:px-3 file:py-1.5"
          {...props}
        />
      )}
    </Field>
  );
}
