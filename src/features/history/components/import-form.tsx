import { PRESET_IDS } from '@shared/engine';
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { FileField } from '@/components/ui/file-field';
import { FormMessage } from '@/components/ui/form-message';
import { NumberField } from '@/components/ui/number-field';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useImportTake } from '../api/takes';

const PATTERNS = PRESET_IDS.map((p) => ({ value: p, label: p }));

/** An empty box is "not given"; anything else is read as a number (the schema judges it). */
const optionalNumber = (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v));

/** A take recorded in other software: the file, the drill it was played from, the downbeat. */
export function ImportForm() {
  const [progress, setProgress] = useState<number | null>(null);
  const importTake = useImportTake();
  const navigate = useNavigate();
  // The field names follow the request (spec.pair.0, spec.tempo, offsetMs), so the server's
  // 400 lands on the same inputs.
  const form = useSchemaForm(() => import('@shared/schemas/history').then((m) => m.ImportTakeInput), {
    defaultValues: {
      file: undefined,
      spec: { pair: ['D', 'C'], pattern: 'four-three', direction: 'up', tempo: 100 },
      offsetMs: undefined,
    },
  });
  const submit = form.handleSubmit(({ file, spec, offsetMs }) => {
    setProgress(0);
    importTake.mutate(
      { file, spec, offsetMs, onProgress: setProgress },
      {
        onSuccess: ({ take }) => navigate(`/history/${take.id}`),
        onError: form.fromError,
        onSettled: () => setProgress(null),
      },
    );
  });
  return (
    <form className="grid gap-3 md:grid-cols-3" aria-label="Import a MIDI file" onSubmit={submit} noValidate>
      <FileField
        label="MIDI file (at most 1 MB)"
        name="file"
        accept=".mid,.midi,audio/midi"
        required
        className="md:col-span-3"
        errors={form.errorsOf('file')}
        onChange={(e) =>
          form.setValue('file', e.target.files?.[0] as File, { shouldValidate: form.formState.isSubmitted })
        }
      />
      <TextField
        label="First triad"
        required
        errors={form.errorsOf('spec.pair.0') ?? form.errorsOf('spec.pair')}
        {...form.register('spec.pair.0')}
      />
      <TextField
        label="Second triad"
        required
        errors={form.errorsOf('spec.pair.1')}
        {...form.register('spec.pair.1')}
      />
      <SelectField
        label="Pattern"
        options={PATTERNS}
        errors={form.errorsOf('spec.pattern')}
        {...form.register('spec.pattern')}
      />
      <NumberField
        label="Tempo"
        min={20}
        max={400}
        errors={form.errorsOf('spec.tempo')}
        {...form.register('spec.tempo', { setValueAs: optionalNumber })}
      />
      <NumberField
        label="First downbeat at (ms into the file; empty: on the first note)"
        className="md:col-span-2"
        errors={form.errorsOf('offsetMs')}
        {...form.register('offsetMs', { setValueAs: optionalNumber })}
      />
      <div className="flex items-center gap-3 md:col-span-3">
        <Button type="submit" disabled={importTake.isPending}>
          Import and score
        </Button>
        {progress !== null ? <progress max={1} value={progress} aria-label="Upload progress" /> : null}
      </div>
      {form.formError ? (
        <div className="md:col-span-3">
          <FormMessage tone="error">{form.formError}</FormMessage>
        </div>
      ) : null}
    </form>
  );
}
