import { type InputHTMLAttributes, useId } from 'react';
import { FieldHelp, helpIds } from './field-help';

type Props = Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & {
  label: string;
  errors?: string[];
  hint?: string;
};

/** A labelled file picker whose errors sit right under it. */
export function FileField({ label, errors, hint, id, className = '', ...props }: Props) {
  const auto = useId();
  const inputId = id ?? auto;
  const { invalid, describedBy } = helpIds(inputId, hint, errors);
  return (
    <div className={`grid min-w-0 gap-1 ${className}`}>
      <label htmlFor={inputId} className="text-body font-semibold">
        {label}
      </label>
      <input
        id={inputId}
        type="file"
        aria-invalid={invalid || undefined}
        aria-describedby={describedBy}
        className="text-body file:mr-3 file:rounded-lg file:border file:border-line file:bg-raised file:px-3 file:py-1.5"
        {...props}
      />
      <FieldHelp inputId={inputId} hint={hint} errors={errors} />
    </div>
  );
}
