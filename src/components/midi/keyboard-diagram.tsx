import { memo, type PointerEvent, useEffect, useRef } from 'react';
import { ROOT_SPELLINGS } from '@shared/engine';

const BLACK = new Set([1, 3, 6, 8, 10]);

export const isBlackKey = (midi: number) => BLACK.has(((midi % 12) + 12) % 12);
/** A key's name with its octave, spelled as the app names keys (C Db D Eb E F F# G Ab A Bb B). */
export const keyLabel = (midi: number) => `${ROOT_SPELLINGS[((midi % 12) + 12) % 12]}${Math.floor(midi / 12) - 1}`;

/** A mark on one key: a colour class for the fill and a word for screen readers. */
export interface KeyMark {
  className: string;
  label: string;
}

interface Props {
  low: number;
  high: number;
  /** concert MIDI -> mark */
  marks?: Map<number, KeyMark>;
  /** keys outside this range are drawn dimmed (an instrument's reach) */
  reach?: { low: number; high: number };
  onNote?: (type: 'on' | 'off', midi: number, timeStamp: number) => void;
  label: string;
  height?: number;
}

/**
 * A keyboard drawn from `low` to `high`: a range diagram when given marks, an instrument when
 * given `onNote` (pointer down plays, up releases).
 */
export const KeyboardDiagram = memo(function KeyboardDiagram({
  low,
  high,
  marks,
  reach,
  onNote,
  label,
  height = 90,
}: Props) {
  const whites: number[] = [];
  for (let m = low; m <= high; m++) if (!isBlackKey(m)) whites.push(m);
  const w = 20;
  const width = whites.length * w;
  const whiteX = new Map(whites.map((m, i) => [m, i * w]));
  const blacks: Array<{ midi: number; x: number }> = [];
  for (let m = low; m <= high; m++) {
    if (!isBlackKey(m)) continue;
    const left = whiteX.get(m - 1);
    if (left !== undefined) blacks.push({ midi: m, x: left + w * 0.68 });
  }
  // On a narrow screen the keys keep a size a finger can find; the drawing scrolls sideways
  // instead (starting on middle C when that is drawn), so it never shrinks to slivers.
  const minWidth = whites.length * (onNote ? 20 : 14);
  const scroller = useRef<HTMLElement>(null);
  const c4 = whiteX.get(60);
  // biome-ignore lint/correctness/useExhaustiveDependencies: only a new span moves the view, not new marks
  useEffect(() => {
    const el = scroller.current;
    if (!el || c4 === undefined || el.scrollWidth <= el.clientWidth) return;
    el.scrollLeft = (c4 / width) * el.scrollWidth - el.clientWidth / 3;
  }, [low, high]);
  const outside = (m: number) => (reach ? m < reach.low || m > reach.high : false);
  // A key that plays is a button named by its note (and its mark, e.g. "E4: held"); a drawn
  // key is part of the picture and has no name of its own.
  const keyName = (midi: number) => {
    const mark = marks?.get(midi);
    return mark ? `${keyLabel(midi)}: ${mark.label}` : keyLabel(midi);
  };
  const handlers = (midi: number) =>
    onNote
      ? {
          onPointerDown: (e: PointerEvent) => {
            (e.target as Element).setPointerCapture?.(e.pointerId);
            onNote('on', midi, e.timeStamp);
          },
          onPointerUp: (e: PointerEvent) => onNote('off', midi, e.timeStamp),
          // A finger that turns into a sideways swipe scrolls the frame: the note it began stops.
          onPointerCancel: (e: PointerEvent) => onNote('off', midi, e.timeStamp),
          role: 'button',
          tabIndex: -1,
          'aria-label': keyName(midi),
        }
      : {};
  return (
    // biome-ignore lint/a11y/noNoninteractiveTabindex: a sideways scroller must take focus so keys can scroll it
    <section ref={scroller} className="overflow-x-auto" tabIndex={0} aria-label={`${label}, scrolls sideways`}>
      <svg
        viewBox={`0 0 ${width} ${height}`}
        style={{ minWidth }}
        // Playing keys take a held or sliding-up-and-down finger as a press and only a sideways
        // swipe as scrolling; a drawing scrolls like any picture.
        className={`h-auto w-full select-none ${onNote ? 'touch-pan-x' : ''}`}
        role={onNote ? 'group' : 'img'}
        aria-label={label}
        preserveAspectRatio="xMidYMid meet"
      >
        {whites.map((m) => {
          const mark = marks?.get(m);
          return (
            <rect
              key={m}
              x={whiteX.get(m)}
              y={0}
              width={w - 1}
              height={height}
              rx={3}
              data-midi={m}
              className={`${mark ? mark.className : outside(m) ? 'fill-line' : 'fill-white'} stroke-ink-300`}
              aria-label={mark ? keyName(m) : undefined}
              {...handlers(m)}
            >
              {mark ? <title>{`${keyLabel(m)}: ${mark.label}`}</title> : null}
            </rect>
          );
        })}
        {blacks.map(({ midi, x }) => {
          const mark = marks?.get(midi);
          return (
            <rect
              key={midi}
              x={x}
              y={0}
              width={w * 0.64}
              height={height * 0.6}
              rx={2}
              data-midi={midi}
              className={`${mark ? mark.className : outside(midi) ? 'fill-ink-300' : 'fill-ink-900'} stroke-ink-900`}
              {...handlers(midi)}
            >
              {mark ? <title>{`${keyLabel(midi)}: ${mark.label}`}</title> : null}
            </rect>
          );
        })}
        {/* The octave names are for the eye; each key already says its own name. */}
        {/* biome-ignore lint/a11y/noAriaHiddenOnFocusable: an SVG group of text labels is never focusable */}
        <g aria-hidden="true">
          {whites
            .filter((m) => m % 12 === 0)
            .map((m) => (
              <text
                key={`c${m}`}
                x={(whiteX.get(m) ?? 0) + w / 2}
                y={height - 6}
                textAnchor="middle"
                className="pointer-events-none fill-ink-500 text-[9px]"
              >
                {keyLabel(m)}
              </text>
            ))}
        </g>
      </svg>
    </section>
  );
});
