import { useId } from 'react';

export interface TrendDomain {
  low: number;
  high: number;
}

/**
 * The span the bars cover: from a little under the lowest figure shown to a little over the
 * highest, at least `minSpan` wide and kept inside [floor, ceiling], so a change of a few points
 * shows as a real difference in height. Pass every figure on screen that is compared.
 *
 * @example
 * trendDomain([0.84, 0.94], { minSpan: 0.1, floor: 0, ceiling: 1 }) // { low: 0.82, high: 0.96 }
 */
export function trendDomain(
  values: ReadonlyArray<number | null>,
  opts: { minSpan: number; floor?: number; ceiling?: number },
): TrendDomain | null {
  const known = values.filter((v): v is number => v !== null && Number.isFinite(v));
  if (known.length === 0) return null;
  let low = Math.min(...known);
  let high = Math.max(...known);
  const pad = Math.max((high - low) * 0.15, opts.minSpan * 0.2);
  low -= pad;
  high += pad;
  if (high - low < opts.minSpan) {
    const mid = (high + low) / 2;
    low = mid - opts.minSpan / 2;
    high = mid + opts.minSpan / 2;
  }
  if (opts.floor !== undefined && low < opts.floor) {
    high = Math.min(opts.ceiling ?? Number.POSITIVE_INFINITY, high + (opts.floor - low));
    low = opts.floor;
  }
  if (opts.ceiling !== undefined && high > opts.ceiling) {
    low = Math.max(opts.floor ?? Number.NEGATIVE_INFINITY, low - (high - opts.ceiling));
    high = opts.ceiling;
  }
  const r = (v: number) => Math.round(v * 1000) / 1000;
  return { low: r(low), high: r(high) };
}

interface Props {
  /** oldest first; null for a period with nothing in it */
  values: ReadonlyArray<number | null>;
  /** one per value, e.g. "week of 16 Nov" */
  labels: ReadonlyArray<string>;
  format: (v: number) => string;
  /** what the figures are, e.g. "Accuracy" */
  what: string;
  domain: TrendDomain | null;
  /** a Tailwind background class for the bars */
  tone?: string;
  /** each bar's extra words, e.g. "4 takes" */
  details?: ReadonlyArray<string>;
}

/**
 * Small bars for a few periods, tall by where each figure sits in `domain` (the span of the
 * figures compared, printed beside them), each one focusable with its figure shown on hover
 * and focus. An empty period is an outlined stub.
 */
export function TrendBars({ values, labels, format, what, domain, tone = 'bg-brass-500', details }: Props) {
  const id = useId();
  if (!domain) return <span className="text-caption text-muted">No takes in these weeks</span>;
  const span = domain.high - domain.low || 1;
  return (
    <span className="inline-flex items-end gap-2">
      <fieldset
        className="m-0 inline-flex h-8 items-end gap-0.5 border-0 p-0"
        aria-label={`${what} by week, oldest first`}
      >
        {values.map((v, i) => {
          const words = `${labels[i]}: ${v === null ? 'no takes' : format(v)}${details?.[i] ? `, ${details[i]}` : ''}`;
          const h = v === null ? 0 : Math.max(6, Math.min(100, ((v - domain.low) / span) * 100));
          return (
            <button
              key={i}
              type="button"
              aria-label={`${what}, ${words}`}
              aria-describedby={`${id}-scale`}
              className="group relative flex h-full w-3 items-end rounded-sm focus-visible:outline-2 focus-visible:outline-offset-1"
            >
              {v === null ? (
                <span className="h-1.5 w-full rounded-sm border border-dashed border-muted" />
              ) : (
                <span className={`w-full rounded-sm ${tone}`} style={{ height: `${h}%` }} />
              )}
              <span
                aria-hidden="true"
                className="pointer-events-none absolute bottom-full left-1/2 z-10 mb-1 hidden -translate-x-1/2 whitespace-nowrap rounded border border-line bg-raised px-2 py-1 text-caption font-normal text-text shadow group-hover:block group-focus-visible:block"
              >
                {words}
              </span>
            </button>
          );
        })}
      </fieldset>
      <span id={`${id}-scale`} className="text-[0.6875rem] leading-tight text-muted">
        bars from {format(domain.low)}
        <br />
        to {format(domain.high)}
      </span>
    </span>
  );
}
