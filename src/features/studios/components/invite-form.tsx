import { type FormEvent, useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { useCreateInvite, useInvites } from '../api/invites';
import { formatDue } from '@/lib/format-date';

/** Invite a player by e-mail, and the invites still waiting for an answer. */
export function InviteForm({ studioId }: { studioId: string }) {
  const invite = useCreateInvite(studioId);
  const pending = useInvites(studioId);
  const [email, setEmail] = useState('');
  const [sentTo, setSentTo] = useState<string | null>(null);
  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    invite.mutate(
      { email },
      {
        onSuccess: (res) => {
          setSentTo(res.invite.email);
          setEmail('');
        },
      },
    );
  };
  const err = invite.error instanceof ApiError ? invite.error : null;
  return (
    <div className="grid gap-3">
      <form onSubmit={onSubmit} className="flex flex-wrap items-end gap-3" noValidate aria-label="Invite a player">
        <TextField
          label="Player's e-mail"
          type="email"
          value={email}
          onChange={(e) => setEmail(e.target.value)}
          errors={err?.fields?.email}
        />
        <Button type="submit" disabled={invite.isPending}>
          Send invite
        </Button>
      </form>
      {sentTo ? (
        <FormMessage tone="success">Invite sent to {sentTo}. The link works once, for 7 days.</FormMessage>
      ) : null}
      {err && !err.fields ? <FormMessage tone="error">{err.message}</FormMessage> : null}
      {pending.data && pending.data.invites.length > 0 ? (
        <p className="text-caption text-muted">
          Waiting: {pending.data.invites.map((i) => `${i.email} (until ${formatDue(i.expiresAt)})`).join(', ')}
        </p>
      ) : null}
    </div>
  );
}
