import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'quiet' | 'danger';

const styles: Record<Variant, string> = {
  primary: 'bg-ink-800 text-white hover:bg-ink-700 dark:bg-brass-300 dark:text-ink-950 dark:hover:bg-brass-100',
  quiet: 'border border-line bg-raised text-text hover:border-ink-300',
  danger: 'bg-ember-700 text-white hover:bg-ember-500',
};

export function Button({
  variant = 'primary',
  className = '',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type="button"
      {...props}
      className={`inline-flex items-center justify-center gap-2 rounded-lg px-4 py-2 text-body font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-50 ${styles[variant]} ${className}`}
    />
  );
}
