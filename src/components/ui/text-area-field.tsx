import type { TextareaHTMLAttributes } from 'react';
import { Field, fieldClass } from './field-help';

type Props = TextareaHTMLAttributes<HTMLTextAreaElement> & {
  label: string;
  errors?: string[];
  hint?: string;
  /** extra classes for the text area itself (e.g. a monospaced chart) */
  inputClassName?: string;
};

/** A labelled text area whose errors sit right under it (and are tied to it for screen readers). */
export function TextAreaField({ label, errors, hint, id, className, inputClassName = '', ...props }: Props) {
  return (
    <Field label={label} hint={hint} errors={errors} id={id} className={className}>
      {(control, invalid) => (
        <textarea {...control} className={`${fieldClass(invalid)} ${inputClassName}`} {...props} />
      )}
    </Field>
  );
}
