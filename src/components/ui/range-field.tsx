import type { InputHTMLAttributes, ReactNode } from 'react';
import { Field } from './field-help';

type Props = Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & {
  label: ReactNode;
  errors?: string[];
  hint?: ReactNode;
};

/** A labelled slider (tempo, volume, swing) whose value applies as it moves. */
export function RangeField({ label, errors, hint, id, className, ...props }: Props) {
  return (
    <Field label={label} hint={hint} errors={errors} id={id} className={className}>
      {(control) => <input {...control} type="range" className="w-full min-w-0 accent-brass-600" {...props} />}
    </Field>
  );
}
