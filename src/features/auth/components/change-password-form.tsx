import { ChangePasswordInput } from '@shared/schemas/auth';
import { type FormEvent, useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useChangePassword } from '../api/account';
import { useFormErrors } from '../hooks/use-form-errors';

const empty = { currentPassword: '', newPassword: '' };

export function ChangePasswordForm() {
  const [values, setValues] = useState(empty);
  const [saved, setSaved] = useState(false);
  const { fields, formError, check, fromError } = useFormErrors(ChangePasswordInput);
  const change = useChangePassword();

  function submit(e: FormEvent) {
    e.preventDefault();
    setSaved(false);
    const input = check(values);
    if (!input) return;
    change.mutate(input, {
      onSuccess: () => {
        setSaved(true);
        setValues(empty);
      },
      onError: fromError,
    });
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Change password">
      {saved ? (
        <FormMessage tone="success">Password changed. Other browsers signed in as you were signed out.</FormMessage>
      ) : null}
      {formError ? <FormMessage tone="error">{formError}</FormMessage> : null}
      <TextField
        label="Current password"
        name="currentPassword"
        type="password"
        autoComplete="current-password"
        value={values.currentPassword}
        errors={fields.currentPassword}
        onChange={(e) => setValues({ ...values, currentPassword: e.target.value })}
      />
      <TextField
        label="New password"
        name="newPassword"
        type="password"
        autoComplete="new-password"
        hint="At least 8 characters."
        value={values.newPassword}
        errors={fields.newPassword}
        onChange={(e) => setValues({ ...values, newPassword: e.target.value })}
      />
      <Button type="submit" disabled={change.isPending} className="justify-self-start">
        Change password
      </Button>
    </form>
  );
}
