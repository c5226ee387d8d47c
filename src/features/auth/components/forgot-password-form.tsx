import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { useRequestPasswordReset } from '../api/password-reset';

export function ForgotPasswordForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const form = useSchemaForm(() => import('@shared/schemas/auth').then((m) => m.PasswordResetInput), {
    defaultValues: { email: '' },
  });
  const request = useRequestPasswordReset();
  const submit = form.handleSubmit((input) =>
    request.mutate(input, { onSuccess: () => setSentTo(input.email), onError: form.fromError }),
  );

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Ask for a reset link">
      {sentTo ? (
        <FormMessage tone="success">
          If an account uses {sentTo}, a link to choose a new password is on its way. It works once, within the hour.
        </FormMessage>
      ) : null}
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        errors={form.errorsOf('email')}
        {...form.register('email')}
      />
      <Button type="submit" disabled={request.isPending}>
        {request.isPending ? 'Sending…' : 'Send me a link'}
      </Button>
    </form>
  );
}
