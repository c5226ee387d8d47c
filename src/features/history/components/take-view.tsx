import { drillMaterial } from '@shared/practice/drill-identity';
import { generateDrill, sliceDrill } from '@shared/engine';
import { useMemo, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { readNotes } from '@/components/review/note-readings';
import { NoteStrip } from '@/components/review/note-strip';
import { ReviewStaff } from '@/components/review/review-staff';
import { SlipList } from '@/components/review/slip-list';
import { Button } from '@/components/ui/button';
import { useMe } from '@/features/auth/api/session';
import type { Playback } from '@/lib/audio/player';
import { takeMidiUrl, useDeleteTake, useTake } from '../api/takes';

/** A stored take: its score on the notation (missed and wrong notes marked), replay, MIDI, delete. */
const PLAYED_ON = {
  midi: 'MIDI device',
  keyboard: 'on-screen or computer keyboard',
  microphone: 'microphone',
  file: 'imported MIDI file',
} as const;

export function TakeView({ id }: { id: string }) {
  const { data, error } = useTake(id);
  const { user } = useMe();
  const remove = useDeleteTake();
  const navigate = useNavigate();
  const [current, setCurrent] = useState<number | null>(null);
  const [chosen, setChosen] = useState<number | null>(null);
  const playback = useRef<Playback | null>(null);
  const take = data?.take;
  const drill = useMemo(() => {
    if (!take) return null;
    const full = generateDrill(take.spec);
    return take.measures ? sliceDrill(full, take.measures[0], take.measures[1]) : full;
  }, [take]);
  const readings = useMemo(() => (take && drill ? readNotes(drill, take) : []), [take, drill]);
  const marks = useMemo(() => new Map((take?.score.results ?? []).map((r, i) => [i, `sf-mark-${r.verdict}`])), [take]);
  if (error) return <p role="alert">{error.message}</p>;
  if (!take || !drill) return <p className="text-muted">Loading the take…</p>;
  const counts: Record<string, number> = {};
  for (const r of take.score.results) counts[r.verdict] = (counts[r.verdict] ?? 0) + 1;
  const replay = async () => {
    playback.current?.stop();
    const { playDrill } = await import('@/lib/audio/player');
    playback.current = await playDrill(drill, {
      countInMeasures: 0,
      onNote: setCurrent,
      onEnd: () => setCurrent(null),
    });
  };
  return (
    <div className="grid gap-4">
      <dl className="flex flex-wrap gap-6">
        {[
          // over a progression the pairs change with the chords: the chords are what was played
          take.spec.changes ? ['Changes', drillMaterial(take.spec)] : ['Pair', take.pair],
          ['Pattern', take.pattern],
          ['Key', take.key],
          ['Tempo', `${take.tempo} bpm`],
          ['Accuracy', `${Math.round(take.accuracy * 100)}%`],
          ['Mean offset', take.meanOffsetMs === null ? '—' : `${Math.round(take.meanOffsetMs)} ms`],
          ...(take.inputKind ? [['Played on', PLAYED_ON[take.inputKind]]] : []),
        ].map(([k, v]) => (
          <div key={k}>
            <dt className="text-caption text-muted">{k}</dt>
            <dd className="font-bold">{v}</dd>
          </div>
        ))}
      </dl>
      <p data-testid="take-verdicts">
        {(['hit', 'early', 'late', 'wrong', 'missed'] as const).map((v) => `${counts[v] ?? 0} ${v}`).join(' · ')}
        {take.stoppedAtMs !== null ? ' · stopped early: later notes not scored' : ''}
      </p>
      <ReviewStaff
        drill={drill}
        marks={marks}
        current={current ?? chosen}
        readings={readings}
        onSelect={setChosen}
        label={`The take's drill, ${counts.missed ?? 0} missed and ${counts.wrong ?? 0} wrong notes marked, the pitch played over each wrong note and a timing tick under each played one; the chosen note is lit`}
      />
      <div className="flex flex-wrap gap-2">
        <Button onClick={() => void replay()}>Replay the drill</Button>
        {current !== null ? (
          <Button variant="quiet" onClick={() => playback.current?.stop()}>
            Stop
          </Button>
        ) : null}
        <a
          href={takeMidiUrl(take.id)}
          download
          className="inline-flex items-center rounded-lg border border-line px-4 py-2 font-semibold hover:border-ink-300"
        >
          Download MIDI
        </a>
        {user?.id === take.playerId ? (
          <Button
            variant="danger"
            disabled={remove.isPending}
            onClick={() => {
              if (window.confirm('Delete this take? Its notes leave the maps too.'))
                remove.mutate(take.id, { onSuccess: () => navigate('/history') });
            }}
          >
            Delete take
          </Button>
        ) : null}
      </div>
      {remove.error ? <p role="alert">{remove.error.message}</p> : null}
      <NoteStrip readings={readings} selected={chosen} onSelect={setChosen} />
      <SlipList
        readings={readings}
        extras={take.score.extras.length}
        meanOffsetMs={take.meanOffsetMs}
        selected={chosen}
        onSelect={setChosen}
        actionLabel="Light it on the staff"
      />
    </div>
  );
}
