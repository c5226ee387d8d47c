import { SignInInput } from '@shared/schemas/auth';
import { type FormEvent, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useSignIn } from '../api/sign-in';
import { useFormErrors } from '../hooks/use-form-errors';

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const [values, setValues] = useState({ email: '', password: '' });
  const { fields, formError, check, fromError } = useFormErrors(SignInInput);
  const signIn = useSignIn();

  function submit(e: FormEvent) {
    e.preventDefault();
    const input = check(values);
    if (!input) return;
    signIn.mutate(input, { onSuccess: onSignedIn, onError: fromError });
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Sign in">
      {formError ? <FormMessage tone="error">{formError}</FormMessage> : null}
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        value={values.email}
        errors={fields.email}
        onChange={(e) => setValues({ ...values, email: e.target.value })}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        value={values.password}
        errors={fields.password}
        onChange={(e) => setValues({ ...values, password: e.target.value })}
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
