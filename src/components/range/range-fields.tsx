import { type InstrumentId, instruments } from '@shared/engine';
import { useEffect, useState } from 'react';
import { TextField } from '@/components/ui/text-field';
import { noteName, parseNoteName } from '@/lib/note-names';

interface Range {
  low: number;
  high: number;
}

/**
 * One end of the range as the player reads it: written pitch for a transposing instrument,
 * with the concert pitch beside. Keeps what is typed until it reads as a note.
 */
function NoteField({
  label,
  concert,
  transposition,
  errors,
  onChange,
  testId,
}: {
  label: string;
  concert: number;
  transposition: number;
  errors?: string[];
  onChange: (concert: number) => void;
  testId: string;
}) {
  const written = concert - transposition;
  const [text, setText] = useState(() => noteName(written));
  const [problem, setProblem] = useState<string | null>(null);
  // A change from outside (another instrument, a saved drill) shows its own name.
  useEffect(() => {
    setText((t) => {
      const parsed = parseNoteName(t);
      return 'midi' in parsed && parsed.midi === written ? t : noteName(written);
    });
    setProblem(null);
  }, [written]);
  const hint =
    transposition === 0 ? `Concert pitch (MIDI ${concert})` : `Sounds ${noteName(concert)} concert (MIDI ${concert})`;
  return (
    <TextField
      className="min-w-0"
      label={label}
      value={text}
      spellCheck={false}
      autoCapitalize="characters"
      autoComplete="off"
      hint={hint}
      data-testid={testId}
      errors={problem ? [problem] : errors}
      onChange={(e) => {
        setText(e.target.value);
        const parsed = parseNoteName(e.target.value);
        if ('error' in parsed) {
          setProblem(parsed.error);
          return;
        }
        setProblem(null);
        onChange(parsed.midi + transposition);
      }}
    />
  );
}

/** The drill's lowest and highest notes, typed as note names in the player's own reading. */
export function RangeFields({
  instrument,
  range,
  onChange,
  lowErrors,
  highErrors,
}: {
  instrument: InstrumentId;
  /** concert MIDI */
  range: Range;
  onChange: (range: Range) => void;
  lowErrors?: string[];
  highErrors?: string[];
}) {
  const { transposition } = instruments[instrument];
  const reading = transposition === 0 ? '' : ', written';
  return (
    <>
      <NoteField
        label={`Lowest note${reading}`}
        concert={range.low}
        transposition={transposition}
        errors={lowErrors}
        testId="range-low"
        onChange={(low) => onChange({ ...range, low })}
      />
      <NoteField
        label={`Highest note${reading}`}
        concert={range.high}
        transposition={transposition}
        errors={highErrors}
        testId="range-high"
        onChange={(high) => onChange({ ...range, high })}
      />
    </>
  );
}
