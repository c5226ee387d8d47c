import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { useSignIn } from '../api/sign-in';

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const form = useSchemaForm(() => import('@shared/schemas/auth').then((m) => m.SignInInput), {
    defaultValues: { email: '', password: '' },
  });
  const signIn = useSignIn();
  const submit = form.handleSubmit((input) => signIn.mutate(input, { onSuccess: onSignedIn, onError: form.fromError }));

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Sign in">
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
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
        autoComplete="current-password"
        errors={form.errorsOf('password')}
        {...form.register('password')}
      />
      <Button type="submit" disabled={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
      <p className="flex flex-wrap justify-between gap-2 text-caption">
        <Link to="/forgot-password" className="font-semibold text-ink-500 underline dark:text-brass-300">
          Forgot your password?
        </Link>
        <Link to="/sign-up" className="font-semibold text-ink-500 underline dark:text-brass-300">
          New here? Create an account
        </Link>
      </p>
    </form>
  );
}
