import type { InputStatus, NoteInput } from '@/lib/midi-input';

const CHANNELS = Array.from({ length: 16 }, (_, i) => i + 1);

/** Where notes come from: the MIDI device and channel, or why MIDI is not there. */
export function InputPanel({ input, status }: { input: NoteInput; status: InputStatus }) {
  const ready = status.state === 'ready';
  const problem =
    status.state === 'unsupported' ||
    status.state === 'denied' ||
    status.state === 'unavailable' ||
    status.state === 'failed';
  return (
    <section aria-labelledby="input-heading" className="rounded-card border border-line bg-raised p-4">
      <h2 id="input-heading" className="text-lead font-bold">
        Note input
      </h2>
      {ready ? (
        <div className="mt-3 flex flex-wrap gap-4">
          <label className="flex flex-col text-caption font-semibold">
            MIDI device
            <select
              className="mt-1 min-w-56 rounded-md border border-line bg-surface px-2 py-1.5 text-body"
              value={status.selected ?? ''}
              onChange={(e) => input.selectDevice(e.target.value || null)}
            >
              <option value="">None (keyboards only)</option>
              {status.devices.map((d) => (
                <option key={d.id} value={d.id}>
                  {d.name}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col text-caption font-semibold">
            Channel
            <select
              className="mt-1 rounded-md border border-line bg-surface px-2 py-1.5 text-body"
              value={String(input.channel)}
              onChange={(e) => input.setChannel(e.target.value === 'all' ? 'all' : Number(e.target.value))}
            >
              <option value="all">All channels</option>
              {CHANNELS.map((c) => (
                <option key={c} value={c}>
                  {c}
                </option>
              ))}
            </select>
          </label>
        </div>
      ) : null}
      <p
        role="status"
        data-testid="input-status"
        data-state={status.state}
        className={`mt-3 text-body ${problem ? 'text-ember-700 dark:text-ember-100' : 'text-muted'}`}
      >
        {status.state === 'idle' || status.state === 'starting' ? 'Looking for MIDI devices…' : status.message}
      </p>
      <p className="mt-2 text-caption text-muted">
        Computer keyboard: A S D F G H J K L play the white keys from C, W E T Y U O P the black keys; Z and X move an
        octave down and up.
      </p>
    </section>
  );
}
