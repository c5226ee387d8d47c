import { type InstrumentId, instruments, type KeyOrder, type Meter } from '@shared/engine';
import type { ReactNode } from 'react';
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

const field = 'mt-1 rounded-md border border-line bg-surface px-2 py-1.5 text-body';

function Labelled({ label, children }: { label: string; children: ReactNode }) {
  return (
    // biome-ignore lint/a11y/noLabelWithoutControl: the control is the child passed in
    <label className="flex flex-col text-caption font-semibold">
      {label}
      {children}
    </label>
  );
}

function Check({
  label,
  checked,
  onChange,
  disabled,
}: {
  label: string;
  checked: boolean;
  onChange: (v: boolean) => void;
  disabled?: boolean;
}) {
  return (
    <label className="flex items-center gap-2 text-body">
      <input
        type="checkbox"
        className="h-4 w-4 accent-brass-600"
        checked={checked}
        disabled={disabled}
        onChange={(e) => onChange(e.target.checked)}
      />
      {label}
    </label>
  );
}

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
        <Labelled label="Instrument">
          <select
            className={field}
            value={value.instrument}
            onChange={(e) => set('instrument', e.target.value as InstrumentId)}
          >
            {Object.entries(instruments).map(([id, inst]) => (
              <option key={id} value={id}>
                {inst.label}
              </option>
            ))}
          </select>
        </Labelled>
        <Labelled label="Tempo (bpm)">
          <input
            className={`${field} w-24`}
            type="number"
            min={20}
            max={400}
            value={value.tempo}
            onChange={(e) => set('tempo', Math.min(400, Math.max(20, Number(e.target.value) || 20)))}
          />
        </Labelled>
        <Labelled label="Meter">
          <select
            className={field}
            value={value.meter.join('/')}
            onChange={(e) => set('meter', e.target.value.split('/').map(Number) as Meter)}
          >
            {METERS.map((m) => (
              <option key={m.join('/')} value={m.join('/')}>
                {m.join('/')}
              </option>
            ))}
          </select>
        </Labelled>
        <Labelled label="Count-in">
          <select className={field} value={value.countIn} onChange={(e) => set('countIn', Number(e.target.value))}>
            <option value={0}>None</option>
            <option value={1}>1 bar</option>
            <option value={2}>2 bars</option>
          </select>
        </Labelled>
        <Labelled label="Click">
          <select className={field} value={value.click} onChange={(e) => set('click', e.target.value as ClickMode)}>
            <option value="every-beat">Every beat</option>
            <option value="two-and-four">On 2 and 4</option>
            <option value="off">Off</option>
          </select>
        </Labelled>
        <Labelled label={`Swing ${value.swing === 0.5 ? '(straight)' : value.swing.toFixed(2)}`}>
          <input
            className="mt-3 w-32 accent-brass-600"
            type="range"
            min={0.5}
            max={0.75}
            step={0.01}
            value={value.swing}
            onChange={(e) => set('swing', Number(e.target.value))}
          />
        </Labelled>
        <Labelled label="Scoring">
          <select
            className={field}
            value={value.mode}
            onChange={(e) => set('mode', e.target.value as 'timed' | 'free')}
          >
            <option value="timed">Timed (against the click)</option>
            <option value="free">Free (notes in order, any time)</option>
          </select>
        </Labelled>
        <Labelled label="Key cycle order">
          <select className={field} value={value.order} onChange={(e) => set('order', e.target.value as KeyOrder)}>
            <option value="chromatic">Chromatic</option>
            <option value="fourths">In fourths</option>
            <option value="fifths">In fifths</option>
          </select>
        </Labelled>
      </div>
      <div className="flex flex-wrap gap-x-6 gap-y-2">
        <Check label="Chord pad" checked={value.pad} onChange={(v) => set('pad', v)} disabled={!hasChord} />
        <Check label="Any octave counts" checked={value.octaveTolerant} onChange={(v) => set('octaveTolerant', v)} />
        <Check
          label={
            transposing
              ? 'My keyboard plays written pitch'
              : 'My keyboard plays written pitch (this instrument is in concert pitch)'
          }
          checked={value.writtenPitchInput}
          onChange={(v) => set('writtenPitchInput', v)}
          disabled={!transposing}
        />
        <Check label="Loop the drill" checked={value.loop} onChange={(v) => set('loop', v)} />
        <Check label="Run on through the key cycle" checked={value.runOn} onChange={(v) => set('runOn', v)} />
        <Check label="Ladder (memorise measure by measure)" checked={value.ladder} onChange={(v) => set('ladder', v)} />
      </div>
    </fieldset>
  );
}
