import { useEffect, useState } from 'react';
import { CheckboxField } from '@/components/ui/check-field';
import { RangeField } from '@/components/ui/range-field';
import { SelectField } from '@/components/ui/select-field';
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
        <RangeField
          label="Volume"
          className="w-40"
          min={-40}
          max={0}
          step={1}
          value={value.volumeDb}
          onChange={(e) => onChange({ ...value, volumeDb: Number(e.target.value) })}
          aria-valuetext={`${value.volumeDb} dB`}
        />
        <CheckboxField
          label="Mute"
          checked={value.muted}
          onChange={(e) => onChange({ ...value, muted: e.target.checked })}
        />
        <SelectField
          label="Sound from"
          value={value.outputId ?? ''}
          onChange={(e) => onChange({ ...value, outputId: e.target.value || null })}
          options={[
            { value: '', label: "Sixfold's synth" },
            ...outputs.map((o) => ({ value: o.id, label: `MIDI out: ${o.name}` })),
          ]}
        />
      </div>
    </fieldset>
  );
}
