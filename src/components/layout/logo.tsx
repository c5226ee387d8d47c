/**
 * Sixfold's mark: two rising figures of three short strokes, the second set off above the
 * first, as a pair's two triads run up the keyboard. Decorative beside the word "Sixfold".
 */
export function Logo({ className = 'h-7 w-7 rounded-[25%] dark:ring-1 dark:ring-ink-500' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false" data-testid="logo">
      <rect width="32" height="32" rx="8" fill="#182743" />
      <g fill="none" strokeWidth="2.8" strokeLinecap="round">
        <g stroke="#f1c970">
          <path d="M5.5 26.5 6.5 21" />
          <path d="M10 24 11 18.5" />
          <path d="M14.5 21.5 15.5 16" />
        </g>
        <g stroke="#9db4dc">
          <path d="M16.5 15 17.5 9.5" />
          <path d="M21 12.5 22 7" />
          <path d="M25.5 10 26.5 4.5" />
        </g>
      </g>
    </svg>
  );
}
