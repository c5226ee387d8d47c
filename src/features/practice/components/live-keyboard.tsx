import type { Drill } from '@shared/engine';
import { useEffect, useMemo, useState } from 'react';
import { KeyboardDiagram, type KeyMark } from '@/components/midi/keyboard-diagram';
import { getNoteInput } from '@/hooks/use-note-input';
import { type LiveMarks, useLiveMarks } from '../lib/live-marks';

const IN_DRILL: KeyMark = { className: 'fill-dusk-100', label: 'in the drill' };
const NOW: KeyMark = { className: 'fill-brass-300', label: 'play now' };
const HELD: KeyMark = { className: 'fill-reed-500', label: 'held' };

/** The instrument's range with the drill's notes, the note due now and the keys held down. */
export function LiveKeyboard({
  drill,
  live,
  range,
  label,
}: {
  drill: Drill;
  live: LiveMarks;
  range: { low: number; high: number };
  label: string;
}) {
  const { current } = useLiveMarks(live, drill);
  const [held, setHeld] = useState<ReadonlySet<number>>(new Set());
  useEffect(
    () =>
      getNoteInput().onNote((e) =>
        setHeld((prev) => {
          const next = new Set(prev);
          if (e.type === 'on') next.add(e.midi);
          else next.delete(e.midi);
          return next;
        }),
      ),
    [],
  );
  const inDrill = useMemo(() => {
    const m = new Map<number, KeyMark>();
    for (const n of drill.notes) m.set(n.midi, IN_DRILL);
    return m;
  }, [drill]);
  const marks = useMemo(() => {
    const m = new Map(inDrill);
    const now = current !== null ? drill.notes[current] : undefined;
    if (now) m.set(now.midi, NOW);
    for (const h of held) m.set(h, HELD);
    return m;
  }, [inDrill, drill, current, held]);
  return <KeyboardDiagram low={range.low} high={range.high} marks={marks} label={label} height={70} />;
}
