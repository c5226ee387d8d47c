import type { Drill } from '@shared/engine';
import { useEffect, useMemo, useState } from 'react';
import { isBlackKey, KeyboardDiagram, type KeyMark } from '@/components/midi/keyboard-diagram';
import { getNoteInput } from '@/hooks/use-note-input';
import { type LiveMarks, useLiveCurrent } from '../lib/live-marks';
import type { PitchFrame } from '../lib/pitch-frame';

const IN_DRILL: KeyMark = { className: 'fill-dusk-100', label: 'in the drill' };
// The note due now: the staff's highlighter yellow, a colour no verdict uses.
const NOW: KeyMark = { className: 'fill-brass-300', label: 'play now' };
const HELD: KeyMark = { className: 'fill-reed-500', label: 'held' };

/**
 * The instrument's range with the drill's notes, the note due now and the keys held down, in
 * the player's frame: a transposing player sees the written keys her fingers play. The range
 * always reaches her lowest note (a keyboard drawn from a black key would leave it out).
 */
export function LiveKeyboard({
  drill,
  live,
  range,
  frame,
  playedToConcert,
  label,
}: {
  drill: Drill;
  live: LiveMarks;
  /** concert MIDI, inclusive: the instrument's range and the player's own */
  range: { low: number; high: number };
  frame: PitchFrame;
  /** semitones from what the input sends to concert pitch (written-pitch input, octave shift) */
  playedToConcert: number;
  label: string;
}) {
  const current = useLiveCurrent(live, drill);
  const [held, setHeld] = useState<ReadonlySet<number>>(new Set());
  useEffect(
    () =>
      getNoteInput().onNote((e) =>
        setHeld((prev) => {
          const next = new Set(prev);
          const key = frame.written(e.midi + playedToConcert);
          if (e.type === 'on') next.add(key);
          else next.delete(key);
          return next;
        }),
      ),
    [frame, playedToConcert],
  );
  const keys = useMemo(() => {
    let low = frame.written(range.low);
    let high = frame.written(range.high);
    for (const n of drill.notes) {
      low = Math.min(low, frame.written(n.midi));
      high = Math.max(high, frame.written(n.midi));
    }
    // Start and end on white keys, so the first and last notes are drawn.
    if (isBlackKey(low)) low -= 1;
    if (isBlackKey(high)) high += 1;
    return { low, high };
  }, [range, drill, frame]);
  const inDrill = useMemo(() => {
    const m = new Map<number, KeyMark>();
    for (const n of drill.notes) m.set(frame.written(n.midi), IN_DRILL);
    return m;
  }, [drill, frame]);
  const marks = useMemo(() => {
    const m = new Map(inDrill);
    const now = current !== null ? drill.notes[current] : undefined;
    if (now) m.set(frame.written(now.midi), NOW);
    for (const h of held) m.set(h, HELD);
    return m;
  }, [inDrill, drill, current, held, frame]);
  return <KeyboardDiagram low={keys.low} high={keys.high} marks={marks} label={label} height={70} />;
}
