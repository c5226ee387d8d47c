import { type ChordFit, EngineError, type NoteRole, pairsForChord } from '@shared/engine';
import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/check-field';
import { TextField } from '@/components/ui/text-field';
import type { Playback } from '@/lib/audio/player';

type Found = { chord: string; fits: ChordFit[]; error: null } | { chord: string; fits: []; error: string };

function find(chord: string): Found {
  try {
    return { chord, fits: pairsForChord(chord), error: null };
  } catch (err) {
    if (err instanceof EngineError) return { chord, fits: [], error: err.message };
    throw err;
  }
}

/** Tone.js and the scheduler load only when a scale is first heard. */
const audio = () => Promise.all([import('@/lib/audio/player'), import('@/lib/audio/scale-preview')]);

const SHOWN = 8;
const pairName = (fit: ChordFit) => `${fit.pair.a.symbol} / ${fit.pair.b.symbol}`;

const ROLE_LABEL: Record<NoteRole, string> = {
  'chord-tone': 'Chord tones',
  tension: 'Tensions',
  other: 'Other notes',
};
const ROLE_STYLE: Record<NoteRole, string> = {
  'chord-tone': 'border-ink-300 bg-raised font-semibold',
  tension: 'border-dashed border-brass-500',
  other: 'border-line text-muted',
};

/** Functions from the root up, so each group reads as the chord is built. */
const FUNCTION_ORDER = [
  '1',
  'b9',
  '9',
  '#9',
  'b3',
  '3',
  '11',
  '#11',
  'b5',
  '5',
  '#5',
  'b13',
  '6',
  '13',
  'bb7',
  'b7',
  '7',
];

/** The pair's notes in the chord's spelling, chord tones apart from tensions. */
function NoteRoles({ fit }: { fit: ChordFit }) {
  const byDegree = (i: number, j: number) =>
    FUNCTION_ORDER.indexOf(fit.functions[i]) - FUNCTION_ORDER.indexOf(fit.functions[j]);
  const groups = (['chord-tone', 'tension', 'other'] as const)
    .map((role) => ({ role, idx: fit.roles.flatMap((r, i) => (r === role ? [i] : [])).sort(byDegree) }))
    .filter((g) => g.idx.length > 0);
  return (
    <span className="grid gap-1" data-testid="fit-notes">
      {groups.map(({ role, idx }) => (
        <span key={role} className="flex flex-wrap items-center gap-1" data-role={role}>
          <span className="w-24 text-caption text-muted">{ROLE_LABEL[role]}</span>
          {idx.map((i) => (
            <span key={fit.notes[i]} className={`rounded border px-1.5 text-caption ${ROLE_STYLE[role]}`}>
              {fit.notes[i]} <span className="font-bold">{fit.functions[i]}</span>
            </span>
          ))}
        </span>
      ))}
    </span>
  );
}

/**
 * The fit finder: a chord symbol in, the pairs whose six notes fit it out, best first, with
 * each note named against the chord, the altered sounds marked (and hideable), and the pair's
 * six-note scale to hear over the chord.
 */
