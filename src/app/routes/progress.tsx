import { useSearchParams } from 'react-router-dom';
import { TextField } from '@/components/ui/text-field';
import type { MapFilters } from '@/features/maps/api/maps';
import { BeatMap } from '@/features/maps/components/beat-map';
import { KeyMap } from '@/features/maps/components/key-map';
import { PracticeLog } from '@/features/maps/components/practice-log';
import { ProgressCharts } from '@/features/maps/components/progress-charts';
import { RangeMap } from '@/features/maps/components/range-map';
import { WeeklyByDrill } from '@/features/maps/components/weekly-by-drill';

/** The text filters match exactly, so each shows an example of what it takes. */
const FILTER_EXAMPLES = { instrument: 'piano', pattern: 'four-three', pair: 'D/C' } as const;
const FILTER_LABELS = { instrument: 'Instrument', pattern: 'Pattern', pair: 'Pair', from: 'From', to: 'To' } as const;

/** The key, range and beat maps and the charts; filters live in the address. */
export function ProgressRoute() {
  const [params, setParams] = useSearchParams();
  const filters: MapFilters = Object.fromEntries(
    (['instrument', 'pattern', 'pair', 'from', 'to', 'player'] as const)
      .map((k) => [k, params.get(k) ?? undefined])
      .filter(([, v]) => v),
  );
  const set = (k: string, v: string) => {
    const p = new URLSearchParams(params);
    if (v) p.set(k, v);
    else p.delete(k);
    setParams(p, { replace: true });
  };
  return (
    <section className="grid gap-8">
      <header>
        <h1 className="text-display">Progress</h1>
        <p className="mt-2 text-muted">
          On the maps, darker cells mean more notes not hit; a key with no notes yet is hatched, apart from any score.
          Hover or focus a cell or bar for its figures; each map also reads as a table.
        </p>
      </header>
      <form
        className="flex flex-wrap items-start gap-3"
        aria-label="Filter the maps"
        onSubmit={(e) => e.preventDefault()}
      >
        {(['instrument', 'pattern', 'pair'] as const).map((k) => (
          <TextField
            key={k}
            label={FILTER_LABELS[k]}
            className="w-36"
            defaultValue={params.get(k) ?? ''}
            placeholder={FILTER_EXAMPLES[k]}
            onBlur={(e) => set(k, e.target.value.trim())}
          />
        ))}
        {(['from', 'to'] as const).map((k) => (
          <TextField
            key={k}
            label={FILTER_LABELS[k]}
            type="date"
            value={params.get(k) ?? ''}
            onChange={(e) => set(k, e.target.value)}
          />
        ))}
      </form>
      <KeyMap filters={filters} />
      <RangeMap filters={filters} />
      <BeatMap filters={filters} />
      <WeeklyByDrill filters={filters} />
      <ProgressCharts filters={filters} />
      <PracticeLog filters={filters} ownGoal={!filters.player} />
    </section>
  );
}
