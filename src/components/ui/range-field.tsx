import { type InputHTMLAttributes, type ReactNode, useId } from 'react';
import { FieldHelp, helpIds } from './field-help';

type Props = Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & {
  label: ReactNode;
  errors?: string[];
  hint?: ReactNode;
};

/** A labelled slider (tempo, volume, swing) whose value applies as it moves. */
export function RangeField({ label, errors, hint, id, className = '', ...props }: Props) {
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
        type="range"
        aria-invalid={invalid || undefined}
        aria-describedby={describedBy}
        className="w-full min-w-0 accent-brass-600"
        {...props}
      />
      <FieldHelp inputId={inputId} hint={hint} errors={errors} />
    </div>
  );
}
