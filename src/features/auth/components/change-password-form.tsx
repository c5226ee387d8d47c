import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { useChangePassword } from '../api/account';

const empty = { currentPassword: '', newPassword: '' };

export function ChangePasswordForm() {
  const [saved, setSaved] = useState(false);
  const form = useSchemaForm(() => import('@shared/schemas/auth').then((m) => m.ChangePasswordInput), {
    defaultValues: empty,
  });
  const change = useChangePassword();

  const submit = form.handleSubmit((input) => {
    setSaved(false);
    change.mutate(input, {
      onSuccess: () => {
        setSaved(true);
        form.reset(empty);
      },
      onError: form.fromError,
    });
  });

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Change password">
      {saved ? (
        <FormMessage tone="success">Password changed. Other browsers signed in as you were signed out.</FormMessage>
      ) : null}
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        errors={form.errorsOf('currentPassword')}
        {...form.register('currentPassword')}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 8 characters."
        errors={form.errorsOf('newPassword')}
        {...form.register('newPassword')}
      />
      <Button type="submit" disabled={change.isPending} className="justify-self-start">
        Change password
      </Button>
    </form>
  );
}
