import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { RadioField } from '@/components/ui/check-field';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { useSignUp } from '../api/sign-up';

const roles = [
  { value: 'player', title: 'I practise', text: 'Drill pairs, play takes, watch the maps fill in.' },
  { value: 'teacher', title: 'I teach', text: 'Run a studio, set assignments, leave remarks on takes.' },
] as const;

export function SignUpForm({ onSignedUp }: { onSignedUp: () => void }) {
  const form = useSchemaForm(() => import('@shared/schemas/auth').then((m) => m.SignUpInput), {
    defaultValues: { name: '', email: '', password: '', role: 'player' },
  });
  const role = form.watch('role');
  const roleErrors = form.errorsOf('role');
  const signUp = useSignUp();
  const submit = form.handleSubmit((input) => signUp.mutate(input, { onSuccess: onSignedUp, onError: form.fromError }));

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Create an account">
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      <TextField label="Your name" autoComplete="name" errors={form.errorsOf('name')} {...form.register('name')} />
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        errors={form.errorsOf('email')}
        {...form.register('email')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 8 characters; a short phrase is easy to remember."
        errors={form.errorsOf('password')}
        {...form.register('password')}
      />
      <fieldset className="grid gap-2" aria-describedby={roleErrors ? 'role-error' : undefined}>
        <legend className="mb-1 text-body font-semibold">How will you use Sixfold?</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          {roles.map((r) => (
            <RadioField
              key={r.value}
              value={r.value}
              labelClassName={`flex cursor-pointer gap-3 rounded-lg border p-3 ${role === r.value ? 'border-brass-500 bg-brass-100/40 dark:bg-ink-700' : 'border-line'}`}
              label={
                <span>
                  <span className="block font-bold">{r.title}</span>
                  <span className="text-caption text-muted">{r.text}</span>
                </span>
              }
              {...form.register('role')}
            />
          ))}
        </div>
        {roleErrors ? (
          <p id="role-error" className="text-caption font-semibold text-ember-700 dark:text-ember-100">
            {roleErrors.join(' ')}
          </p>
        ) : null}
      </fieldset>
      <Button type="submit" disabled={signUp.isPending}>
        {signUp.isPending ? 'Creating your account…' : 'Create account'}
      </Button>
      <p className="text-caption">
        Already have an account?{' '}
        <Link to="/sign-in" className="font-semibold text-ink-500 underline dark:text-brass-300">
          Sign in
        </Link>
      </p>
    </form>
  );
}
