import { type DrillSpec, generateDrill, inAllKeys, instruments, type ScoreOptions, sliceDrill } from '@shared/engine';
import { drillKey } from '@shared/practice/drill-identity';
import { initialLadder, type LadderState, ladderSteps, nextLadderState } from '@shared/practice/ladder';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo, useRef, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { InputPanel } from '@/components/midi/input-panel';
import { Button } from '@/components/ui/button';
import { specFromParams } from '@/features/drills/hooks/spec-params';
import { fetchSavedDrill } from '@/features/practice/api/drill-source';
import { useSetLatency, useSettings } from '@/features/practice/api/settings';
import { tempoKey, useSuggestedTempo } from '@/features/practice/api/tempo';
import { CautionBanner } from '@/features/practice/components/caution-banner';
import { HearYourself, type HearSettings } from '@/features/practice/components/hear-yourself';
import { LatencyCalibration } from '@/features/practice/components/latency-calibration';
import { LiveKeyboard } from '@/features/practice/components/live-keyboard';
import { LiveStaff } from '@/features/practice/components/live-staff';
import { type PracticeOptions, PracticeControls } from '@/features/practice/components/practice-controls';
import { PracticeDefaults } from '@/features/practice/components/practice-defaults';
import { TakeResults } from '@/features/practice/components/take-results';
import { usePracticeTake } from '@/features/practice/hooks/use-practice-take';
import { PlayedSynth } from '@/features/practice/lib/practice-audio';
import { replayTake } from '@/features/practice/lib/replay';
import '@/features/practice/practice.css';
import { getNoteInput, useNoteInput } from '@/hooks/use-note-input';
import { sendNote } from '@/lib/midi-output';
import { onQueueChange, type QueueState, saveTake } from '@/lib/take-queue';

/** The free starter drill of the demo studio: C/D over Cmaj7#11. */
const STARTER: DrillSpec = {
  pair: ['C', 'D'],
  pattern: 'stack',
  direction: 'up-down',
  chord: 'Cmaj7#11',
  range: { low: 60, high: 84 },
};

const sessionStart = Date.now();

