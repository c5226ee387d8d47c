import { type ReactNode, useEffect, useRef, useState } from 'react';

/**
 * A wide table's frame: it scrolls sideways on a narrow screen, and while more of it is hidden
 * to the right it says so (a line of text and a shaded edge), so no column is lost unseen.
 */
export function TableScroll({
  children,
  label,
  className = '',
}: {
  children: ReactNode;
  label: string;
  className?: string;
}) {
  const ref = useRef<HTMLElement>(null);
  const [more, setMore] = useState(false);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const read = () => setMore(el.scrollWidth - el.clientWidth - el.scrollLeft > 4);
    read();
    el.addEventListener('scroll', read, { passive: true });
    const ro = new ResizeObserver(read);
    ro.observe(el);
    if (el.firstElementChild) ro.observe(el.firstElementChild);
    return () => {
      el.removeEventListener('scroll', read);
      ro.disconnect();
    };
  }, []);
  return (
    // Its width comes from the page, never from the table inside (which scrolls instead).
    <div className={`grid min-w-0 grid-cols-[minmax(0,1fr)] gap-1 [contain:inline-size] ${className}`}>
      {more ? (
        <p className="text-right text-caption text-muted" data-testid="scroll-cue">
          Scroll sideways for more columns →
        </p>
      ) : null}
      <div className="relative min-w-0">
        <section
          ref={ref}
          tabIndex={more ? 0 : undefined}
          aria-label={label}
          // positioned, so hidden headings (placed absolutely) stay inside the scroller's clip
          className="relative overflow-x-auto rounded-card border border-line bg-raised focus-visible:outline-2"
        >
          {children}
        </section>
        {more ? (
          <div
            aria-hidden="true"
            className="pointer-events-none absolute inset-y-0 right-0 w-10 rounded-r-card bg-gradient-to-l from-ink-900/25 to-transparent dark:from-black/60"
          />
        ) : null}
      </div>
    </div>
  );
}
