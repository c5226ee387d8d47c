import { useEffect, useState } from 'react';

const LONG_SESSION_MS = 45 * 60_000;

/**
 * The usual cautions: one at the start of a session, one after 45 minutes on the page.
 * Sixfold is no medical advice: pain goes to a medical professional.
 */
export function CautionBanner({ practisingSince }: { practisingSince: number }) {
  const [dismissed, setDismissed] = useState(false);
  const [long, setLong] = useState(false);
  useEffect(() => {
    const wait = Math.max(0, practisingSince + LONG_SESSION_MS - Date.now());
    const t = setTimeout(() => {
      setLong(true);
      setDismissed(false);
    }, wait);
    return () => clearTimeout(t);
  }, [practisingSince]);
  if (dismissed) return null;
  return (
    <aside
      role={long ? 'alert' : 'note'}
      data-testid={long ? 'caution-long' : 'caution-start'}
      className="no-print flex flex-wrap items-start gap-3 rounded-card border border-brass-500/40 bg-brass-100 p-4 text-ink-900"
    >
      <div className="flex-1">
        <p className="font-bold">{long ? 'You have been practising for 45 minutes.' : 'Before you start'}</p>
        <p className="mt-1 text-body">
          {long
            ? 'Stand up, shake out your hands and rest your ears for a few minutes before the next key.'
            : 'Warm up first, practise in short blocks with breaks, and keep headphones at a moderate volume: long sessions at high volume can harm hearing.'}{' '}
          Stop if anything hurts — pain, numbness or tingling in hands, arms, jaw or lips is a reason to see a medical
          professional, not to push on.
        </p>
      </div>
      <button
        type="button"
        onClick={() => setDismissed(true)}
        className="rounded-md border border-ink-900/20 px-3 py-1.5 text-caption font-semibold"
      >
        Got it
      </button>
    </aside>
  );
}