export function PracticeRoute() {
  const [params] = useSearchParams();
  const queryClient = useQueryClient();
  const fromParams = useMemo(() => specFromParams(params), [params]);
  const savedId = params.get('drill');
  const assignmentId = params.get('assignment');
  const tempoParam =
    Number(params.get('tempo')) >= 20 && Number(params.get('tempo')) <= 400 ? Number(params.get('tempo')) : null;
  const saved = useQuery({
    queryKey: ['drills', 'saved', savedId],
    queryFn: () => fetchSavedDrill(savedId!),
    enabled: !!savedId,
  });
  const settings = useSettings();
  const { input, status } = useNoteInput();
  const setLatency = useSetLatency();

  const baseSpec: DrillSpec | null = savedId ? (saved.data?.drill.spec ?? null) : (fromParams.spec ?? STARTER);
  const [opts, setOpts] = useState<PracticeOptions | null>(null);
  // Settings arrive once: the drill's own values first, the player's defaults for the rest.
  useEffect(() => {
    if (opts || !baseSpec || !settings.data) return;
    const s = settings.data.settings;
    setOpts({
      instrument: baseSpec.instrument ?? s.instrument,
      // An assignment opens at its target tempo; otherwise the drill's own, then the player's.
      tempo: tempoParam ?? baseSpec.tempo ?? s.defaultTempo,
      meter: baseSpec.meter ?? [4, 4],
      countIn: 1,
      click: 'every-beat',
      swing: 0.5,
      pad: !!baseSpec.chord,
      octaveTolerant: false,
      mode: 'timed',
      writtenPitchInput: s.writtenPitchInput,
      loop: false,
      runOn: false,
      order: saved.data?.drill.keyOrder ?? fromParams.order,
      ladder: false,
    });
  }, [opts, baseSpec, settings.data, saved.data, fromParams.order, tempoParam]);

  const personalRange = settings.data?.settings.range ?? null;
  const spec: DrillSpec | null = useMemo(() => {
    if (!baseSpec || !opts) return null;
    return {
      ...baseSpec,
      instrument: opts.instrument,
      tempo: opts.tempo,
      meter: opts.meter,
      range: baseSpec.range ?? personalRange ?? undefined,
    };
  }, [baseSpec, opts, personalRange]);

  const cycle = useMemo(() => {
    if (!spec || !opts) return { drills: [], error: null as string | null };
    try {
      return { drills: inAllKeys(spec, opts.order), error: null };
    } catch (err) {
      const why = err instanceof Error ? err.message : 'This drill cannot be built';
      // Some keys may not fit the range; the drill's own key still can be practised.
      try {
        return {
          drills: [generateDrill(spec)],
          error: `Not every key of the cycle fits this range (${why}); practising this key only.`,
        };
      } catch {
        return { drills: [], error: why };
      }
    }
  }, [spec, opts]);

  const wantedKey = params.get('key');
  const [keyIndex, setKeyIndex] = useState(0);
  useEffect(() => {
    if (!wantedKey || cycle.drills.length === 0) return;
    const i = cycle.drills.findIndex((d) => drillKey(d.spec) === wantedKey);
    if (i >= 0) setKeyIndex(i);
  }, [wantedKey, cycle.drills]);
  const fullDrill = cycle.drills[keyIndex] ?? null;

  const [ladder, setLadder] = useState<LadderState>(initialLadder);
  const steps = useMemo(() => (fullDrill ? ladderSteps(fullDrill.measures) : []), [fullDrill]);
  const step = opts?.ladder ? (steps[ladder.step] ?? null) : null;
  const drill = useMemo(
    () => (fullDrill && step ? sliceDrill(fullDrill, step[0], step[1]) : fullDrill),
    [fullDrill, step],
  );

  const [hear, setHear] = useState<HearSettings>({ volumeDb: -10, muted: false, outputId: null });
  const synth = useRef(new PlayedSynth());
  useEffect(() => {
    synth.current.setVolume(hear.volumeDb);
    synth.current.setMuted(hear.muted || hear.outputId !== null);
  }, [hear]);
  useEffect(() => {
    const offNote = getNoteInput().onNote((e) => {
      if (hear.outputId) sendNote(hear.outputId, e.type, e.midi, e.velocity);
      else if (e.type === 'on') {
        void synth.current.ensure();
        synth.current.noteOn(e.midi, e.velocity);
      } else synth.current.noteOff(e.midi);
    });
    const offBreath = getNoteInput().onBreath((v) => synth.current.breath(v));
    return () => {
      offNote();
      offBreath();
    };
  }, [hear.outputId]);

  const deviceName =
    status.state === 'ready' && status.selected
      ? (status.devices.find((d) => d.id === status.selected)?.name ?? 'MIDI device')
      : 'Computer keyboard';
  const latencyMs = settings.data?.settings.latency[deviceName] ?? 0;

  const options: ScoreOptions | null = useMemo(() => {
    if (!opts || !drill) return null;
    const octave = (settings.data?.settings.octaveShift ?? 0) * 12;
    const transposition = opts.writtenPitchInput ? instruments[opts.instrument].transposition : 0;
    return {
      tempo: drill.spec.tempo,
      mode: opts.mode,
      octaveTolerant: opts.octaveTolerant,
      swing: opts.swing,
      inputTransposition: transposition + octave,
    };
  }, [opts, drill, settings.data]);

  const [queue, setQueue] = useState<QueueState>({ waiting: 0, refused: [] });
  useEffect(() => onQueueChange(setQueue), []);
  const autoStart = useRef(false);

  const take = usePracticeTake((finished, session) => {
    if (!fullDrill || !options || !opts) return;
    const startedAt = new Date(Date.now() - (performance.now() - session.origin)).toISOString();
    const measures = step ? ([step[0], step[1]] as [number, number]) : null;
    void saveTake({
      id: crypto.randomUUID(),
      spec: fullDrill.spec,
      played: finished.played,
      options,
      startedAt,
      measures,
      stoppedAtMs: finished.stoppedAtMs,
      assignmentId,
    }).then(() => queryClient.invalidateQueries({ queryKey: tempoKey(fullDrill.spec) }));
    if (opts.ladder) {
      const missed = finished.score.results.filter((r) => r.verdict === 'missed').length;
      setLadder((l) => nextLadderState(l, { accuracy: finished.score.accuracy, missed }, steps.length));
    }
    if (finished.stoppedAtMs === null && (opts.loop || opts.runOn)) {
      autoStart.current = true;
      if (!opts.loop && opts.runOn) setKeyIndex((i) => (i + 1) % 12);
    }
  });

  const begin = () => {
    if (!drill || !options || !opts) return;
    void synth.current.ensure();
    take.start({
      drill,
      options,
      countInMeasures: opts.countIn,
      click: opts.click,
      pad: opts.pad && !!drill.spec.chord,
      latencyMs,
      volumeDb: hear.volumeDb,
    });
  };
  const beginRef = useRef(begin);
  beginRef.current = begin;
  // Loop and run-on: the next take starts as soon as the next drill is in place.
  // biome-ignore lint/correctness/useExhaustiveDependencies: runs when the drill or the take's phase changes
  useEffect(() => {
    if (autoStart.current && take.phase === 'done') {
      autoStart.current = false;
      const t = setTimeout(() => beginRef.current(), 400);
      return () => clearTimeout(t);
    }
  }, [drill, take.phase]);

  const climbSpec = fullDrill?.spec ?? null;
  const climb = useSuggestedTempo(climbSpec);
  const running = take.phase === 'count-in' || take.phase === 'playing';

  const inst = opts ? instruments[opts.instrument] : instruments.piano;
  if (savedId && saved.isError) {
    return <p role="alert">That saved drill could not be opened: {(saved.error as Error).message}</p>;
  }
  if (!opts || !spec) return <p role="status">Getting the practice room ready…</p>;

  const fade = opts.ladder ? ladder.fade : 0;
  return (
    <div className="grid gap-6" data-testid="practice" data-phase={take.phase} data-origin={take.origin ?? ''}>
      <CautionBanner practisingSince={sessionStart} />
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-title">Practice</h1>
          <p className="text-muted">
            {drill
              ? `${drill.spec.pair.join(' / ')} · ${typeof drill.spec.pattern === 'string' ? drill.spec.pattern : drill.spec.pattern.name} · ${drill.spec.direction}`
              : ''}
            {drill?.spec.chord ? ` · over ${drill.spec.chord}` : ''} · {inst.label}
          </p>
        </div>
        <Link
          to={`/drills?spec=${encodeURIComponent(JSON.stringify(spec))}&order=${opts.order}`}
          className="text-brass-700 underline dark:text-brass-300"
        >
          Change the drill
        </Link>
      </header>

      {cycle.error ? (
        <p role="alert" className="rounded-card border border-ember-500 p-4 text-ember-700 dark:text-ember-100">
          {cycle.error}
        </p>
      ) : null}

      <nav aria-label="Keys of the cycle" className="flex flex-wrap gap-1">
        {cycle.drills.map((d, i) => (
          <button
            key={drillKey(d.spec)}
            type="button"
            disabled={running}
            onClick={() => {
              setKeyIndex(i);
              setLadder(initialLadder);
              take.reset();
            }}
            aria-current={i === keyIndex ? 'true' : undefined}
            className={`rounded-md px-2.5 py-1 text-caption font-bold ${i === keyIndex ? 'bg-ink-800 text-white dark:bg-brass-300 dark:text-ink-950' : 'border border-line'}`}
          >
            {drillKey(d.spec)}
          </button>
        ))}
      </nav>

      {opts.ladder && step ? (
        <p
          data-testid="ladder-step"
          data-step={ladder.step}
          data-from={step[0]}
          data-to={step[1]}
          data-fade={ladder.fade}
          className="rounded-lg bg-raised p-3"
        >
          Ladder step {ladder.step + 1} of {steps.length}: measure
          {step[0] === step[1] ? ` ${step[0]}` : `s ${step[0]}–${step[1]}`}. Two clean takes in a row (95% or better,
          nothing missed) to move on. {ladder.streak === 1 ? 'One clean take so far.' : ''}
        </p>
      ) : null}

      <div className={`rounded-card border border-line bg-raised p-4 sf-fade-${fade}`}>
        {drill ? <LiveStaff drill={drill} live={take.live} /> : null}
        {drill ? (
          <div className="mt-3">
            <LiveKeyboard
              drill={drill}
              live={take.live}
              range={inst.range}
              label={`${inst.label} range with the drill's notes`}
            />
          </div>
        ) : null}
      </div>

      <div className="flex flex-wrap items-center gap-3">
        {running ? (
          <Button variant="danger" onClick={take.stop}>
            Stop (keeps what you played)
          </Button>
        ) : (
          <Button onClick={begin} disabled={!drill}>
            {take.phase === 'done' ? 'Start another take' : 'Start the take'}
          </Button>
        )}
        <span role="status" className="text-muted" data-testid="take-phase">
          {take.phase === 'count-in'
            ? 'Count-in…'
            : take.phase === 'playing'
              ? 'Playing — every note is being marked'
              : ''}
        </span>
        {climb.data?.climb && !running ? (
          <button
            type="button"
            className="text-brass-700 underline dark:text-brass-300"
            onClick={() => setOpts({ ...opts, tempo: climb.data.climb!.tempo })}
          >
            Suggested tempo: {climb.data.climb.tempo} bpm
          </button>
        ) : null}
        {queue.waiting > 0 ? (
          <span
            className="rounded-full bg-brass-100 px-3 py-1 text-caption font-semibold text-ink-900"
            data-testid="queue-waiting"
          >
            {queue.waiting} take{queue.waiting === 1 ? '' : 's'} waiting to be saved — kept on this device, sent when
            the server answers
          </span>
        ) : null}
        {queue.refused.map((r) => (
          <span key={r.id} role="alert" className="text-ember-700">
            A take was refused by the server: {r.message}
          </span>
        ))}
      </div>

      {take.finished && drill ? (
        <TakeResults
          drill={drill}
          take={take.finished}
          onAgain={begin}
          onNextKey={
            opts.ladder
              ? null
              : () => {
                  setKeyIndex((i) => (i + 1) % Math.max(1, cycle.drills.length));
                  take.reset();
                }
          }
          onReplay={() => void replayTake(drill, take.finished!.played)}
          climb={
            climb.data?.climb && !step && take.finished.stoppedAtMs === null
              ? {
                  tempo: climb.data.climb.tempo,
                  verdict: climb.data.climb.lastVerdict,
                  onUse: () => setOpts({ ...opts, tempo: climb.data!.climb!.tempo }),
                }
              : null
          }
        />
      ) : null}

      <PracticeControls value={opts} onChange={setOpts} disabled={running} hasChord={!!spec.chord} />
      <div className="grid gap-4 md:grid-cols-2">
        <InputPanel input={input} status={status} />
        <HearYourself value={hear} onChange={setHear} />
      </div>
      {settings.data ? <PracticeDefaults settings={settings.data.settings} /> : null}
      <LatencyCalibration
        device={deviceName}
        current={settings.data?.settings.latency[deviceName]}
        volumeDb={hear.volumeDb}
        onMeasured={(offsetMs) => setLatency.mutate({ device: deviceName, offsetMs })}
      />
    </div>
  );
}
