import { UpdateAccountInput, type User } from '@shared/schemas/auth';
import { type FormEvent, useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useUpdateAccount } from '../api/account';
import { useFormErrors } from '../hooks/use-form-errors';

export function AccountNameForm({ user }: { user: User }) {
  const [name, setName] = useState(user.name);
  const [saved, setSaved] = useState(false);
  const { fields, formError, check, fromError } = useFormErrors(UpdateAccountInput);
  const update = useUpdateAccount();

  function submit(e: FormEvent) {
    e.preventDefault();
    setSaved(false);
    const input = check({ name });
    if (!input) return;
    update.mutate(input, { onSuccess: () => setSaved(true), onError: fromError });
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Your name">
      {saved ? <FormMessage tone="success">Saved.</FormMessage> : null}
      {formError ? <FormMessage tone="error">{formError}</FormMessage> : null}
      <TextField
        label="Name"
        name="name"
        autoComplete="name"
        value={name}
        errors={fields.name}
        onChange={(e) => setName(e.target.value)}
      />
      <p className="text-caption text-muted">Your e-mail is {user.email}; your teacher and studio see this name.</p>
      <Button type="submit" disabled={update.isPending} className="justify-self-start">
        Save name
      </Button>
    </form>
  );
}
