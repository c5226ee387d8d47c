import { type Drill, generateDrill, sliceDrill } from '@shared/engine';
import type { Take } from '@shared/schemas/takes';
import { useMemo, useState } from 'react';
import type { NoteMarks } from '@/components/notation/drill-staff';
import { readNotes } from '@/components/review/note-readings';
import { NoteStrip } from '@/components/review/note-strip';
import { ReviewStaff } from '@/components/review/review-staff';
import { SlipList } from '@/components/review/slip-list';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { useCreateRemark, useRemarks } from '../api/remarks';
import { useTake } from '../api/take';
import { useTakeReplay } from '../hooks/use-take-replay';
import { noteLabel, RemarkThread } from './remark-thread';
import { pct } from './status-badge';
import './take-review.css';
import { formatDateTime } from '@/lib/format-date';

function drillOf(take: Take): Drill | null {
  try {
    const full = generateDrill(take.spec);
    return take.measures ? sliceDrill(full, take.measures[0], take.measures[1]) : full;
  } catch {
    return null;
  }
}

function RemarkForm({
  take,
  drill,
  pin,
  setPin,
}: {
  take: Take;
  drill: Drill;
  pin: string;
  setPin: (pin: string) => void;
}) {
  const create = useCreateRemark(take.id);
  const form = useSchemaForm(() => import('@shared/schemas/remarks').then((m) => m.CreateRemarkInput), {
    defaultValues: { body: '' },
  });
  const body = form.watch('body') ?? '';
  const options = [
    { value: '', label: 'Not pinned: the whole take' },
    ...take.score.results.map((r, i) => ({ value: String(i), label: `${noteLabel(drill.notes, i)}: ${r.verdict}` })),
  ];
  // The pin comes from the staff, the strip or the list as well as this form's own field.
  const onSubmit = form.handleSubmit((input) =>
    create.mutate(
      { ...input, noteIndex: pin === '' ? null : Number(pin) },
      { onSuccess: () => form.reset({ body: '' }), onError: form.fromError },
    ),
  );
  return (
    <form onSubmit={onSubmit} className="grid gap-3" aria-label="Leave a remark">
      <SelectField
        id="sf-pin-note"
        label="Pin to a note (or choose one above)"
        value={pin}
        onChange={(e) => setPin(e.target.value)}
        options={options}
        errors={form.errorsOf('noteIndex')}
      />
      <TextAreaField
        id="sf-remark-body"
        label="Remark"
        rows={3}
        errors={form.errorsOf('body')}
        {...form.register('body')}
      />
      <div>
        <Button type="submit" disabled={create.isPending || !body.trim()}>
          Leave the remark
        </Button>
      </div>
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
    </form>
  );
}

/**
 * One take: the staff with each note's verdict and the notes remarks are pinned to, replay
 * against the drill, the MIDI file, and the remarks (the teacher writes, the player answers).
 */
export function TakeReview({ takeId, viewerId }: { takeId: string; viewerId: string }) {
  const { data, isPending, error } = useTake(takeId);
  const remarks = useRemarks(takeId);
  const take = data?.take;
  const drill = useMemo(() => (take ? drillOf(take) : null), [take]);
  const replay = useTakeReplay(drill, take?.played ?? []);
  const readings = useMemo(() => (take && drill ? readNotes(drill, take) : []), [take, drill]);
  const [chosen, setChosen] = useState<number | null | undefined>(undefined);
  const pinnedNotes = useMemo(
    () => new Set((remarks.data?.remarks ?? []).flatMap((r) => (r.noteIndex === null ? [] : [r.noteIndex]))),
    [remarks.data],
  );
  const marks: NoteMarks = useMemo(() => {
    const m = new Map<number, string>();
    for (const [i, r] of (take?.score.results ?? []).entries()) m.set(i, `sf-mark-${r.verdict}`);
    for (const r of remarks.data?.remarks ?? []) {
      if (r.noteIndex !== null) m.set(r.noteIndex, `${m.get(r.noteIndex) ?? ''} sf-pinned`.trim());
    }
    return m;
  }, [take, remarks.data]);
  if (isPending) return <p className="text-muted">Loading the take…</p>;
  if (error) return <FormMessage tone="error">{error.message}</FormMessage>;
  if (!take) return null;
  const mine = take.playerId === viewerId;
  // Until someone chooses, the teacher's remark is pinned to the first slip.
  const firstSlip = readings.find((r) => r.verdict !== 'hit')?.index ?? null;
  const selected = chosen === undefined ? (mine ? null : firstSlip) : chosen;
  const choose = (i: number) => setChosen(i);
  const counts: Record<string, number> = {};
  for (const r of take.score.results) counts[r.verdict] = (counts[r.verdict] ?? 0) + 1;
  return (
    <div className="grid gap-5">
      <header>
        <h1 className="text-title">
          {take.pair} · {take.pattern} · {take.key}
        </h1>
        <p className="text-muted">
          {formatDateTime(take.startedAt)} · {take.tempo} bpm · accuracy {pct(take.accuracy)} ·{' '}
          {Object.entries(counts)
            .map(([v, n]) => `${n} ${v}`)
            .join(', ')}
        </p>
      </header>
      {drill ? (
        <ReviewStaff
          drill={drill}
          marks={marks}
          current={selected}
          readings={readings}
          onSelect={choose}
          label={`The take's drill with each note's verdict, the pitch played over each wrong note and a timing tick under each played one; pinned notes are ringed; the chosen note is lit`}
        />
      ) : (
        <FormMessage tone="error">This take's drill could not be rebuilt.</FormMessage>
      )}
      <div className="flex flex-wrap gap-3">
        <Button variant="quiet" onClick={() => (replay.playing ? replay.stop() : void replay.play())} disabled={!drill}>
          {replay.playing ? 'Stop' : 'Replay over the drill'}
        </Button>
        <a
          href={`/api/takes/${take.id}/midi`}
          download
          className="inline-flex items-center rounded-lg border border-line bg-raised px-4 py-2 font-semibold hover:border-ink-300"
        >
          Download MIDI
        </a>
      </div>
      {drill ? (
        <>
          <NoteStrip readings={readings} selected={selected} onSelect={choose} pinned={pinnedNotes} />
          <SlipList
            readings={readings}
            extras={take.score.extras.length}
            meanOffsetMs={take.score.meanOffsetMs}
            selected={selected}
            onSelect={choose}
            actionLabel={mine ? 'Show remarks here' : 'Pin a remark here'}
          />
        </>
      ) : null}
      <section className="grid gap-3" aria-labelledby="remarks-heading">
        <h2 id="remarks-heading" className="text-lead font-bold">
          Remarks
        </h2>
        {remarks.data && drill ? (
          <RemarkThread
            takeId={take.id}
            remarks={remarks.data.remarks}
            notes={drill.notes}
            canAnswer={mine}
            highlight={selected}
          />
        ) : null}
        {!mine && drill ? (
          <RemarkForm
            take={take}
            drill={drill}
            pin={selected === null ? '' : String(selected)}
            setPin={(v) => setChosen(v === '' ? null : Number(v))}
          />
        ) : null}
      </section>
    </div>
  );
}
