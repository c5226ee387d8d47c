import { type Drill, instruments } from '@shared/engine';
import type { Book } from '@shared/schemas/books';
import { useState } from 'react';
import { DrillStaff } from '@/components/notation/drill-staff';
import { Button } from '@/components/ui/button';
import '@/components/print/print-pages.css';

const PAGE_WIDTH = 700;

export interface EditionDrill {
  id: string;
  title: string;
  note: string;
  /** the drill in all 12 keys, in the book's order, for the chosen instrument */
  cycle: Drill[];
}

/**
 * The printable edition: the book's title page, then each drill in all twelve keys in written
 * pitch. Staves are drawn one after another under one progress bar, then the browser prints.
 */
export function PrintEdition({
  book,
  drills,
  titleOf,
}: {
  book: Book;
  drills: EditionDrill[];
  titleOf: (drill: Drill) => string;
}) {
  const [done, setDone] = useState(0);
  const flat = drills.flatMap((d) => d.cycle.map((drill, k) => ({ owner: d.id, drill, k })));
  const total = flat.length;
  const ready = done >= total;
  const instrument = drills[0]?.cycle[0]?.spec.instrument;
  let index = -1;
  return (
    <article className="sf-print grid gap-6" aria-label="Printable edition">
      <div className="no-print flex flex-wrap items-center gap-3 rounded-card border border-line bg-raised p-4">
        <div className="grid flex-1 gap-1">
          <label htmlFor="edition-progress" className="text-body font-semibold">
            {ready ? `All ${total} staves are drawn.` : `Drawing the edition: ${done} of ${total} staves`}
          </label>
          <progress id="edition-progress" max={total} value={done} className="h-2 w-full accent-brass-500" />
        </div>
        <Button onClick={() => window.print()} disabled={!ready}>
          Print
        </Button>
      </div>
      <header className="border-b-2 border-text pb-3">
        <p className="text-caption font-bold uppercase tracking-[0.2em] text-muted">Sixfold · drill book</p>
        <h1 className="text-display">{book.title}</h1>
        <p className="text-lead">{book.teacher.name}</p>
        {book.description ? <p className="mt-2">{book.description}</p> : null}
        {instrument ? (
          <p className="mt-2 text-caption">
            Written pitch for {instruments[instrument].label}; every drill in all 12 keys.
          </p>
        ) : null}
      </header>
      {drills.map((d, n) => (
        <section key={d.id} className="sf-print-drill grid gap-4" aria-label={d.title}>
          <div>
            <h2 className="text-title">
              {n + 1}. {d.title}
            </h2>
            {d.note ? <p className="italic">{d.note}</p> : null}
          </div>
          {d.cycle.map((drill, k) => {
            index += 1;
            const i = index;
            return i <= done ? (
              <div key={`${d.id}-${k}`} className="sf-print-key" data-testid="edition-key">
                <h3 className="font-bold">
                  {titleOf(drill)}
                  {drill.spec.chord ? <span className="font-normal text-muted"> over {drill.spec.chord}</span> : null}
                </h3>
                <DrillStaff
                  drill={drill}
                  width={PAGE_WIDTH}
                  lengthNotice
                  onRendered={() => setDone((x) => Math.max(x, i + 1))}
                />
              </div>
            ) : null;
          })}
        </section>
      ))}
    </article>
  );
}