export function FitFinder({
  initialChord,
  onPick,
}: {
  initialChord: string;
  onPick: (fit: ChordFit, chord: string) => void;
}) {
  const form = useSchemaForm(() => import('@shared/schemas/chords').then((m) => m.FindPairsInput), {
    defaultValues: { chord: initialChord },
  });
  const [asked, setAsked] = useState<string | null>(null);
  const [all, setAll] = useState(false);
  const [showAltered, setShowAltered] = useState(true);
  const [hearing, setHearing] = useState<string | null>(null);
  const [audioError, setAudioError] = useState<string | null>(null);
  const playback = useRef<Playback | null>(null);
  const found = useMemo(() => (asked ? find(asked) : null), [asked]);
  const inputId = useId();
  const errorId = `${inputId}-error`;
  const alteredId = useId();

  useEffect(() => () => playback.current?.stop(), []);

  // The chord is checked by the engine (through the shared schema) before any pairs are listed.
  const submit = form.handleSubmit(
    ({ chord }) => {
      setAll(false);
      setAsked(chord);
    },
    () => setAsked(null),
  );

  async function hear(fit: ChordFit, chord: string) {
    const key = pairName(fit);
    const wasHearing = hearing;
    playback.current?.stop();
    playback.current = null;
    if (wasHearing === key) return;
    setAudioError(null);
    setHearing(key);
    try {
      const [{ playSchedule }, { scheduleScalePreview }] = await audio();
      const mine = await playSchedule(scheduleScalePreview(fit.notes, chord), {
        onEnd: () => setHearing((now) => (now === key ? null : now)),
      });
      playback.current = mine;
    } catch {
      setAudioError('This browser could not start audio; check that sound is allowed for this page.');
      setHearing(null);
    }
  }

  const problem = form.errorsOf('chord')?.join(' ') ?? found?.error ?? null;
  const fits = found?.fits ?? [];
  const alteredCount = fits.filter((f) => f.altered).length;
  const listed = showAltered ? fits : fits.filter((f) => !f.altered);
  const shown = all ? listed : listed.slice(0, SHOWN);
  return (
    <section aria-labelledby="fit-finder-heading" className="grid gap-3">
      <h2 id="fit-finder-heading" className="text-lead font-bold">
        Fit finder
      </h2>
      <form
        onSubmit={submit}
        className="flex flex-wrap items-start gap-2"
        aria-label="Find pairs for a chord"
        noValidate
      >
        <TextField
          id={inputId}
          label="Chord symbol"
          className="flex-1"
          placeholder="D7, Bbm7, Cmaj7#11, G7alt …"
          autoComplete="off"
          spellCheck={false}
          // The reason is read out at once (an alert under the form), and tied to the field.
          aria-invalid={problem ? true : undefined}
          aria-describedby={problem ? errorId : undefined}
          {...form.register('chord')}
        />
        <Button type="submit" className="mt-7">
          Find pairs
        </Button>
      </form>
      {problem ? (
        <p id={errorId} role="alert" className="text-caption font-semibold text-ember-700 dark:text-ember-100">
          {problem}
        </p>
      ) : null}
      {found && !found.error ? (
        <div className="grid gap-2">
          <p className="text-caption text-muted" role="status">
            {listed.length} pairs fit {found.chord}
            {listed.length < fits.length ? ` (${fits.length - listed.length} altered hidden)` : ''}, best first: the
            tensions the chord names, two major triads a whole step apart, then its third and seventh.
          </p>
          {alteredCount > 0 ? (
            <CheckboxField
              id={alteredId}
              label={`Show altered pairs (${alteredCount}), whose scale leaves out the chord's fifth`}
              checked={showAltered}
              onChange={(e) => {
                setShowAltered(e.target.checked);
                setAll(false);
              }}
            />
          ) : null}
          <p className="text-caption text-muted">
            Hear plays the pair's six-note scale over the chord; keep headphones at a moderate volume.
          </p>
          {audioError ? (
            <p role="alert" className="text-caption font-semibold text-ember-700 dark:text-ember-100">
              {audioError}
            </p>
          ) : null}
          <ol className="grid gap-2" aria-label={`Pairs for ${found.chord}`}>
            {shown.map((fit) => (
              <li
                key={pairName(fit)}
                className="grid gap-2 rounded-lg border border-line bg-surface p-3"
                data-testid="fit"
                data-altered={fit.altered ? 'true' : undefined}
              >
                <span className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
                  <span className="w-6 text-caption font-bold text-muted">{fit.rank}</span>
                  <span className="font-bold">
                    <span className="text-dusk-700 dark:text-dusk-100">{fit.pair.a.symbol}</span> /{' '}
                    <span className="text-brass-700 dark:text-brass-300">{fit.pair.b.symbol}</span>
                  </span>
                  <span className="text-caption text-muted">{fit.scale}</span>
                  {fit.altered ? (
                    <span
                      className="rounded border border-dusk-500 px-1.5 text-caption font-semibold text-dusk-700 dark:text-dusk-100"
                      data-testid="altered-mark"
                      title="Altered sound: this pair's scale leaves out the chord's fifth"
                    >
                      leaves out the 5th
                    </span>
                  ) : null}
                </span>
                <NoteRoles fit={fit} />
                <span className="flex flex-wrap gap-2">
                  <Button
                    variant="quiet"
                    onClick={() => hear(fit, found.chord)}
                    aria-label={`${hearing === pairName(fit) ? 'Stop' : 'Hear'} the scale of ${pairName(fit)} over ${found.chord}`}
                  >
                    {hearing === pairName(fit) ? 'Stop' : 'Hear'}
                  </Button>
                  <Button variant="quiet" onClick={() => onPick(fit, found.chord)} aria-label={`Use ${pairName(fit)}`}>
                    Use this pair
                  </Button>
                </span>
              </li>
            ))}
          </ol>
          {listed.length > SHOWN ? (
            <Button variant="quiet" onClick={() => setAll(!all)} className="justify-self-start">
              {all ? `Show the first ${SHOWN}` : `Show all ${listed.length}`}
            </Button>
          ) : null}
        </div>
      ) : null}
    </section>
  );
}
