import { EngineError, type InstrumentId, inAllKeys, instruments } from '@shared/engine';
import { useMemo, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { SelectField } from '@/components/ui/select-field';
import { useBookEdition } from '@/features/books/api/books';
import { type EditionDrill, PrintEdition } from '@/features/books/components/print-edition';
import { pairTitle } from '@/features/drills/components/written-pair';
import { useSettings } from '@/features/practice/api/settings';

const INSTRUMENTS = (Object.keys(instruments) as InstrumentId[]).map((id) => ({
  value: id,
  label: instruments[id].label,
}));

/** /books/:id/print: the printable edition, every drill in all 12 keys, for the chosen instrument. */
export function BookPrintRoute() {
  const { id = '' } = useParams();
  const { data, isPending, error } = useBookEdition(id);
  const settings = useSettings();
  const [chosen, setChosen] = useState<InstrumentId | ''>('');
  const instrument: InstrumentId = chosen || settings.data?.settings.instrument || 'piano';
  const built = useMemo(() => {
    if (!data) return null;
    try {
      const drills: EditionDrill[] = data.drills.map((d) => ({
        id: d.id,
        title: d.title,
        note: d.note,
        cycle: inAllKeys({ ...d.spec, instrument, range: undefined, start: undefined }, d.keyCycle ?? 'chromatic'),
      }));
      return { drills };
    } catch (err) {
      if (err instanceof EngineError) return { error: err.message };
      throw err;
    }
  }, [data, instrument]);
  if (isPending) return <p className="text-muted">Loading the book…</p>;
  if (error)
    return (
      <p role="alert">
        {error.message.includes('not found') ? 'The printable edition is for the book’s buyers.' : error.message}
      </p>
    );
  return (
    <div className="grid gap-4">
      <div className="no-print flex flex-wrap items-end justify-between gap-3">
        <Link to={`/books/${id}`} className="font-semibold underline">
          ← Back to the book
        </Link>
        <SelectField
          label="Instrument (written pitch)"
          value={instrument}
          onChange={(e) => setChosen(e.target.value as InstrumentId)}
          options={INSTRUMENTS}
          className="w-64"
        />
      </div>
      {built?.error ? <p role="alert">{built.error}</p> : null}
      {built?.drills ? (
        <PrintEdition key={instrument} book={data.book} drills={built.drills} titleOf={pairTitle} />
      ) : null}
    </div>
  );
}
