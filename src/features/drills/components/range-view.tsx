import { type Drill, instruments } from '@shared/engine';
import { useMemo } from 'react';
import { KeyboardDiagram, type KeyMark, keyLabel } from '@/components/midi/keyboard-diagram';

const A: KeyMark = { className: 'fill-dusk-500', label: 'triad a' };
const B: KeyMark = { className: 'fill-brass-500', label: 'triad b' };

/** Where the drill's notes (sounding) lie inside the instrument's range, on a keyboard. */
export function RangeView({ drill, aChromas }: { drill: Drill; aChromas: Set<number> }) {
  const inst = instruments[drill.spec.instrument];
  const { low, high } = inst.range;
  const marks = useMemo(() => {
    const m = new Map<number, KeyMark>();
    for (const n of drill.notes) m.set(n.midi, aChromas.has(n.midi % 12) ? A : B);
    return m;
  }, [drill, aChromas]);
  const lowest = Math.min(...drill.notes.map((n) => n.midi));
  const highest = Math.max(...drill.notes.map((n) => n.midi));
  // Show the instrument's whole range with a few keys either side, starting and ending on C.
  const from = Math.max(0, low - (low % 12) - 0);
  const to = Math.min(127, high + ((12 - (high % 12)) % 12));
  return (
    <figure className="m-0 grid max-w-3xl gap-2">
      <KeyboardDiagram
        low={from}
        high={to}
        reach={inst.range}
        marks={marks}
        height={70}
        label={`Range: the drill sounds from ${keyLabel(lowest)} to ${keyLabel(highest)}; the ${inst.label.toLowerCase()} reaches ${keyLabel(low)} to ${keyLabel(high)}`}
      />
      <figcaption className="flex flex-wrap gap-4 text-caption text-muted">
        <span>
          <span className="mr-1 inline-block h-3 w-3 rounded-sm bg-dusk-500 align-middle" /> triad a (
          {drill.spec.pair[0]})
        </span>
        <span>
          <span className="mr-1 inline-block h-3 w-3 rounded-sm bg-brass-500 align-middle" /> triad b (
          {drill.spec.pair[1]})
        </span>
        <span>
          Sounding {keyLabel(lowest)}–{keyLabel(highest)} of {keyLabel(low)}–{keyLabel(high)}; greyed keys are out of
          reach
        </span>
      </figcaption>
    </figure>
  );
}
