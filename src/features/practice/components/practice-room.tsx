import { type DrillSpec, instruments, quarterTempo, type ScoreOptions } from '@shared/engine';
import type { PlayerSettings } from '@shared/schemas/settings';
import { useEffect, useMemo, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { InputPanel } from '@/components/midi/input-panel';
import { Button } from '@/components/ui/button';
import { useMicrophone } from '@/hooks/use-microphone';
import { useNoteInput } from '@/hooks/use-note-input';
import { MIC_DEVICE_NAME } from '@/lib/mic-input';
import { useSetLatency } from '../api/settings';
import { useSuggestedTempo } from '../api/tempo';
import { useDrillCycle } from '../hooks/use-drill-cycle';
import { useLadder } from '../hooks/use-ladder';
import { useLoop } from '../hooks/use-loop';
import { useReplay } from '../hooks/use-replay';
import { usePracticeTake } from '../hooks/use-practice-take';
import { useSoundRouting } from '../hooks/use-sound-routing';
import { BUSY_MESSAGE } from '@/lib/take-queue';
import { useTakeQueue } from '../hooks/use-take-queue';
import { pitchFrame } from '../lib/pitch-frame';
import { CautionBanner } from './caution-banner';
import { HearYourself } from './hear-yourself';
import { KeyButtons } from './key-buttons';
import { LatencyCalibration } from './latency-calibration';
import { LiveKeyboard } from './live-keyboard';
import { LiveStaff } from './live-staff';
import { LoopPanel } from './loop-panel';
import { type PracticeOptions, PracticeControls } from './practice-controls';
import { FramedName } from './pitch-label';
import { ProgressionName } from './progression-name';
import { PracticeDefaults } from './practice-defaults';
import { TakeResults } from './take-results';
import '../practice.css';

const sessionStart = Date.now();

export interface PracticeRoomProps {
  /** the drill as opened (its own tempo, meter and instrument when it has them) */
  baseSpec: DrillSpec;
  settings: PlayerSettings;
  initialOptions: PracticeOptions;
  assignmentId: string | null;
  /** a key of the cycle to open on */
  wantedKey: string | null;
}

/** The practice room: the drill in its keys, the take that is running, and what it heard. */
export function PracticeRoom({ baseSpec, settings, initialOptions, assignmentId, wantedKey }: PracticeRoomProps) {
  const [opts, setOpts] = useState<PracticeOptions>(initialOptions);
  const { input, status } = useNoteInput();
  const setLatency = useSetLatency();
  const sound = useSoundRouting();
  const { queue, save, dismiss: dismissTake } = useTakeQueue();
  const replay = useReplay();

  const spec: DrillSpec = useMemo(
    () => ({
      ...baseSpec,
      instrument: opts.instrument,
      tempo: opts.tempo,
      meter: opts.meter,
      range: baseSpec.range ?? settings.range ?? undefined,
    }),
    [baseSpec, opts.instrument, opts.tempo, opts.meter, settings.range],
  );
  const { cycle, keyIndex, setKeyIndex, nextKey, fullDrill } = useDrillCycle(spec, opts.order, wantedKey);
  const ladder = useLadder(fullDrill, opts.ladder);
  const passage = useLoop(fullDrill, opts.tempo);
  const looping = passage.loop !== null && passage.drill !== null;
  // A looped passage, else the ladder's step, else the whole drill.
  const drill = looping ? passage.drill : ladder.drill;
  const step = looping ? null : ladder.step;
  const measures: [number, number] | null =
    looping && passage.loop ? [passage.loop.from, passage.loop.to] : step ? [step[0], step[1]] : null;

  const microphone = useMicrophone();
  const deviceName = microphone.on
    ? MIC_DEVICE_NAME
    : status.state === 'ready' && status.selected
      ? (status.devices.find((d) => d.id === status.selected)?.name ?? 'MIDI device')
      : 'Computer keyboard';
  const latencyMs = settings.latency[deviceName] ?? 0;

  const options: ScoreOptions | null = useMemo(() => {
    if (!drill) return null;
    const octave = settings.octaveShift * 12;
    const transposition = opts.writtenPitchInput ? instruments[opts.instrument].transposition : 0;
    return {
      // The scorer counts quarter notes; a compound meter's tempo counts dotted quarters.
      tempo: quarterTempo(drill.spec.tempo, drill.spec.meter),
      mode: opts.mode,
      octaveTolerant: opts.octaveTolerant,
      swing: opts.swing,
      // A microphone hears concert pitch as it sounds: no written-pitch or octave setting applies.
      inputTransposition: microphone.on ? 0 : transposition + octave,
    };
  }, [opts, drill, settings.octaveShift, microphone.on]);

  const autoStart = useRef(false);
  const take = usePracticeTake((finished, session) => {
    if (!fullDrill || !options) return;
    void save({
      spec: { ...fullDrill.spec, tempo: finished.drill.spec.tempo },
      take: finished,
      options: finished.options,
      originPerf: session.origin,
      measures,
      assignmentId,
    });
    if (looping) {
      // Every pass played to the end is followed by the next, at the tempo the climb gives.
      if (finished.stoppedAtMs === null) {
        passage.afterTake(finished);
        autoStart.current = true;
      }
      return;
    }
    if (opts.ladder) ladder.afterTake(finished);
    if (finished.stoppedAtMs === null && (opts.loop || opts.runOn)) {
      autoStart.current = true;
      if (!opts.loop && opts.runOn) setKeyIndex((i) => (i + 1) % 12);
    }
  });

  const begin = () => {
    if (!drill || !options) return;
    replay.stop();
    void sound.synth.ensure();
    take.start({
      drill,
      options,
      // A loop counts every pass in, so the player can breathe and find the tempo.
      countInMeasures: looping ? Math.max(1, opts.countIn) : opts.countIn,
      click: opts.click,
      pad: opts.pad && !!(drill.spec.chord || drill.changes),
      latencyMs,
      volumeDb: sound.hear.volumeDb,
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

  const climbed = useSuggestedTempo(fullDrill?.spec ?? null).data?.climb ?? null;
  // Offered only when it would change something: not when the tempo already is the suggestion.
  const climb = climbed && climbed.tempo !== opts.tempo ? climbed : null;
  const running = take.phase === 'count-in' || take.phase === 'playing';
  const inst = instruments[opts.instrument];
  const frame = useMemo(() => pitchFrame(opts.instrument), [opts.instrument]);
  // The keyboard reaches the player's own lowest and highest notes as well as the instrument's.
  const keyboardRange = {
    low: Math.min(inst.range.low, settings.range?.low ?? inst.range.low),
    high: Math.max(inst.range.high, settings.range?.high ?? inst.range.high),
  };
  const fade = opts.ladder ? ladder.ladder.fade : 0;

  return (
    <div className="grid gap-6" data-testid="practice" data-phase={take.phase} data-origin={take.origin ?? ''}>
      <CautionBanner practisingSince={sessionStart} />
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-title">Practice</h1>
          <p className="text-muted" data-testid="drill-summary">
            {drill ? (
              <>
                {drill.changes ? (
                  <ProgressionName changes={drill.spec.changes ?? []} frame={frame} />
                ) : (
                  <FramedName written={frame.pair(drill.spec.pair).join(' / ')} concert={drill.spec.pair.join(' / ')} />
                )}
                {` · ${typeof drill.spec.pattern === 'string' ? drill.spec.pattern : drill.spec.pattern.name} · ${drill.spec.direction}`}
                {drill.spec.chord ? (
                  <>
                    {' · over '}
                    <FramedName written={frame.chord(drill.spec.chord)} concert={drill.spec.chord} />
                  </>
                ) : null}
              </>
            ) : null}
            {` · ${inst.label}`}
            {frame.transposing ? ', in written pitch' : ''}
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

      <KeyButtons
        drills={cycle.drills}
        current={keyIndex}
        disabled={running}
        frame={frame}
        onPick={(i) => {
          setKeyIndex(i);
          ladder.restart();
          passage.end();
          take.reset();
        }}
      />

      {!looping && opts.ladder && step ? (
        <p
          data-testid="ladder-step"
          data-step={ladder.ladder.step}
          data-from={step[0]}
          data-to={step[1]}
          data-fade={ladder.ladder.fade}
          className="rounded-lg bg-raised p-3"
        >
          Ladder step {ladder.ladder.step + 1} of {ladder.steps.length}: measure
          {step[0] === step[1] ? ` ${step[0]}` : `s ${step[0]}–${step[1]}`}. Two clean takes in a row (95% or better,
          nothing missed) to move on. {ladder.ladder.streak === 1 ? 'One clean take so far.' : ''}
        </p>
      ) : null}

      <div className={`min-w-0 rounded-card border border-line bg-raised p-4 sf-fade-${fade}`}>
        {drill ? <LiveStaff drill={drill} live={take.live} downbeatMs={running ? take.origin : null} /> : null}
        {drill ? (
          <div className="mt-3">
            <LiveKeyboard
              drill={drill}
              live={take.live}
              range={keyboardRange}
              frame={frame}
              playedToConcert={options?.inputTransposition ?? 0}
              label={`${inst.label} range${frame.transposing ? ' in written pitch' : ''} with the drill's notes`}
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
        {climb && !running ? (
          <button
            type="button"
            className="text-brass-700 underline dark:text-brass-300"
            onClick={() => setOpts({ ...opts, tempo: climb.tempo })}
          >
            Suggested tempo: {climb.tempo} bpm
          </button>
        ) : null}
        {queue.waiting > 0 ? (
          <span
            className="rounded-full bg-brass-100 px-3 py-1 text-caption font-semibold text-ink-900"
            data-testid="queue-waiting"
          >
            {queue.busy
              ? BUSY_MESSAGE
              : `${queue.waiting} take${queue.waiting === 1 ? '' : 's'} waiting to be saved — kept on this device, sent when the server answers`}
          </span>
        ) : null}
        {queue.refused.map((r) => (
          <span
            key={r.id}
            role="alert"
            className="flex flex-wrap items-center gap-2 text-ember-700 dark:text-ember-100"
          >
            A take was refused by the server: {r.message}
            <button
              type="button"
              onClick={() => void dismissTake(r.id)}
              className="rounded-full border border-current px-3 py-0.5 text-caption font-semibold"
            >
              Dismiss
            </button>
          </span>
        ))}
      </div>

      {fullDrill ? (
        <LoopPanel
          measures={fullDrill.measures}
          targetTempo={opts.tempo}
          loop={passage.loop}
          disabled={running}
          onStart={(from, to, tempo) => {
            take.reset();
            passage.start(from, to, tempo);
          }}
          onEnd={() => {
            passage.end();
            take.reset();
          }}
        />
      ) : null}

      {take.finished ? (
        <TakeResults
          drill={take.finished.drill}
          take={take.finished}
          onAgain={begin}
          onNextKey={
            opts.ladder
              ? null
              : () => {
                  nextKey();
                  take.reset();
                }
          }
          onReplay={() => take.finished && replay.play(take.finished.drill, take.finished.played)}
          climb={
            climb && !measures && take.finished.stoppedAtMs === null
              ? {
                  tempo: climb.tempo,
                  verdict: climb.lastVerdict,
                  onUse: () => setOpts({ ...opts, tempo: climb.tempo }),
                }
              : null
          }
        />
      ) : null}

      <PracticeControls value={opts} onChange={setOpts} disabled={running} hasChord={!!(spec.chord || spec.changes)} />
      <div className="grid gap-4 md:grid-cols-2">
        <InputPanel input={input} status={status} microphone />
        <HearYourself value={sound.hear} onChange={sound.setHear} />
      </div>
      <PracticeDefaults settings={settings} />
      <LatencyCalibration
        device={deviceName}
        current={settings.latency[deviceName]}
        volumeDb={sound.hear.volumeDb}
        onMeasured={(offsetMs) => setLatency.mutate({ device: deviceName, offsetMs })}
      />
    </div>
  );
}
