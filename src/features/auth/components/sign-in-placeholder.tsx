import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';

/**
 * The sign-in form as it looks, shown while the form kit (react-hook-form) loads, so the first
 * page a visitor opens paints without waiting for it. Its fields take no input until the real
 * form replaces it, a moment later.
 */
export function SignInPlaceholder() {
  return (
    <div className="grid gap-4" aria-busy="true">
      <TextField label="E-mail" type="email" disabled />
      <TextField label="Password" type="password" disabled />
      <Button type="button" disabled>
        Sign in
      </Button>
    </div>
  );
}
