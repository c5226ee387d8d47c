import type { User } from '@shared/schemas/auth';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { useUpdateAccount } from '../api/account';

export function AccountNameForm({ user }: { user: User }) {
  const [saved, setSaved] = useState(false);
  const form = useSchemaForm(() => import('@shared/schemas/auth').then((m) => m.UpdateAccountInput), {
    defaultValues: { name: user.name },
  });
  const update = useUpdateAccount();

  const submit = form.handleSubmit((input) => {
    setSaved(false);
    update.mutate(input, { onSuccess: () => setSaved(true), onError: form.fromError });
  });

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Your name">
      {saved ? <FormMessage tone="success">Saved.</FormMessage> : null}
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      <TextField label="Name" autoComplete="name" errors={form.errorsOf('name')} {...form.register('name')} />
      <p className="text-caption text-muted">Your e-mail is {user.email}; your teacher and studio see this name.</p>
      <Button type="submit" disabled={update.isPending} className="justify-self-start">
        Save name
      </Button>
    </form>
  );
}
