import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { useConfirmPasswordReset } from '../api/password-reset';

export function ResetPasswordForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const form = useSchemaForm(() => import('@shared/schemas/auth').then((m) => m.PasswordResetConfirmInput), {
    defaultValues: { token, password: '' },
  });
  const tokenErrors = form.errorsOf('token');
  const confirm = useConfirmPasswordReset();
  const submit = form.handleSubmit((input) =>
    confirm.mutate(input, { onSuccess: () => setDone(true), onError: form.fromError }),
  );

  if (done) {
    return (
      <div className="grid gap-4">
        <FormMessage tone="success">Your new password is set. Every other session was signed out.</FormMessage>
        <Link
          to="/sign-in"
          className="rounded-lg bg-ink-800 px-4 py-2 text-center font-semibold text-white dark:bg-brass-300 dark:text-ink-950"
        >
          Sign in
        </Link>
      </div>
    );
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Choose a new password">
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      {tokenErrors ? (
        <FormMessage tone="error">
          {tokenErrors.join(' ')}{' '}
          <Link to="/forgot-password" className="underline">
            Ask for a new link
          </Link>
        </FormMessage>
      ) : null}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 8 characters."
        errors={form.errorsOf('password')}
        {...form.register('password')}
      />
      <Button type="submit" disabled={confirm.isPending}>
        {confirm.isPending ? 'Saving…' : 'Set new password'}
      </Button>
    </form>
  );
}
