import type { Drill } from '@shared/engine';
import { useEffect, useId, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/check-field';
import type { Playback } from '@/lib/audio/player';
import { downloadBytes, fileBase } from './download-file';

const player = () => import('@/lib/audio/player');

/**
 * Hear the drill: a one-measure count-in, the click, and the chord pad if the drill has a chord.
 * The same sounds render offline to a WAV file for listening away from the instrument.
 */
export function AudioPreview({ drill, onNote }: { drill: Drill; onNote: (index: number | null) => void }) {
  const [click, setClick] = useState(true);
  const hasChords = Boolean(drill.spec.chord || drill.changes);
  const [pad, setPad] = useState(hasChords);
  const [state, setState] = useState<'idle' | 'loading' | 'playing' | 'rendering'>('idle');
  const [error, setError] = useState<string | null>(null);
  const playback = useRef<Playback | null>(null);
  const clickId = useId();
  const padId = useId();
  const onNoteRef = useRef(onNote);
  onNoteRef.current = onNote;

  // A new drill (another key, another setting) stops what is playing.
  // biome-ignore lint/correctness/useExhaustiveDependencies: the drill is the trigger, not an input
  useEffect(
    () => () => {
      playback.current?.stop();
      playback.current = null;
    },
    [drill],
  );

  async function play() {
    setError(null);
    setState('loading');
    try {
      const { playDrill } = await player();
      playback.current = await playDrill(drill, {
        click,
        pad,
        countInMeasures: 1,
        onNote: (i) => onNoteRef.current(i),
        onEnd: () => {
          playback.current = null;
          onNoteRef.current(null);
          setState('idle');
        },
      });
      setState('playing');
    } catch {
      setError('This browser could not start audio; check that sound is allowed for this page.');
      setState('idle');
    }
  }

  async function renderWav() {
    setError(null);
    setState('rendering');
    try {
      const { renderDrillWav } = await player();
      downloadBytes(
        await renderDrillWav(drill, { click, pad, countInMeasures: 1 }),
        `${fileBase(drill)}.wav`,
        'audio/wav',
      );
    } catch (err) {
      console.error(err);
      setError('The audio file could not be made in this browser.');
    }
    setState('idle');
  }

  return (
    <section aria-labelledby="listen-heading" className="grid gap-2">
      <h2 id="listen-heading" className="text-lead font-bold">
        Listen
      </h2>
      <div className="flex flex-wrap items-center gap-3">
        {state === 'playing' ? (
          <Button onClick={() => playback.current?.stop()}>Stop</Button>
        ) : (
          <Button onClick={play} disabled={state !== 'idle'}>
            {state === 'loading' ? 'Starting…' : 'Play the drill'}
          </Button>
        )}
        <CheckboxField
          id={clickId}
          label="Click"
          checked={click}
          onChange={(e) => setClick(e.target.checked)}
          disabled={state === 'playing'}
        />
        <CheckboxField
          id={padId}
          label={`Chord pad${drill.changes ? ' (follows the changes)' : drill.spec.chord ? ` (${drill.spec.chord})` : ' (no chord set)'}`}
          checked={pad}
          onChange={(e) => setPad(e.target.checked)}
          disabled={!hasChords || state === 'playing'}
        />
        <Button variant="quiet" onClick={renderWav} disabled={state !== 'idle'}>
          {state === 'rendering' ? 'Rendering…' : 'Audio (WAV)'}
        </Button>
      </div>
      <p className="text-caption text-muted">One measure of clicks counts you in; the notes sound at concert pitch.</p>
      {error ? (
        <p role="alert" className="text-caption font-semibold text-ember-700 dark:text-ember-100">
          {error}
        </p>
      ) : null}
    </section>
  );
}
