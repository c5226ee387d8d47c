import { PRESET_IDS } from '@shared/engine';
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { useImportTake } from '../api/takes';

/** A take recorded in other software: the file, the drill it was played from, the downbeat. */
export function ImportForm() {
  const [progress, setProgress] = useState<number | null>(null);
  const importTake = useImportTake();
  const navigate = useNavigate();
  return (
    <form
      className="grid gap-3 md:grid-cols-3"
      aria-label="Import a MIDI file"
      onSubmit={(e) => {
        e.preventDefault();
        const f = new FormData(e.currentTarget);
        const file = f.get('file');
        if (!(file instanceof File) || file.size === 0) return;
        const offset = String(f.get('offsetMs') ?? '').trim();
        setProgress(0);
        importTake.mutate(
          {
            file,
            spec: {
              pair: [String(f.get('a')), String(f.get('b'))],
              pattern: String(f.get('pattern')) as (typeof PRESET_IDS)[number],
              direction: 'up',
              tempo: Number(f.get('tempo')),
            },
            offsetMs: offset === '' ? undefined : Number(offset),
            onProgress: setProgress,
          },
          { onSuccess: ({ take }) => navigate(`/history/${take.id}`), onSettled: () => setProgress(null) },
        );
      }}
    >
      <label className="grid gap-1 font-semibold md:col-span-3">
        MIDI file (at most 1 MB)
        <input name="file" type="file" accept=".mid,.midi,audio/midi" required />
      </label>
      <label className="grid gap-1 font-semibold">
        First triad
        <input name="a" defaultValue="D" required className="rounded-lg border border-line bg-raised px-2 py-1" />
      </label>
      <label className="grid gap-1 font-semibold">
        Second triad
        <input name="b" defaultValue="C" required className="rounded-lg border border-line bg-raised px-2 py-1" />
      </label>
      <label className="grid gap-1 font-semibold">
        Pattern
        <select name="pattern" defaultValue="four-three" className="rounded-lg border border-line bg-raised px-2 py-1">
          {PRESET_IDS.map((p) => (
            <option key={p}>{p}</option>
          ))}
        </select>
      </label>
      <label className="grid gap-1 font-semibold">
        Tempo
        <input
          name="tempo"
          type="number"
          min={20}
          max={400}
          defaultValue={100}
          className="rounded-lg border border-line bg-raised px-2 py-1"
        />
      </label>
      <label className="grid gap-1 font-semibold md:col-span-2">
        First downbeat at (ms into the file; empty: on the first note)
        <input name="offsetMs" type="number" className="rounded-lg border border-line bg-raised px-2 py-1" />
      </label>
      <div className="flex items-center gap-3 md:col-span-3">
        <Button type="submit" disabled={importTake.isPending}>
          Import and score
        </Button>
        {progress !== null ? <progress max={1} value={progress} aria-label="Upload progress" /> : null}
      </div>
      {importTake.error ? (
        <p role="alert" className="text-ember-700 md:col-span-3 dark:text-ember-100">
          {importTake.error.message}
        </p>
      ) : null}
    </form>
  );
}
