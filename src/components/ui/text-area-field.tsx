import { type TextareaHTMLAttributes, useId } from 'react';
import { FieldHelp, fieldClass, helpIds } from './field-help';

type Props = TextareaHTMLAttributes<HTMLTextAreaElement> & {
  label: string;
  errors?: string[];
  hint?: string;
  /** extra classes for the text area itself (e.g. a monospaced chart) */
  inputClassName?: string;
};

/** A labelled text area whose errors sit right under it (and are tied to it for screen readers). */
export function TextAreaField({ label, errors, hint, id, className = '', inputClassName = '', ...props }: Props) {
  const auto = useId();
  const inputId = id ?? auto;
  const { invalid, describedBy } = helpIds(inputId, hint, errors);
  return (
    <div className={`grid min-w-0 gap-1 ${className}`}>
      <label htmlFor={inputId} className="text-body font-semibold">
        {label}
      </label>
      <textarea
        id={inputId}
        aria-invalid={invalid || undefined}
        aria-describedby={describedBy}
        className={`${fieldClass(invalid)} ${inputClassName}`}
        {...props}
      />
      <FieldHelp inputId={inputId} hint={hint} errors={errors} />
    </div>
  );
}
