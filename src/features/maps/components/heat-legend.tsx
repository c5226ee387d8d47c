import { HEAT_STEPS, heatColour, RATE_CEILING } from './heat';

/** The hatch the range map fills keys with no notes with (one per page is enough). */
export function NoDataPattern() {
  return (
    <svg width="0" height="0" className="absolute" aria-hidden="true" focusable="false">
      <defs>
        <pattern id="sf-nodata-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <rect width="6" height="6" fill="rgb(var(--sf-raised))" />
          <line x1="0" y1="0" x2="0" y2="6" stroke="rgb(var(--sf-muted))" strokeWidth="2" />
        </pattern>
      </defs>
    </svg>
  );
}

/**
 * The key to a map's colours: the scale from no notes missed to the ceiling and beyond, and
 * (for the range map) the hatch of a key with no notes yet, which is no score at all.
 */
export function HeatLegend({ noData }: { noData?: 'hatched' | 'dashed' }) {
  const steps = Array.from({ length: HEAT_STEPS }, (_, i) => ((i + 0.5) / HEAT_STEPS) * RATE_CEILING);
  return (
    <div className="flex flex-wrap items-center gap-x-6 gap-y-2 text-caption" data-testid="heat-legend">
      <span className="flex items-center gap-2">
        <span className="text-muted">Notes not hit:</span>
        <span>0%</span>
        <span className="flex overflow-hidden rounded border border-line" aria-hidden="true">
          {steps.map((r) => (
            <span key={r} className="h-4 w-5" style={{ background: heatColour(r).background }} />
          ))}
        </span>
        <span>{Math.round(RATE_CEILING * 100)}% or more</span>
      </span>
      {noData ? (
        <span className="flex items-center gap-2">
          {noData === 'hatched' ? (
            <svg viewBox="0 0 20 16" className="h-4 w-5 rounded border border-line" aria-hidden="true">
              <rect width="20" height="16" className="sf-nodata" />
            </svg>
          ) : (
            <span className="h-4 w-5 rounded border border-dashed border-muted" aria-hidden="true" />
          )}
          <span>no notes yet (no score)</span>
        </span>
      ) : null}
    </div>
  );
}
