import type { ColumnDef } from '@tanstack/react-table';
import { useEffect, useState } from 'react';
import { InputPanel } from '@/components/midi/input-panel';
import { DataTable } from '@/components/ui/data-table';
import { KeyboardDiagram, type KeyMark, keyLabel } from '@/components/midi/keyboard-diagram';
import { useNoteInput } from '@/hooks/use-note-input';
import type { NoteEvent } from '@/lib/midi-input';

const HELD: KeyMark = { className: 'fill-brass-300', label: 'held' };

const columns: ColumnDef<NoteEvent>[] = [
  { id: 'event', header: 'Event', cell: ({ row }) => (row.original.type === 'on' ? 'on' : 'off') },
  { id: 'note', header: 'Note', cell: ({ row }) => keyLabel(row.original.midi) },
  { id: 'velocity', header: 'Velocity', accessorKey: 'velocity', meta: { numeric: true } },
  { id: 'time', header: 'Time (ms)', cell: ({ row }) => row.original.timeStamp.toFixed(1), meta: { numeric: true } },
  {
    id: 'from',
    header: 'From',
    cell: ({ row: { original: e } }) =>
      e.source === 'midi' ? 'MIDI' : e.source === 'screen' ? 'screen' : 'computer keys',
  },
];

/** A sound check before practice: which input is live, and what arrives from it. */
export function InputCheckRoute() {
  const { input, status } = useNoteInput();
  const [events, setEvents] = useState<NoteEvent[]>([]);
  const [held, setHeld] = useState<Map<number, KeyMark>>(new Map());

  useEffect(
    () =>
      input.onNote((e) => {
        setEvents((prev) => [e, ...prev].slice(0, 12));
        setHeld((prev) => {
          const next = new Map(prev);
          if (e.type === 'on') next.set(e.midi, HELD);
          else next.delete(e.midi);
          return next;
        });
      }),
    [input],
  );

  return (
    // One column no wider than the screen: the keyboard scrolls inside its own frame, the page never sideways.
    <div className="grid grid-cols-1 gap-6">
      <header>
        <h1 className="text-title">Input check</h1>
        <p className="mt-1 text-muted">
          Play a few notes: each one should appear below with its velocity and the moment it was played.
        </p>
      </header>
      <InputPanel input={input} status={status} />
      <div className="rounded-card border border-line bg-raised p-4">
        <KeyboardDiagram
          low={48}
          high={84}
          marks={held}
          label="On-screen keyboard, C3 to C6"
          onNote={(type, midi, t) => input.screenNote(type, midi, t)}
        />
      </div>
      <section aria-labelledby="log-heading">
        <h2 id="log-heading" className="text-lead font-bold">
          Last notes
        </h2>
        {events.length === 0 ? (
          <p className="mt-2 text-muted">Nothing yet.</p>
        ) : (
          <DataTable
            className="mt-2"
            data={events}
            columns={columns}
            getRowId={(e, i) => `${e.timeStamp}-${i}`}
            caption="Last notes, newest first"
            testId="note-log"
            rowProps={(e) => ({
              'data-midi': e.midi,
              'data-type': e.type,
              'data-time': e.timeStamp,
              'data-source': e.source,
            })}
          />
        )}
      </section>
    </div>
  );
}
