import { instruments } from '@shared/engine';
import { drillKey } from '@shared/practice/drill-identity';
import type { PatternDef } from '@shared/schemas/drills';
import { useEffect, useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { DrillStaff } from '@/components/notation/drill-staff';
import { aChromasOf } from '@/components/notation/triad-of';
import { FormMessage } from '@/components/ui/form-message';
import { useCustomPatterns, useSaveCustomPattern } from '@/features/drills/api/custom-patterns';
import { AudioPreview } from '@/features/drills/components/audio-preview';
import { DrillDownloads } from '@/features/drills/components/drill-downloads';
import { DrillSettings } from '@/features/drills/components/drill-settings';
import { FitFinder } from '@/features/drills/components/fit-finder';
import { KeyCycleNav } from '@/features/drills/components/key-cycle-nav';
import { PatternForm } from '@/features/drills/components/pattern-form';
import { RangeView } from '@/features/drills/components/range-view';
import { SavedDrillsPanel } from '@/features/drills/components/saved-drills-panel';
import { ProgressionEditor, progressionTitle } from '@/features/drills/components/progression-editor';
import { pairTitle } from '@/features/drills/components/written-pair';
import { specFromParams, specToParams } from '@/features/drills/hooks/spec-params';
import { DEFAULT_DRAFT, draftFromSpec, useDrillDraft } from '@/features/drills/hooks/use-drill-draft';
import { useMe } from '@/features/auth/api/session';
import { useSettings } from '@/features/practice/api/settings';

/** Build a drill: find a pair for a chord, choose how it moves, see and hear it in all 12 keys. */
export function DrillsRoute() {
  const [params, setParams] = useSearchParams();
  const [initial] = useState(() => {
    const { spec, order } = specFromParams(params);
    return spec ? draftFromSpec(spec, order) : DEFAULT_DRAFT;
  });
  const { form, draft, update, setDraft, spec, fields, cycle, cycleError } = useDrillDraft(initial);
  const [keyIndex, setKeyIndex] = useState(0);
  // A fresh page starts on the player's own instrument; a drill in the address keeps its own.
  const settings = useSettings();
  const [startedFromSettings, setStartedFromSettings] = useState(() => specFromParams(params).spec !== null);
  useEffect(() => {
    if (startedFromSettings || !settings.data) return;
    setStartedFromSettings(true);
    update({ instrument: settings.data.settings.instrument });
  }, [startedFromSettings, settings.data, update]);
  const { user } = useMe();
  const canPractise = user?.role === 'player';
  const [playing, setPlaying] = useState<number | null>(null);
  const patterns = useCustomPatterns();
  const savePattern = useSaveCustomPattern();
  const [patternSaved, setPatternSaved] = useState<string | null>(null);

  const index = Math.min(keyIndex, Math.max(0, cycle.length - 1));
  const drill = cycle[index];
  const aChromas = useMemo(() => (drill ? aChromasOf(drill) : new Set<number>()), [drill]);
  const problems = Object.entries(fields);

  // Keep the address in step with the drill, so it can be reloaded, shared and printed.
  useEffect(() => {
    if (spec && problems.length === 0) setParams(specToParams(spec, draft.order), { replace: true });
  }, [spec, draft.order, problems.length, setParams]);

  const printHref = spec ? `/drills/print?${specToParams(spec, draft.order).toString()}` : '/drills/print';
  const customDef: PatternDef | null = typeof draft.pattern === 'string' ? null : draft.pattern;

  return (
    <div className="grid gap-8">
      <header>
        <h1 className="text-title">Drills</h1>
        <p className="mt-1 max-w-prose text-muted">
          Type a chord to find pairs that fit it, or name two triads yourself; choose a pattern and your instrument,
          then read, hear and take the drill through the key cycle.
        </p>
      </header>

      <div className="grid items-start gap-8 lg:grid-cols-[2fr_3fr]">
        <FitFinder
          initialChord={draft.chord}
          onPick={(fit, chord) => {
            update({ pair: [fit.pair.a.symbol, fit.pair.b.symbol], chord });
            setKeyIndex(0);
          }}
        />
        <DrillSettings
          form={form}
          draft={draft}
          update={update}
          fields={fields}
          savedPatterns={patterns.data?.patterns ?? []}
        />
      </div>

      <ProgressionEditor form={form} draft={draft} update={update} drill={cycle[0]} fields={fields} />

      {customDef ? (
        <PatternForm
          def={customDef}
          onChange={(def) => update({ pattern: def })}
          errors={fields}
          drill={drill}
          saving={savePattern.isPending}
          onSave={() =>
            savePattern.mutate(
              { name: customDef.name, def: customDef },
              {
                onSuccess: ({ pattern }) => setPatternSaved(`Saved the pattern “${pattern.name}”.`),
                onError: (err) => setPatternSaved(`Not saved: ${err.message}`),
              },
            )
          }
        />
      ) : null}
      {patternSaved ? <FormMessage tone="info">{patternSaved}</FormMessage> : null}

      <section
        aria-labelledby="notation-heading"
        className="grid gap-4 rounded-card border border-line bg-raised p-4 sm:p-6"
      >
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="notation-heading" className="text-lead font-bold" data-testid="drill-title">
            {drill
              ? `Key ${index + 1} of ${cycle.length}: ${drill.changes ? progressionTitle(drill) : pairTitle(drill)}`
              : 'No drill yet'}
          </h2>
          <p className="text-caption text-muted">{instruments[draft.instrument].label}, written pitch</p>
        </div>
        {problems.length > 0 ? (
          <div
            role="alert"
            className="rounded-lg border border-ember-500 bg-ember-100 px-3 py-2 text-ember-700"
            data-testid="drill-problem"
          >
            <p className="font-semibold">This drill can't be built yet:</p>
            <ul className="list-disc pl-5">
              {problems.map(([field, messages]) => (
                <li key={field}>{messages.join(' ')}</li>
              ))}
            </ul>
          </div>
        ) : null}
        {cycleError ? <FormMessage tone="info">Only this key can be built: {cycleError}</FormMessage> : null}
        {drill ? (
          <>
            <KeyCycleNav cycle={cycle} index={index} onChange={setKeyIndex} />
            <DrillStaff drill={drill} current={playing} lengthNotice />
            <RangeView drill={drill} aChromas={aChromas} />
          </>
        ) : null}
      </section>

      {drill ? (
        <div className="grid gap-8 md:grid-cols-2">
          <div className="grid content-start gap-8">
            <AudioPreview drill={drill} onNote={setPlaying} />
            {canPractise && spec ? (
              <Link
                to={`/practice?${new URLSearchParams({ spec: JSON.stringify(spec), order: draft.order, key: drillKey(drill.spec) }).toString()}`}
                className="inline-flex w-fit items-center rounded-lg bg-ink-800 px-5 py-2.5 font-semibold text-white hover:bg-ink-700 dark:bg-brass-300 dark:text-ink-950"
              >
                Practise this drill
              </Link>
            ) : null}
            <DrillDownloads drill={drill} printHref={printHref} />
          </div>
          <SavedDrillsPanel
            canPractise={canPractise}
            spec={spec}
            order={draft.order}
            onOpen={(saved) => {
              setDraft(draftFromSpec(saved.spec, saved.keyOrder ?? 'chromatic'));
              setKeyIndex(0);
            }}
          />
        </div>
      ) : (
        <p className="text-muted">
          Fix the drill above, or{' '}
          <Link to="/drills" reloadDocument className="underline">
            start again from D/C over D7
          </Link>
          .
        </p>
      )}
    </div>
  );
}
