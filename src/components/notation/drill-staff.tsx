import { type Drill, instruments, type Notation, notate, writtenPair } from '@shared/engine';
import { useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { type MarkSource, type NoteMark, markFromClass } from './marks';
import type { MarkLayer } from './marks';
import { MarksLegend } from './marks-legend';
import { ShortDrillNotice } from './short-drill-notice';
import './notation.css';

export type { NoteMark } from './marks';

/** How a note is marked, as a class string ('sf-mark-hit', 'sf-mark-late sf-provisional'). */
export type NoteMarks = ReadonlyMap<number, string>;
/** How a note is marked: note index -> verdict and whether it is settled. */
export type NoteVerdicts = ReadonlyMap<number, NoteMark>;

interface Props {
  drill: Drill;
  /** note index -> verdict; drawn as Sixfold's marks under the staff (no redraw) */
  verdicts?: NoteVerdicts;
  /** the same as class strings ('sf-mark-late sf-provisional'), as the practice pages keep them */
  marks?: NoteMarks;
  /** marks that change during a take, painted on the staff as they change (no re-render) */
  source?: MarkSource;
  /** the note being played, shown by a band behind it */
  current?: number | null;
  /** fade the notes (for memorising) */
  faded?: boolean;
  /** read aloud for the whole staff */
  label?: string;
  /** a fixed width in px (the printable pages); otherwise the container's */
  width?: number;
  /** performance.now() of the take's first downbeat, set on the staff as data-downbeat-ms */
  downbeatMs?: number | null;
  /** say beside the staff when the drill is shorter than two bars or the range cut it short */
  lengthNotice?: boolean;
  onRendered?: (noteCount: number) => void;
}

const renderer = () => import('./render-staff');

const MARK_CLASS = /^sf-(mark-(hit|early|late|wrong|missed)|provisional|current)$/;

/** Classes a page adds to notes beside the verdict ('sf-pinned'), set on the note as given. */
function extrasOf(marks: NoteMarks | undefined): Map<number, string[]> {
  const out = new Map<number, string[]>();
  for (const [i, cls] of marks ?? []) {
    const extra = cls.split(/\s+/).filter((c) => c && !MARK_CLASS.test(c));
    if (extra.length) out.set(i, extra);
  }
  return out;
}

function verdictsOf(verdicts: NoteVerdicts | undefined, marks: NoteMarks | undefined): Map<number, NoteMark> {
  const out = new Map<number, NoteMark>(verdicts ?? []);
  if (marks)
    for (const [i, cls] of marks) {
      const m = markFromClass(cls);
      if (m && !out.has(i)) out.set(i, m);
    }
  return out;
}

/**
 * A drill in written pitch for its instrument, drawn from the engine's notation model. Drawn
 * once per drill and width; verdicts and the current note are laid on without a redraw, so a
 * live take never redraws the staff.
 */
export function DrillStaff({
  drill,
  verdicts,
  marks,
  source,
  current,
  faded,
  label,
  width: fixedWidth,
  downbeatMs,
  lengthNotice,
  onRendered,
}: Props) {
  const host = useRef<HTMLDivElement>(null);
  const layer = useRef<MarkLayer | null>(null);
  const noteEls = useRef<SVGElement[]>([]);
  const extras = useRef(new Map<number, string[]>());
  const [measured, setMeasured] = useState(0);
  const [error, setError] = useState<string | null>(null);
  const [version, setVersion] = useState(0);
  const width = fixedWidth ?? measured;
  const marksRow = verdicts !== undefined || marks !== undefined || source !== undefined;
  const notation = useMemo((): Notation | Error => {
    try {
      return notate(drill);
    } catch (err) {
      return err instanceof Error ? err : new Error('The notation could not be made');
    }
  }, [drill]);

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
    if (notation instanceof Error) {
      setError(notation.message);
      return;
    }
    let cancelled = false;
    const target = host.current;
    renderer()
      .then(({ renderStaff }) => (cancelled ? null : renderStaff(target, drill, notation, width, { marksRow })))
      .then((r) => {
        if (cancelled || !r) return;
        layer.current = r.marks;
        noteEls.current = r.notes;
        extras.current = new Map();
        setError(null);
        setVersion((v) => v + 1);
        onRenderedRef.current?.(r.notes.filter(Boolean).length);
      })
      .catch((err: unknown) => {
        if (!cancelled) setError(err instanceof Error ? err.message : 'The notation could not be drawn');
      });
    return () => {
      cancelled = true;
    };
  }, [drill, notation, width, marksRow]);

  // Marks and the current note on what is already drawn (again after a redraw). Before paint:
  // a mark from a note just played must be on screen in the very next frame.
  // biome-ignore lint/correctness/useExhaustiveDependencies: version changes when the staff is redrawn
  useLayoutEffect(() => {
    const l = layer.current;
    if (!l || source) return;
    l.setAll(verdictsOf(verdicts, marks));
    l.setCurrent(current ?? null);
    const want = extrasOf(marks);
    for (const [i, cls] of extras.current) noteEls.current[i]?.classList.remove(...cls);
    for (const [i, cls] of want) noteEls.current[i]?.classList.add(...cls);
    extras.current = want;
  }, [verdicts, marks, current, version]);

  // A take's marks, painted by the store's own listener (again after a redraw).
  // biome-ignore lint/correctness/useExhaustiveDependencies: version changes when the staff is redrawn
  useLayoutEffect(() => {
    const l = layer.current;
    if (!l || !source) return;
    const paint = () => {
      const now = source.marksFor(drill);
      l.setAll(now.marks);
      l.setCurrent(now.current);
    };
    paint();
    return source.subscribePaint(paint);
  }, [source, drill, version]);

  const inst = instruments[drill.spec.instrument];
  const staves = notation instanceof Error ? [] : notation.staves;
  // the pair as written (spelled as a unit, as the notes are), with the concert pair beside it
  const { pair } = drill.spec;
  const pairName =
    inst.transposition % 12 === 0
      ? pair.join(' / ')
      : `${writtenPair([pair[0], pair[1]], drill.spec.instrument).join(' / ')} (concert ${pair.join(' / ')})`;
  const name =
    label ??
    `${pairName} for ${inst.label}, written pitch${staves.length > 1 ? ' on a grand staff' : ''}, ${drill.notes.length} notes in ${drill.measures} measures`;
  return (
    <figure
      className={`sf-staff m-0 grid min-w-0 gap-2 ${faded ? 'sf-faded' : ''}`}
      aria-label={name}
      data-testid="drill-staff"
      data-version={version}
      data-staves={staves.join(' ')}
      data-downbeat-ms={downbeatMs ?? undefined}
    >
      {lengthNotice ? <ShortDrillNotice drill={drill} /> : null}
      <div ref={host} className="min-h-24 w-full" style={fixedWidth ? { maxWidth: fixedWidth } : undefined} />
      {marksRow ? <MarksLegend /> : null}
      {error ? (
        <p role="alert" className="text-ember-700 dark:text-ember-100">
          {error}
        </p>
      ) : null}
    </figure>
  );
}
