import { PasswordResetInput } from '@shared/schemas/auth';
import { type FormEvent, useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useRequestPasswordReset } from '../api/password-reset';
import { useFormErrors } from '../hooks/use-form-errors';

export function ForgotPasswordForm() {
  const [email, setEmail] = useState('');
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { fields, formError, check, fromError } = useFormErrors(PasswordResetInput);
  const request = useRequestPasswordReset();

  function submit(e: FormEvent) {
    e.preventDefault();
    const input = check({ email });
    if (!input) return;
    request.mutate(input, { onSuccess: () => setSentTo(input.email), onError: fromError });
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Ask for a reset link">
      {sentTo ? (
        <FormMessage tone="success">
          If an account uses {sentTo}, a link to choose a new password is on its way. It works once, within the hour.
        </FormMessage>
      ) : null}
      {formError ? <FormMessage tone="error">{formError}</FormMessage> : null}
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        value={email}
        errors={fields.email}
        onChange={(e) => setEmail(e.target.value)}
      />
      <Button type="submit" disabled={request.isPending}>
        {request.isPending ? 'Sending…' : 'Send me a link'}
      </Button>
    </form>
  );
}
