import { drillMaterial } from '@shared/practice/drill-identity';
import { type Drill, instruments, presets } from '@shared/engine';
import type { KeyOrder } from '@shared/schemas/drills';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { DrillStaff } from '@/components/notation/drill-staff';
import { pairTitle } from './written-pair';
import '@/components/print/print-pages.css';

const ORDER_LABEL: Record<KeyOrder, string> = {
  chromatic: 'chromatic, up a half step',
  fourths: 'in fourths',
  fifths: 'in fifths',
};
const PAGE_WIDTH = 700;

/**
 * The key cycle as printable pages: Sixfold's header, then each key's staff in written pitch.
 * Staves are drawn one after another with a progress bar, then the browser prints them.
 */
export function PrintCycle({ cycle, order }: { cycle: Drill[]; order: KeyOrder }) {
  const [done, setDone] = useState(0);
  const first = cycle[0];
  const { pattern, tempo, meter, chord, instrument, direction } = first.spec;
  const inst = instruments[instrument];
  const patternName = typeof pattern === 'string' ? presets[pattern].name : pattern.name;
  const ready = done >= cycle.length;
  return (
    <article className="sf-print grid gap-6" aria-label="Printable key cycle">
      <div className="no-print flex flex-wrap items-center gap-3 rounded-card border border-line bg-raised p-4">
        <div className="grid flex-1 gap-1">
          <label htmlFor="cycle-progress" className="text-body font-semibold">
            {ready ? 'All 12 keys are drawn.' : `Drawing the key cycle: ${done} of ${cycle.length}`}
          </label>
          <progress id="cycle-progress" max={cycle.length} value={done} className="h-2 w-full accent-brass-500" />
        </div>
        <Button onClick={() => window.print()} disabled={!ready}>
          Print
        </Button>
      </div>
      <header className="sf-print-header border-b-2 border-text pb-3">
        <p className="text-caption font-bold uppercase tracking-[0.2em] text-muted">Sixfold · key cycle</p>
        <h1 className="text-title">
          {first.changes ? `Over ${drillMaterial(first.spec)}` : first.spec.pair.join(' / ')} · {patternName}
        </h1>
        <dl className="mt-2 grid grid-cols-2 gap-x-6 gap-y-1 text-caption sm:grid-cols-3">
          <div>
            <dt className="inline font-bold">Instrument </dt>
            <dd className="inline">{inst.label}, written pitch</dd>
          </div>
          <div>
            <dt className="inline font-bold">Order </dt>
            <dd className="inline">{ORDER_LABEL[order]}</dd>
          </div>
          <div>
            <dt className="inline font-bold">Tempo </dt>
            <dd className="inline">
              {tempo} quarter notes a minute, {meter[0]}/{meter[1]}
            </dd>
          </div>
          <div>
            <dt className="inline font-bold">Direction </dt>
            <dd className="inline">{direction === 'up-down' ? 'up, then down' : direction}</dd>
          </div>
          {chord ? (
            <div>
              <dt className="inline font-bold">Over </dt>
              <dd className="inline">{chord} (moves with the key)</dd>
            </div>
          ) : null}
          <div>
            <dt className="inline font-bold">Marks </dt>
            <dd className="inline">a boxed “a” or “b” over the notes: the triad they come from</dd>
          </div>
        </dl>
      </header>
      {cycle.map((drill, i) =>
        i <= done ? (
          <section
            key={`${drill.spec.pair.join('/')}-${i}`}
            className="sf-print-key"
            aria-label={`Key ${i + 1} of ${cycle.length}`}
            data-testid="print-key"
          >
            <h2 className="font-bold">
              {i + 1}. {pairTitle(drill)}
              {drill.spec.chord ? <span className="font-normal text-muted"> over {drill.spec.chord}</span> : null}
            </h2>
            <DrillStaff
              drill={drill}
              width={PAGE_WIDTH}
              lengthNotice
              onRendered={() => setDone((d) => Math.max(d, i + 1))}
            />
          </section>
        ) : null,
      )}
    </article>
  );
}
