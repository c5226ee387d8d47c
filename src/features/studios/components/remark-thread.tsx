import type { DrillNote } from '@shared/engine';
import type { Remark } from '@shared/schemas/remarks';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextAreaField } from '@/components/ui/text-area-field';
import { useCreateRemark } from '../api/remarks';
import { formatDateTime } from '@/lib/format-date';

export const noteLabel = (notes: DrillNote[], i: number) => {
  const n = notes[i];
  return n ? `note ${i + 1} (${n.written}, measure ${n.measure})` : `note ${i + 1}`;
};

function Reply({ takeId, parentId }: { takeId: string; parentId: string }) {
  const create = useCreateRemark(takeId);
  const form = useSchemaForm(() => import('@shared/schemas/remarks').then((m) => m.CreateRemarkInput), {
    defaultValues: { body: '' },
  });
  const body = form.watch('body') ?? '';
  const onSubmit = form.handleSubmit((input) =>
    create.mutate({ ...input, parentId }, { onSuccess: () => form.reset({ body: '' }), onError: form.fromError }),
  );
  return (
    <form onSubmit={onSubmit} className="mt-2 flex flex-wrap items-end gap-2" aria-label="Answer">
      <TextAreaField
        label="Your answer"
        className="flex-1"
        rows={2}
        errors={form.errorsOf('body')}
        {...form.register('body')}
      />
      <Button type="submit" variant="quiet" disabled={create.isPending || !body.trim()}>
        Send answer
      </Button>
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
    </form>
  );
}

/** The remarks on a take, each with its answers; the player may answer. */
export function RemarkThread({
  takeId,
  remarks,
  notes,
  canAnswer,
  highlight,
}: {
  takeId: string;
  remarks: Remark[];
  notes: DrillNote[];
  canAnswer: boolean;
  /** the note chosen on the page: its remarks are marked */
  highlight?: number | null;
}) {
  const top = remarks.filter((r) => !r.parentId);
  if (top.length === 0) return <p className="text-muted">No remarks on this take yet.</p>;
  return (
    <ol className="grid gap-3" data-testid="remarks">
      {top.map((r) => (
        <li
          key={r.id}
          className={`rounded-card border bg-raised p-4 ${
            highlight !== null && highlight !== undefined && r.noteIndex === highlight
              ? 'border-dusk-500 ring-2 ring-dusk-500/40'
              : 'border-line'
          }`}
          data-note-index={r.noteIndex ?? undefined}
        >
          <p className="text-caption text-muted">
            {r.author.name} · {formatDateTime(r.createdAt)}
            {r.noteIndex !== null ? (
              <span className="ml-2 font-semibold text-dusk-700 dark:text-dusk-100">
                pinned to {noteLabel(notes, r.noteIndex)}
              </span>
            ) : null}
          </p>
          <p className="mt-1 whitespace-pre-wrap">{r.body}</p>
          <ul className="mt-2 grid gap-2 border-l-2 border-line pl-3">
            {remarks
              .filter((a) => a.parentId === r.id)
              .map((a) => (
                <li key={a.id}>
                  <p className="text-caption text-muted">
                    {a.author.name} · {formatDateTime(a.createdAt)}
                  </p>
                  <p className="whitespace-pre-wrap">{a.body}</p>
                </li>
              ))}
          </ul>
          {canAnswer ? <Reply takeId={takeId} parentId={r.id} /> : null}
        </li>
      ))}
    </ol>
  );
}
