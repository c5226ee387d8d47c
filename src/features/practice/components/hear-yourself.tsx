import { useEffect, useState } from 'react';
import { listOutputs } from '@/lib/midi-output';

export interface HearSettings {
  volumeDb: number;
  muted: boolean;
  /** a MIDI output id to send the played notes to instead of the synth */
  outputId: string | null;
}

/** Volume, mute and where the played notes sound: the built-in synth or a MIDI output. */
export function HearYourself({ value, onChange }: { value: HearSettings; onChange: (v: HearSettings) => void }) {
  const [outputs, setOutputs] = useState(listOutputs);
  useEffect(() => {
    const t = setInterval(() => setOutputs(listOutputs()), 3000);
    return () => clearInterval(t);
  }, []);
  return (
    <fieldset className="rounded-card border border-line bg-raised p-4">
      <legend className="px-1 text-lead font-bold">Hear yourself</legend>
      <div className="flex flex-wrap items-end gap-4">
        <label className="flex flex-col text-caption font-semibold">
          Volume
          <input
            type="range"
            min={-40}
            max={0}
            step={1}
            value={value.volumeDb}
            onChange={(e) => onChange({ ...value, volumeDb: Number(e.target.value) })}
            className="mt-2 w-40 accent-brass-600"
            aria-valuetext={`${value.volumeDb} dB`}
          />
        </label>
        <label className="flex items-center gap-2 text-body">
          <input
            type="checkbox"
            checked={value.muted}
            onChange={(e) => onChange({ ...value, muted: e.target.checked })}
            className="h-4 w-4 accent-brass-600"
          />
          Mute
        </label>
        <label className="flex flex-col text-caption font-semibold">
          Sound from
          <select
            className="mt-1 rounded-md border border-line bg-surface px-2 py-1.5 text-body"
            value={value.outputId ?? ''}
            onChange={(e) => onChange({ ...value, outputId: e.target.value || null })}
          >
            <option value="">Sixfold's synth</option>
            {outputs.map((o) => (
              <option key={o.id} value={o.id}>
                MIDI out: {o.name}
              </option>
            ))}
          </select>
        </label>
      </div>
    </fieldset>
  );
}
