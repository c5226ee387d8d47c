import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { useAcceptInvite, useInvitePreview, useInviteSignUp } from '../api/invites';

/**
 * The page an invite link opens: whose studio it is; a signed-in player joins with one button,
 * an address without an account signs up here (and joins).
 */
export function InvitePanel({
  token,
  signedInAs,
}: {
  token: string;
  signedInAs: { name: string; role: string } | null;
}) {
  const preview = useInvitePreview(token);
  const accept = useAcceptInvite(token);
  const signUp = useInviteSignUp(token, preview.data?.invite.studio.id ?? '');
  const form = useSchemaForm(() => import('@shared/schemas/studios').then((m) => m.InviteSignUpInput), {
    defaultValues: { name: '', password: '' },
  });

  if (!token)
    return <FormMessage tone="error">This link is missing its token; open it from the e-mail again.</FormMessage>;
  if (preview.isPending) return <p className="text-muted">Reading the invite…</p>;
  if (preview.error) return <FormMessage tone="error">{preview.error.message}</FormMessage>;
  const { invite } = preview.data;
  const joined = accept.data?.studio.studioId;
  const onSignUp = form.handleSubmit((input) => signUp.mutate(input, { onError: form.fromError }));
  const next = encodeURIComponent(`/invite?token=${token}`);
  return (
    <Card className="grid max-w-xl gap-4">
      <h1 className="text-title">Join {invite.studio.name}</h1>
      <p className="text-muted">
        {invite.teacher.name} invites {invite.email} to their studio on Sixfold: the drills they set show up on your
        home page, and they can leave remarks on your takes.
      </p>
      {joined ? (
        <FormMessage tone="success">
          You're in.{' '}
          <Link to={`/studio/${joined}`} className="underline">
            Open the studio
          </Link>
        </FormMessage>
      ) : signedInAs ? (
        <div className="grid gap-2">
          <p>Signed in as {signedInAs.name}.</p>
          <Button onClick={() => accept.mutate()} disabled={accept.isPending}>
            Join the studio
          </Button>
          {accept.error ? <FormMessage tone="error">{accept.error.message}</FormMessage> : null}
        </div>
      ) : invite.accountExists ? (
        <p>
          An account uses {invite.email}:{' '}
          <Link to={`/sign-in?next=${next}`} className="underline">
            sign in
          </Link>{' '}
          and come back to this link to join.
        </p>
      ) : (
        <form onSubmit={onSignUp} className="grid gap-3" noValidate aria-label="Sign up and join">
          <TextField label="E-mail" value={invite.email} readOnly />
          <TextField label="Your name" errors={form.errorsOf('name')} autoComplete="name" {...form.register('name')} />
          <TextField
            label="Choose a password"
            type="password"
            autoComplete="new-password"
            hint="At least 8 characters"
            errors={form.errorsOf('password')}
            {...form.register('password')}
          />
          <Button type="submit" disabled={signUp.isPending}>
            Sign up and join
          </Button>
          {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
        </form>
      )}
    </Card>
  );
}
