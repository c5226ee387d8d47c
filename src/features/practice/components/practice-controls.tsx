import { type InstrumentId, instruments, type KeyOrder, type Meter } from '@shared/engine';
import { CheckboxField } from '@/components/ui/check-field';
import { NumberField } from '@/components/ui/number-field';
import { RangeField } from '@/components/ui/range-field';
import { SelectField } from '@/components/ui/select-field';
import type { ClickMode } from '../lib/practice-audio';

export interface PracticeOptions {
  instrument: InstrumentId;
  tempo: number;
  meter: Meter;
  countIn: number;
  click: ClickMode;
  swing: number;
  pad: boolean;
  octaveTolerant: boolean;
  mode: 'timed' | 'free';
  writtenPitchInput: boolean;
  loop: boolean;
  runOn: boolean;
  order: KeyOrder;
  ladder: boolean;
}

const METERS: Meter[] = [
  [4, 4],
  [3, 4],
  [5, 4],
  [6, 8],
  [7, 8],
];

const INSTRUMENTS = Object.entries(instruments).map(([id, inst]) => ({ value: id, label: inst.label }));

const opts = (pairs: Array<[string | number, string]>) =>
  pairs.map(([value, label]) => ({ value: String(value), label }));

/** Everything about how the next take runs. Locked while a take is under way. */
export function PracticeControls({
  value,
  onChange,
  disabled,
  hasChord,
}: {
  value: PracticeOptions;
  onChange: (v: PracticeOptions) => void;
  disabled: boolean;
  hasChord: boolean;
}) {
  const set = <K extends keyof PracticeOptions>(k: K, v: PracticeOptions[K]) => onChange({ ...value, [k]: v });
  const transposing = instruments[value.instrument].transposition !== 0;
  return (
    <fieldset disabled={disabled} className="grid gap-4 rounded-card border border-line bg-raised p-4">
      <legend className="px-1 text-lead font-bold">Take settings</legend>
      <div className="flex flex-wrap gap-4">
        <SelectField
          label="Instrument"
          options={INSTRUMENTS}
          value={value.instrument}
          onChange={(e) => set('instrument', e.target.value as InstrumentId)}
        />
        <NumberField
          label="Tempo (bpm)"
          className="w-32"
          min={20}
          max={400}
          value={value.tempo}
          onChange={(e) => set('tempo', Math.min(400, Math.max(20, Number(e.target.value) || 20)))}
        />
        <SelectField
          label="Meter"
          options={METERS.map((m) => ({ value: m.join('/'), label: m.join('/') }))}
          value={value.meter.join('/')}
          onChange={(e) => set('meter', e.target.value.split('/').map(Number) as Meter)}
        />
        <SelectField
          label="Count-in"
          options={opts([
            [0, 'None'],
            [1, '1 bar'],
            [2, '2 bars'],
          ])}
          value={String(value.countIn)}
          onChange={(e) => set('countIn', Number(e.target.value))}
        />
        <SelectField
          label="Click"
          options={opts([
            ['every-beat', 'Every beat'],
            ['two-and-four', 'On 2 and 4'],
            ['off', 'Off'],
          ])}
          value={value.click}
          onChange={(e) => set('click', e.target.value as ClickMode)}
        />
        <RangeField
          label={`Swing ${value.swing === 0.5 ? '(straight)' : value.swing.toFixed(2)}`}
          className="w-32"
          min={0.5}
          max={0.75}
          step={0.01}
          value={value.swing}
          onChange={(e) => set('swing', Number(e.target.value))}
        />
        <SelectField
          label="Scoring"
          options={opts([
            ['timed', 'Timed (against the click)'],
            ['free', 'Free (notes in order, any time)'],
          ])}
          value={value.mode}
          onChange={(e) => set('mode', e.target.value as 'timed' | 'free')}
        />
        <SelectField
          label="Key cycle order"
          options={opts([
            ['chromatic', 'Chromatic'],
            ['fourths', 'In fourths'],
            ['fifths', 'In fifths'],
          ])}
          value={value.order}
          onChange={(e) => set('order', e.target.value as KeyOrder)}
        />
      </div>
      <div className="flex flex-wrap gap-x-6 gap-y-2">
        <CheckboxField
          label="Chord pad"
          checked={value.pad}
          onChange={(e) => set('pad', e.target.checked)}
          disabled={!hasChord}
        />
        <CheckboxField
          label="Any octave counts"
          checked={value.octaveTolerant}
          onChange={(e) => set('octaveTolerant', e.target.checked)}
        />
        <CheckboxField
          label={
            transposing
              ? 'My keyboard plays written pitch'
              : 'My keyboard plays written pitch (this instrument is in concert pitch)'
          }
          checked={value.writtenPitchInput}
          onChange={(e) => set('writtenPitchInput', e.target.checked)}
          disabled={!transposing}
        />
        <CheckboxField label="Loop the drill" checked={value.loop} onChange={(e) => set('loop', e.target.checked)} />
        <CheckboxField
          label="Run on through the key cycle"
          checked={value.runOn}
          onChange={(e) => set('runOn', e.target.checked)}
        />
        <CheckboxField
          label="Ladder (memorise measure by measure)"
          checked={value.ladder}
          onChange={(e) => set('ladder', e.target.checked)}
        />
      </div>
    </fieldset>
  );
}
