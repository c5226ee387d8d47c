import { PasswordResetConfirmInput } from '@shared/schemas/auth';
import { type FormEvent, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useConfirmPasswordReset } from '../api/password-reset';
import { useFormErrors } from '../hooks/use-form-errors';

export function ResetPasswordForm({ token }: { token: string }) {
  const [password, setPassword] = useState('');
  const [done, setDone] = useState(false);
  const { fields, formError, check, fromError } = useFormErrors(PasswordResetConfirmInput);
  const confirm = useConfirmPasswordReset();

  function submit(e: FormEvent) {
    e.preventDefault();
    const input = check({ token, password });
    if (!input) return;
    confirm.mutate(input, { onSuccess: () => setDone(true), onError: fromError });
  }

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
      {formError ? <FormMessage tone="error">{formError}</FormMessage> : null}
      {fields.token ? (
        <FormMessage tone="error">
          {fields.token.join(' ')}{' '}
          <Link to="/forgot-password" className="underline">
            Ask for a new link
          </Link>
        </FormMessage>
      ) : null}
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint="At least 8 characters."
        value={password}
        errors={fields.password}
        onChange={(e) => setPassword(e.target.value)}
      />
      <Button type="submit" disabled={confirm.isPending}>
        {confirm.isPending ? 'Saving…' : 'Set new password'}
      </Button>
    </form>
  );
}
