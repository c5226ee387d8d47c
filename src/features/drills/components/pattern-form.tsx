import type { Drill } from '@shared/engine';
import type { PatternDef, TriadCell } from '@shared/schemas/drills';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';

const opts = (xs: ReadonlyArray<readonly [string, string]>) => xs.map(([value, label]) => ({ value, label }));
const SUBDIVISIONS = opts([
  ['eighth', 'Eighths'],
  ['triplet', 'Triplet eighths'],
  ['sixteenth', 'Sixteenths'],
]);
const ENTRIES = opts([
  ['start', 'at the start note'],
  ['above', 'closest tone above'],
  ['below', 'closest tone below'],
  ['same-position', 'same position as the last cell'],
  ['next-position', 'next position up'],
]);

export const NEW_TRIAD_PATTERN: PatternDef = {
  name: 'My pattern',
  subdivision: 'eighth',
  source: 'triads',
  cells: [
    { triad: 'a', notes: 4, shape: 'line', motion: 'up', entry: 'start' },
    { triad: 'b', notes: 4, shape: 'line', motion: 'down', entry: 'above' },
  ],
};

const NEW_SCALE_PATTERN: PatternDef = {
  name: 'My pattern',
  subdivision: 'eighth',
  source: 'scale',
  degrees: [0, 1, 2, 3],
  step: 1,
};

/** The first notes of the drill, cell by cell, in written pitch: the pattern's live preview. */
function firstCells(drill: Drill | undefined): string {
  if (!drill) return '';
  const cells: string[][] = [];
  for (const n of drill.notes) {
    if (n.cell > 3) break;
    cells[n.cell] = [...(cells[n.cell] ?? []), n.written];
  }
  return cells.map((c) => c.join(' ')).join(' | ');
}

/**
 * A pattern built field by field from PatternDef: triad cells (triad, notes, shape, motion,
 * entry) or six-note scale degrees and a step. Every change redraws the drill at once.
 */
export function PatternForm({
  def,
  onChange,
  errors,
  drill,
  onSave,
  saving,
}: {
  def: PatternDef;
  onChange: (def: PatternDef) => void;
  errors: Record<string, string[]>;
  drill?: Drill;
  onSave?: () => void;
  saving?: boolean;
}) {
  const err = (k: string) => errors[`pattern.${k}`];
  const setCell = (i: number, patch: Partial<TriadCell>) => {
    if (def.source !== 'triads') return;
    onChange({ ...def, cells: def.cells.map((c, j) => (j === i ? { ...c, ...patch } : c)) });
  };
  return (
    <fieldset className="grid gap-3 rounded-lg border border-line p-4">
      <legend className="px-1 font-bold">Custom pattern</legend>
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField
          label="Pattern name"
          value={def.name}
          errors={err('name')}
          onChange={(e) => onChange({ ...def, name: e.target.value })}
        />
        <SelectField
          label="Moves in"
          value={def.subdivision}
          options={SUBDIVISIONS}
          onChange={(e) => onChange({ ...def, subdivision: e.target.value as PatternDef['subdivision'] })}
        />
        <SelectField
          label="Built from"
          value={def.source}
          options={opts([
            ['triads', 'the two triads, cell by cell'],
            ['scale', 'the six-note scale, by degrees'],
          ])}
          onChange={(e) =>
            onChange(
              e.target.value === 'scale'
                ? { ...NEW_SCALE_PATTERN, name: def.name, subdivision: def.subdivision }
                : { ...NEW_TRIAD_PATTERN, name: def.name, subdivision: def.subdivision },
            )
          }
        />
      </div>
      {def.source === 'triads' ? (
        <ol className="grid gap-2" aria-label="Cells">
          {def.cells.map((c, i) => (
            <li key={i} className="grid grid-cols-2 items-end gap-2 rounded-lg bg-surface p-2 sm:grid-cols-6">
              <span className="self-center text-caption font-bold text-muted">Cell {i + 1}</span>
              <SelectField
                label="Triad"
                value={c.triad}
                options={opts([
                  ['a', 'a'],
                  ['b', 'b'],
                ])}
                onChange={(e) => setCell(i, { triad: e.target.value as 'a' | 'b' })}
              />
              <SelectField
                label="Notes"
                value={String(c.notes)}
                options={opts([
                  ['3', '3'],
                  ['4', '4'],
                ])}
                onChange={(e) => setCell(i, { notes: Number(e.target.value) as 3 | 4 })}
              />
              <SelectField
                label="Shape"
                value={c.shape}
                options={opts([
                  ['line', 'line'],
                  ['leap', 'leap'],
                ])}
                onChange={(e) => setCell(i, { shape: e.target.value as 'line' | 'leap' })}
              />
              <SelectField
                label="Motion"
                value={c.motion}
                options={opts([
                  ['up', 'up'],
                  ['down', 'down'],
                ])}
                onChange={(e) => setCell(i, { motion: e.target.value as 'up' | 'down' })}
              />
              <SelectField
                label="Enters"
                value={c.entry}
                options={ENTRIES}
                errors={err(`cells.${i}`)}
                onChange={(e) => setCell(i, { entry: e.target.value as TriadCell['entry'] })}
              />
              {def.cells.length > 1 ? (
                <Button
                  variant="quiet"
                  className="col-span-2 sm:col-span-6 sm:justify-self-end"
                  onClick={() => onChange({ ...def, cells: def.cells.filter((_, j) => j !== i) })}
                >
                  Remove cell {i + 1}
                </Button>
              ) : null}
            </li>
          ))}
          {def.cells.length < 32 ? (
            <li>
              <Button
                variant="quiet"
                onClick={() => {
                  const last = def.cells[def.cells.length - 1];
                  onChange({
                    ...def,
                    cells: [...def.cells, { ...last, triad: last.triad === 'a' ? 'b' : 'a', entry: 'above' }],
                  });
                }}
              >
                Add a cell
              </Button>
            </li>
          ) : null}
        </ol>
      ) : (
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            label="Degrees in each cell"
            hint="Steps of the six-note scale from the cell's first note, e.g. 0, 1, 2, 4"
            defaultValue={def.degrees.join(', ')}
            errors={err('degrees')}
            onChange={(e) => {
              const degrees = e.target.value
                .split(/[\s,]+/)
                .filter(Boolean)
                .map(Number);
              onChange({ ...def, degrees });
            }}
          />
          <TextField
            label="Step per cell"
            type="number"
            value={String(def.step)}
            errors={err('step')}
            onChange={(e) => onChange({ ...def, step: Number(e.target.value) })}
          />
        </div>
      )}
      <p className="text-caption text-muted" aria-live="polite">
        <span className="font-semibold">First cells, written: </span>
        <span data-testid="pattern-preview">{firstCells(drill) || '—'}</span>
      </p>
      {onSave ? (
        <Button variant="quiet" className="justify-self-start" onClick={onSave} disabled={saving}>
          {saving ? 'Saving…' : 'Save this pattern'}
        </Button>
      ) : null}
    </fieldset>
  );
}
