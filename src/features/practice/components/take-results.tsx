import { type Drill, takeToMidi } from '@shared/engine';
import { Button } from '@/components/ui/button';
import { pitchFrame } from '../lib/pitch-frame';
import type { FinishedTake } from '../lib/take-session';

function download(bytes: Uint8Array, name: string) {
  const url = URL.createObjectURL(new Blob([bytes as BlobPart], { type: 'audio/midi' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

function timing(mean: number | null): string {
  if (mean === null) return 'no notes to time';
  if (Math.abs(mean) < 10) return 'right on the beat';
  return mean < 0 ? `rushing by ${Math.abs(mean).toFixed(0)} ms` : `dragging by ${mean.toFixed(0)} ms`;
}

/** After a take: how it went, which notes slipped, and what to do next. */
export function TakeResults({
  drill,
  take,
  onAgain,
  onNextKey,
  onReplay,
  climb,
}: {
  drill: Drill;
  take: FinishedTake;
  onAgain: () => void;
  onNextKey: (() => void) | null;
  onReplay: () => void;
  climb: { tempo: number; verdict: 'up' | 'down' | 'hold'; onUse: () => void } | null;
}) {
  const { score } = take;
  const counts = { hit: 0, early: 0, late: 0, wrong: 0, missed: 0 };
  for (const r of score.results) counts[r.verdict] += 1;
  const slipped = score.results
    .map((r, i) => ({ r, n: take.expected[i], i }))
    .filter(({ r }) => r.verdict === 'missed' || r.verdict === 'wrong');
  const pct = Math.round(score.accuracy * 100);
  // Played notes in the frame the expected ones are written in: what was played, as the player reads it.
  const frame = pitchFrame(drill.spec.instrument);
  const toConcert = take.options.inputTransposition ?? 0;
  const playedName = (i: number | null, like: string) =>
    i === null ? '?' : frame.name(frame.written(take.played[i].midi + toConcert), like);
  return (
    <section
      aria-labelledby="results-heading"
      data-testid="take-results"
      data-accuracy={score.accuracy}
      className="rounded-card border border-line bg-raised p-5"
    >
      <h2 id="results-heading" className="text-lead font-bold">
        {take.stoppedAtMs !== null ? 'Take stopped — saved up to where you stopped' : 'Take done'}
      </h2>
      <dl className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-4">
        <div>
          <dt className="text-caption text-muted">Accuracy</dt>
          <dd className="text-title" data-testid="accuracy">
            {pct}%
          </dd>
        </div>
        <div>
          <dt className="text-caption text-muted">Timing</dt>
          <dd className="font-semibold">{timing(score.meanOffsetMs)}</dd>
        </div>
        <div>
          <dt className="text-caption text-muted">Spread</dt>
          <dd className="font-semibold">{score.spreadMs === null ? '—' : `± ${score.spreadMs.toFixed(0)} ms`}</dd>
        </div>
        <div>
          <dt className="text-caption text-muted">Notes</dt>
          <dd className="text-caption">
            {counts.hit} hit · {counts.early} early · {counts.late} late · {counts.wrong} wrong · {counts.missed} missed
            · {score.extras.length} extra
          </dd>
        </div>
      </dl>
      {slipped.length > 0 ? (
        <div className="mt-3">
          <h3 className="text-caption font-bold uppercase tracking-wide text-muted">What slipped</h3>
          <ul className="mt-1 flex flex-wrap gap-2" data-testid="slipped">
            {slipped.map(({ r, n, i }) => (
              <li
                key={i}
                data-index={i}
                data-verdict={r.verdict}
                className="rounded-full border border-ember-500/50 px-2.5 py-0.5 text-caption"
              >
                m{n.measure} · {n.written}{' '}
                {r.verdict === 'missed' ? 'missed' : `wrong (played ${playedName(r.playedIndex, n.written)})`}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {climb ? (
        <p className="mt-4 rounded-lg bg-surface p-3" data-testid="tempo-climb" data-tempo={climb.tempo}>
          {climb.verdict === 'up'
            ? 'Clean take: '
            : climb.verdict === 'down'
              ? 'Take it down a notch: '
              : 'Stay here until it is clean: '}
          next tempo <strong>{climb.tempo} bpm</strong>.{' '}
          <button
            type="button"
            onClick={climb.onUse}
            className="font-semibold text-brass-700 underline dark:text-brass-300"
          >
            Use {climb.tempo} bpm
          </button>
        </p>
      ) : null}
      <div className="mt-4 flex flex-wrap gap-2">
        <Button onClick={onAgain}>Again</Button>
        {onNextKey ? (
          <Button variant="quiet" onClick={onNextKey}>
            Next key
          </Button>
        ) : null}
        <Button variant="quiet" onClick={onReplay}>
          Replay against the drill
        </Button>
        <Button
          variant="quiet"
          onClick={() =>
            download(takeToMidi({ drill, played: take.played }), `sixfold-take-${drill.spec.pair.join('-')}.mid`)
          }
        >
          Download MIDI
        </Button>
      </div>
    </section>
  );
}
