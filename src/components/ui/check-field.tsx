import { type InputHTMLAttributes, type ReactNode, useId } from 'react';
import { FieldHelp, helpIds } from './field-help';

type Props = Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & {
  /** the words beside the box; the input is inside the label, so they name it */
  label: ReactNode;
  errors?: string[];
  hint?: ReactNode;
  /** classes of the label around box and words (e.g. a card for a radio choice) */
  labelClassName?: string;
};

function Choice({
  type,
  label,
  errors,
  hint,
  id,
  className = '',
  labelClassName = 'flex items-center gap-2 text-body',
  ...props
}: Props & { type: 'checkbox' | 'radio' }) {
  const auto = useId();
  const inputId = id ?? auto;
  const { invalid, describedBy } = helpIds(inputId, hint, errors);
  const help = hint || invalid ? <FieldHelp inputId={inputId} hint={hint} errors={errors} /> : null;
  const box = (
    <label className={labelClassName}>
      <input
        id={inputId}
        type={type}
        aria-invalid={invalid || undefined}
        aria-describedby={describedBy}
        className={type === 'radio' ? 'mt-1 h-4 w-4 shrink-0' : 'h-4 w-4 shrink-0 accent-brass-600'}
        {...props}
      />
      {label}
    </label>
  );
  if (!help && !className) return box;
  return (
    <div className={`grid gap-1 ${className}`}>
      {box}
      {help}
    </div>
  );
}

/** A checkbox with its words beside it; errors and hint under it. */
export function CheckboxField(props: Props) {
  return <Choice type="checkbox" {...props} />;
}

/** One choice of a radio group (group them in a fieldset with a legend). */
export function RadioField(props: Props) {
  return <Choice type="radio" {...props} />;
}
