import type { ReactNode } from 'react';

type Tone = 'error' | 'success' | 'info';

const tones: Record<Tone, string> = {
  error: 'border-ember-500 bg-ember-100 text-ember-700',
  success: 'border-reed-500 bg-reed-100 text-reed-700',
  info: 'border-dusk-500 bg-dusk-100 text-dusk-700',
};

/** A message about a whole form: what went wrong, or that it worked. */
export function FormMessage({ tone, children }: { tone: Tone; children: ReactNode }) {
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={`rounded-lg border px-3 py-2 text-body font-semibold ${tones[tone]}`}
    >
      {children}
    </div>
  );
}
