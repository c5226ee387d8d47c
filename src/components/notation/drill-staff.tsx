import type { Drill } from '@shared/engine';
import { instruments } from '@shared/engine';
import { useEffect, useLayoutEffect, useRef, useState } from 'react';
import './notation.css';

/** How a note is marked: a class set on its SVG group (e.g. 'sf-mark-hit'). */
export type NoteMarks = ReadonlyMap<number, string>;

interface Props {
  drill: Drill;
  /** note index -> class, changed by toggling classes (no redraw) */
  marks?: NoteMarks;
  /** the note being played, marked with 'sf-current' */
  current?: number | null;
  /** fade the notes (for memorising) */
  faded?: boolean;
  /** read aloud for the whole staff */
  label?: string;
  /** a fixed width in px (the printable pages); otherwise the container's */
  width?: number;
  onRendered?: (noteCount: number) => void;
}

const renderer = () => import('./render-staff');

/**
 * A drill in written pitch for its instrument: measure numbers, triplet brackets, the two
 * triads told apart. Drawn once per drill and width; marks and the current note only toggle
 * classes on the note elements, so a live take never redraws the staff.
 */
export function DrillStaff({ drill, marks, current, faded, label, width: fixedWidth, onRendered }: Props) {
  const host = useRef<HTMLDivElement>(null);
  const notes = useRef<SVGElement[]>([]);
  const applied = useRef(new Map<number, string>());
  const [measured, setMeasured] = useState(0);
  const [error, setError] = useState<string | null>(null);
  const [version, setVersion] = useState(0);
  const width = fixedWidth ?? measured;

  useLayoutEffect(() => {
    if (fixedWidth || !host.current) return;
    const el = host.current;
    const read = () =>
      setMeasured((w) => {
        const next = Math.floor(el.clientWidth);
        // Redraw only for a real change of width, not a scrollbar's flicker.
        return Math.abs(next - w) > 24 ? next : w;
      });
    read();
    const ro = new ResizeObserver(read);
    ro.observe(el);
    return () => ro.disconnect();
  }, [fixedWidth]);

  const onRenderedRef = useRef(onRendered);
  onRenderedRef.current = onRendered;
  useEffect(() => {
    if (!host.current || width <= 0) return;
    let cancelled = false;
    const target = host.current;
    renderer()
      .then(({ renderStaff }) => (cancelled ? null : renderStaff(target, drill, width)))
      .then((r) => {
        if (cancelled || !r) return;
        notes.current = r.notes;
        applied.current = new Map();
        setError(null);
        setVersion((v) => v + 1);
        onRenderedRef.current?.(r.notes.length);
      })
      .catch((err: unknown) => {
        if (!cancelled) setError(err instanceof Error ? err.message : 'The notation could not be drawn');
      });
    return () => {
      cancelled = true;
    };
  }, [drill, width]);

  // Marks and the current note: toggle classes on what is already drawn (again after a redraw).
  // Before paint: a mark from a note just played must be on screen in the very next frame.
  // biome-ignore lint/correctness/useExhaustiveDependencies: version changes when the staff is redrawn
  useLayoutEffect(() => {
    const want = new Map(marks ?? []);
    if (current !== null && current !== undefined) want.set(current, `${want.get(current) ?? ''} sf-current`.trim());
    for (const [i, cls] of applied.current) {
      if (want.get(i) !== cls) notes.current[i]?.classList.remove(...cls.split(' '));
    }
    for (const [i, cls] of want) {
      if (applied.current.get(i) !== cls) notes.current[i]?.classList.add(...cls.split(' '));
    }
    applied.current = want;
  }, [marks, current, version]);

  const inst = instruments[drill.spec.instrument];
  const name =
    label ??
    `${drill.spec.pair.join(' / ')} for ${inst.label}, written pitch, ${drill.notes.length} notes in ${drill.measures} measures`;
  return (
    <figure
      className={`sf-staff m-0 min-w-0 ${faded ? 'sf-faded' : ''}`}
      aria-label={name}
      data-testid="drill-staff"
      data-version={version}
    >
      <div ref={host} className="min-h-24 w-full" style={fixedWidth ? { width: fixedWidth } : undefined} />
      {error ? (
        <p role="alert" className="text-ember-700 dark:text-ember-100">
          {error}
        </p>
      ) : null}
    </figure>
  );
}
