import { useEffect, useRef, useState } from 'react';
import { RangeField } from '@/components/ui/range-field';
import { GATE_MAX_DB, GATE_MIN_DB, type MicInput } from '@/lib/mic-input';

const FLOOR_DB = -80;
const pct = (db: number) => `${Math.max(0, Math.min(100, ((db - FLOOR_DB) / -FLOOR_DB) * 100))}%`;

/**
 * While the microphone listens: its level against the gate, the gate itself, and why the
 * backing must go to headphones (the microphone hears the speakers, and would score the pad).
 */
export function MicPanel({ mic }: { mic: MicInput }) {
  const [gate, setGate] = useState(mic.gateDb);
  const bar = useRef<HTMLDivElement>(null);
  const meter = useRef<HTMLMeterElement>(null);
  // The level moves ~50 times a second: drawn straight into the DOM, not through React state.
  useEffect(
    () =>
      mic.onLevel((db) => {
        const level = Math.max(FLOOR_DB, Number.isFinite(db) ? Math.round(db) : FLOOR_DB);
        if (bar.current) {
          bar.current.style.width = pct(level);
          bar.current.dataset.open = String(level >= mic.gateDb);
        }
        if (meter.current) meter.current.value = level;
      }),
    [mic],
  );
  return (
    <div className="mt-3 grid gap-3" data-testid="mic-panel">
      <div>
        <label htmlFor="mic-level" className="text-caption font-semibold">
          Input level (dBFS)
        </label>
        <meter
          ref={meter}
          id="mic-level"
          data-testid="mic-level"
          min={FLOOR_DB}
          max={0}
          low={gate}
          defaultValue={FLOOR_DB}
          className="sr-only"
        />
        <div
          aria-hidden="true"
          className="relative mt-1 h-3 overflow-hidden rounded-full border border-line bg-surface"
        >
          <div ref={bar} className="h-full w-0 bg-ink-300 data-[open=true]:bg-reed-500" />
          <div className="absolute inset-y-0 w-0.5 bg-ember-500" style={{ left: pct(gate) }} title="gate" />
        </div>
      </div>
      <RangeField
        label={`Gate: ${gate} dBFS (quieter sound is never a note)`}
        min={GATE_MIN_DB}
        max={GATE_MAX_DB}
        step={1}
        value={gate}
        onChange={(e) => {
          mic.setGate(Number(e.target.value));
          setGate(mic.gateDb);
        }}
      />
      <p className="text-caption text-muted">
        Set the gate just above the room: with your instrument silent the bar should stay left of the red line, and
        every note you play should cross it.
      </p>
      <p role="note" data-testid="mic-headphones" className="rounded-lg bg-brass-100 p-3 text-caption text-ink-900">
        Wear headphones for the click and the chord pad: the microphone hears the speakers too, and would take their
        sound for notes you played. Playing back what you play is off while the microphone listens.
      </p>
    </div>
  );
}
