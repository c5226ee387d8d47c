import { useEffect } from 'react';
import { SelectField } from '@/components/ui/select-field';
import { useMicrophone } from '@/hooks/use-microphone';
import type { InputStatus, NoteInput } from '@/lib/midi-input';
import { MicPanel } from './mic-panel';

const CHANNELS = Array.from({ length: 16 }, (_, i) => i + 1);
const MICROPHONE = 'microphone';

/**
 * Where notes come from: the MIDI device and channel, or why MIDI is not there. With
 * `microphone`, the microphone is one more choice (asked for only when picked); when it is
 * refused or missing the panel says why and the keyboards and MIDI go on working.
 */
export function InputPanel({
  input,
  status,
  microphone = false,
}: {
  input: NoteInput;
  status: InputStatus;
  microphone?: boolean;
}) {
  const { mic, status: micStatus, on: micOn } = useMicrophone();
  // Back on the microphone when it was the player's choice last time; let go when the page closes.
  useEffect(() => {
    if (!microphone) return;
    void mic.resumeIfChosen().then((s) => {
      if (s.state === 'listening') input.selectDevice(null);
    });
    return () => mic.stop();
  }, [microphone, mic, input]);
  const micProblem = microphone && 'message' in micStatus && micStatus.state !== 'listening';
  const ready = status.state === 'ready' || microphone;
  const problem =
    micProblem ||
    (!micOn &&
      (status.state === 'unsupported' ||
        status.state === 'denied' ||
        status.state === 'unavailable' ||
        status.state === 'failed'));
  const pick = (value: string) => {
    if (value === MICROPHONE) {
      input.selectDevice(null);
      void mic.start();
      return;
    }
    mic.forget();
    input.selectDevice(value || null);
  };
  const message = micOn
    ? micStatus.state === 'listening'
      ? micStatus.message
      : 'Waiting for the microphone… (the browser may ask you to allow it)'
    : micProblem && 'message' in micStatus
      ? micStatus.message
      : status.state === 'idle' || status.state === 'starting'
        ? 'Looking for MIDI devices…'
        : status.message;
  return (
    <section aria-labelledby="input-heading" className="rounded-card border border-line bg-raised p-4">
      <h2 id="input-heading" className="text-lead font-bold">
        Note input
      </h2>
      {ready ? (
        <div className="mt-3 flex flex-wrap gap-4">
          <SelectField
            label={microphone ? 'Play with' : 'MIDI device'}
            className="min-w-56"
            value={micOn ? MICROPHONE : status.state === 'ready' ? (status.selected ?? '') : ''}
            onChange={(e) => pick(e.target.value)}
            options={[
              { value: '', label: 'None (keyboards only)' },
              ...(status.state === 'ready' ? status.devices.map((d) => ({ value: d.id, label: d.name })) : []),
              ...(microphone ? [{ value: MICROPHONE, label: 'Microphone (an acoustic instrument)' }] : []),
            ]}
          />
          {micOn ? null : (
            <SelectField
              label="Channel"
              value={String(input.channel)}
              onChange={(e) => input.setChannel(e.target.value === 'all' ? 'all' : Number(e.target.value))}
              options={[
                { value: 'all', label: 'All channels' },
                ...CHANNELS.map((c) => ({ value: String(c), label: String(c) })),
              ]}
            />
          )}
        </div>
      ) : null}
      {micStatus.state === 'listening' ? <MicPanel mic={mic} /> : null}
      <p
        role="status"
        data-testid="input-status"
        data-state={micOn || micProblem ? `mic-${micStatus.state}` : status.state}
        className={`mt-3 text-body ${problem ? 'text-ember-700 dark:text-ember-100' : 'text-muted'}`}
      >
        {message}
      </p>
      <p className="mt-2 text-caption text-muted">
        Computer keyboard: A S D F G H J K L play the white keys from C, W E T Y U O P the black keys; Z and X move an
        octave down and up.
      </p>
    </section>
  );
}
