import { SignUpInput } from '@shared/schemas/auth';
import { type FormEvent, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useSignUp } from '../api/sign-up';
import { useFormErrors } from '../hooks/use-form-errors';

const roles = [
  { value: 'player', title: 'I practise', text: 'Drill pairs, play takes, watch the maps fill in.' },
  { value: 'teacher', title: 'I teach', text: 'Run a studio, set assignments, leave remarks on takes.' },
] as const;

export function SignUpForm({ onSignedUp }: { onSignedUp: () => void }) {
  const [values, setValues] = useState({ name: '', email: '', password: '', role: 'player' as 'player' | 'teacher' });
  const { fields, formError, check, fromError } = useFormErrors(SignUpInput);
  const signUp = useSignUp();

  function submit(e: FormEvent) {
    e.preventDefault();
    const input = check(values);
    if (!input) return;
    signUp.mutate(input, { onSuccess: onSignedUp, onError: fromError });
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4" aria-label="Create an account">
      {formError ? <FormMessage tone="error">{formError}</FormMessage> : null}
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        value={values.name}
        errors={fields.name}
        onChange={(e) => setValues({ ...values, name: e.target.value })}
      />
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
        autoComplete="new-password"
        hint="At least 8 characters; a short phrase is easy to remember."
        value={values.password}
        errors={fields.password}
        onChange={(e) => setValues({ ...values, password: e.target.value })}
      />
      <fieldset className="grid gap-2" aria-describedby={fields.role ? 'role-error' : undefined}>
        <legend className="mb-1 text-body font-semibold">How will you use Sixfold?</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          {roles.map((r) => (
            <label
              key={r.value}
              className={`flex cursor-pointer gap-3 rounded-lg border p-3 ${values.role === r.value ? 'border-brass-500 bg-brass-100/40 dark:bg-ink-700' : 'border-line'}`}
            >
              <input
                type="radio"
                name="role"
                value={r.value}
                checked={values.role === r.value}
                onChange={() => setValues({ ...values, role: r.value })}
                className="mt-1"
              />
              <span>
                <span className="block font-bold">{r.title}</span>
                <span className="text-caption text-muted">{r.text}</span>
              </span>
            </label>
          ))}
        </div>
        {fields.role ? (
          <p id="role-error" className="text-caption font-semibold text-ember-700 dark:text-ember-100">
            {fields.role.join(' ')}
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
