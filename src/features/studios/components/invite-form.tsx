import { useState } from 'react';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useCreateInvite, useInvites } from '../api/invites';
import { formatDue } from '@/lib/format-date';

/** Invite a player by e-mail, and the invites still waiting for an answer. */
export function InviteForm({ studioId }: { studioId: string }) {
  const invite = useCreateInvite(studioId);
  const pending = useInvites(studioId);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const form = useSchemaForm(() => import('@shared/schemas/studios').then((m) => m.CreateInviteInput), {
    defaultValues: { email: '' },
  });
  const onSubmit = form.handleSubmit((input) =>
    invite.mutate(input, {
      onSuccess: (res) => {
        setSentTo(res.invite.email);
        form.reset({ email: '' });
      },
      onError: form.fromError,
    }),
  );
  return (
    <div className="grid gap-3">
      <form onSubmit={onSubmit} className="flex flex-wrap items-end gap-3" noValidate aria-label="Invite a player">
        <TextField label="Player's e-mail" type="email" errors={form.errorsOf('email')} {...form.register('email')} />
        <Button type="submit" disabled={invite.isPending}>
          Send invite
        </Button>
      </form>
      {sentTo ? (
        <FormMessage tone="success">Invite sent to {sentTo}. The link works once, for 7 days.</FormMessage>
      ) : null}
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      {pending.data && pending.data.invites.length > 0 ? (
        <p className="text-caption text-muted">
          Waiting: {pending.data.invites.map((i) => `${i.email} (until ${formatDue(i.expiresAt)})`).join(', ')}
        </p>
      ) : null}
    </div>
  );
}
