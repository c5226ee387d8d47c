import type { Drill } from '@shared/engine';
import { useCallback, useLayoutEffect, useRef, useState } from 'react';
import { DrillStaff, type NoteMarks } from '@/components/notation/drill-staff';
import { noteOf } from './note-of';
import type { NoteReading } from './note-readings';
import { tickScale } from './note-strip';

interface Spot {
  index: number;
  x: number;
  /** the top of the notehead */
  top: number;
  /** where the tick goes: under the staff's own mark for the note, else under the notehead */
  tickTop: number;
  reading: NoteReading;
}

interface Props {
  drill: Drill;
  marks: NoteMarks;
  current: number | null;
  label: string;
  readings: NoteReading[];
  onSelect: (index: number) => void;
}

/**
 * The staff of a take with what was played laid over it: above a wrong note the pitch played
 * instead, under each played note's mark a tick left of centre (ahead of the beat) or right of
 * it (behind). A click on a note chooses it. The layer reads where the staff drew each note (its
 * data-index), so the staff is never redrawn for it; the words are in the note list beside it.
 */
export function ReviewStaff({ drill, marks, current, label, readings, onSelect }: Props) {
  const box = useRef<HTMLDivElement>(null);
  const [spots, setSpots] = useState<Spot[]>([]);
  const [drawn, setDrawn] = useState(0);
  const measure = useCallback(() => {
    const root = box.current;
    if (!root) return;
    const origin = root.getBoundingClientRect();
    const next: Spot[] = [];
    for (const r of readings) {
      if (r.offsetMs === null && r.played === null) continue;
      const el =
        root.querySelector(`[data-index="${r.index}"]`) ?? root.querySelector(`[data-note-index="${r.index}"]`);
      const head = el?.querySelector('.sf-head') ?? el;
      if (!head) continue;
      const b = head.getBoundingClientRect();
      if (b.width === 0) continue;
      const mark = root.querySelector(`[data-mark-for="${r.index}"]`)?.getBoundingClientRect();
      next.push({
        index: r.index,
        x: b.left + b.width / 2 - origin.left,
        top: b.top - origin.top,
        tickTop: (mark && mark.height > 0 ? mark.bottom + 3 : b.bottom + 8) - origin.top,
        reading: r,
      });
    }
    setSpots(next);
  }, [readings]);
  // biome-ignore lint/correctness/useExhaustiveDependencies: drawn changes when the staff is redrawn
  useLayoutEffect(() => {
    measure();
    const root = box.current;
    if (!root) return;
    const ro = new ResizeObserver(() => requestAnimationFrame(measure));
    ro.observe(root);
    return () => ro.disconnect();
  }, [measure, drawn]);
  const scale = tickScale(readings);
  return (
    // biome-ignore lint/a11y/useKeyWithClickEvents lint/a11y/noStaticElementInteractions: the note list is the keyboard route to the same choice
    <div
      ref={box}
      className="relative cursor-pointer"
      onClick={(e) => noteOf(e.target, onSelect)}
      data-testid="review-staff"
    >
      <DrillStaff
        drill={drill}
        marks={marks}
        current={current}
        label={label}
        onRendered={() => requestAnimationFrame(() => setDrawn((d) => d + 1))}
      />
      <div className="pointer-events-none absolute inset-0" aria-hidden="true" data-testid="played-layer">
        {spots.map((s) => {
          const r = s.reading;
          const x = r.offsetMs === null ? null : Math.max(-1, Math.min(1, r.offsetMs / scale));
          const tone =
            r.verdict === 'hit'
              ? 'text-reed-700 dark:text-reed-100'
              : r.verdict === 'wrong'
                ? 'text-ember-700 dark:text-ember-100'
                : 'text-brass-700 dark:text-brass-300';
          return (
            <span key={s.index}>
              {r.played ? (
                <span
                  className="absolute -translate-x-1/2 whitespace-nowrap rounded border border-ember-500 bg-raised px-1 text-[0.6875rem] font-bold leading-tight text-ember-700 dark:text-ember-100"
                  style={{ left: s.x, top: s.top - 18 }}
                  data-played-for={s.index}
                >
                  {r.played}
                </span>
              ) : null}
              {x !== null ? (
                <svg
                  viewBox="-10 0 20 8"
                  className={`absolute h-2 w-5 -translate-x-1/2 ${tone}`}
                  style={{ left: s.x, top: s.tickTop }}
                  data-tick-for={s.index}
                >
                  <line x1="-10" x2="10" y1="4" y2="4" stroke="currentColor" strokeOpacity="0.35" />
                  <line x1="0" x2="0" y1="1" y2="7" stroke="currentColor" strokeOpacity="0.5" />
                  <rect x={x * 9 - 1.25} y="0" width="2.5" height="8" fill="currentColor" />
                </svg>
              ) : null}
            </span>
          );
        })}
      </div>
    </div>
  );
}
