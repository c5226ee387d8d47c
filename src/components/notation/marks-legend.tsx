import type { Verdict } from '@shared/engine';

const R = 4.6;
/** The same shapes the staff draws under each note (see marks.ts), for the key beside it. */
function Shape({ verdict }: { verdict: Verdict }) {
  const x = 7;
  const y = 7;
  let shape: React.ReactNode;
  switch (verdict) {
    case 'hit':
      shape = <circle cx={x} cy={y} r={R} className="sf-shape-fill" />;
      break;
    case 'early':
      shape = <path d={`M${x - R - 1} ${y}L${x + R} ${y - R}L${x + R} ${y + R}Z`} className="sf-shape-fill" />;
      break;
    case 'late':
      shape = <path d={`M${x + R + 1} ${y}L${x - R} ${y - R}L${x - R} ${y + R}Z`} className="sf-shape-fill" />;
      break;
    case 'wrong':
      shape = (
        <path
          d={`M${x - R} ${y - R}L${x + R} ${y + R}M${x + R} ${y - R}L${x - R} ${y + R}`}
          className="sf-shape-stroke"
        />
      );
      break;
    default:
      shape = <circle cx={x} cy={y} r={R - 0.6} className="sf-shape-ring" />;
  }
  return (
    <svg
      width="14"
      height="14"
      viewBox="0 0 14 14"
      aria-hidden="true"
      className={`sf-mark sf-verdict-${verdict} inline-block align-[-2px]`}
    >
      {shape}
    </svg>
  );
}

const WORDS: Array<[Verdict, string]> = [
  ['hit', 'hit'],
  ['early', 'early'],
  ['late', 'late'],
  ['wrong', 'wrong note'],
  ['missed', 'missed'],
];

/** The key to the marks under the staff: each verdict's shape and word; the band is the note due now. */
export function MarksLegend() {
  return (
    <ul
      className="sf-legend m-0 flex list-none flex-wrap gap-x-4 gap-y-1 p-0 text-caption text-muted"
      aria-label="Marks under the notes"
    >
      {WORDS.map(([v, word]) => (
        <li key={v} className="flex items-center gap-1">
          <Shape verdict={v} /> {word}
        </li>
      ))}
      <li className="flex items-center gap-1">
        <span className="sf-current-swatch inline-block h-3.5 w-2.5 rounded-sm" aria-hidden="true" /> note due now
      </li>
      <li>faint: not final yet</li>
    </ul>
  );
}
