import { Link } from 'react-router-dom';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';
import { AuthPage } from './auth-page';

export function ForgotPasswordRoute() {
  return (
    <AuthPage
      eyebrow="Password"
      title="Forgot your password?"
      lead="Give us your e-mail and we'll send a link to choose a new one."
    >
      <ForgotPasswordForm />
      <p className="mt-4 text-caption">
        <Link to="/sign-in" className="font-semibold text-ink-500 underline dark:text-brass-300">
          Back to sign-in
        </Link>
      </p>
    </AuthPage>
  );
}
